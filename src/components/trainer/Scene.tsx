import { useMemo } from 'react';
import type { Stage } from '~/lib/procedure/schema';
import { useTrainer, useTrainerStore } from './context';
import { Assembly } from './scene/Assembly';
import { buildLayout, homeView } from './scene/layout';
import { SceneApiHook } from './scene/SceneApi';
import { Viewport } from './scene/Viewport';

// The 3D view of the trainer, in the Viewport (canvas, lights, camera controls) it shares with rework
// questions. What is drawn and what a pointer does live in scene/; everything here also works from the lists beside it, so the canvas is optional.

const HINTS: Record<Stage, string> = {
  order: 'Drag to turn the view, scroll or pinch to zoom. Point at a part to name it; click or tap a part to place its steps. Each step you place brings its parts home.',
  pins: 'Pick a pin or sleeve from the tray, then a hole. Threaded holes show ridges, locating holes a plain collar.',
  pattern: 'Tap the bolts in the order you would tighten them; the numbers show the pass you are on.',
  wrench: 'Turn the view to look at the joint; the wrench setting goes in the panel.',
  'final-check': 'Drag sideways on the crankshaft or flywheel to turn it.',
};

export default function Scene() {
  const store = useTrainerStore();
  const procedure = useTrainer((s) => s.procedure);
  const stage = useTrainer((s) => s.stage);
  const layout = useMemo(() => buildLayout(procedure), [procedure]);
  const home = useMemo(() => homeView(layout), [layout]);

  return (
    <Viewport
      home={home}
      testId="scene"
      sizeClass="h-[24rem] sm:h-[32rem]"
      label={`3D view of ${procedure.engine.name}: ${procedure.title}`}
      fallback={<p className="p-4 text-sm">The 3D view needs WebGL. Every stage also works from the lists.</p>}
      hint={HINTS[stage]}
      // A click on empty space puts down whatever was picked out.
      onPointerMissed={() => store.getState().setHovered(null)}
    >
      <Assembly layout={layout} />
      <SceneApiHook layout={layout} />
    </Viewport>
  );
}
