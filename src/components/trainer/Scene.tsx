import { useMemo, useRef } from 'react';
import { Canvas } from '@react-three/fiber';
import { OrbitControls } from '@react-three/drei';
import { Vector3 } from 'three';
import type { OrbitControls as OrbitControlsImpl } from 'three-stdlib';
import type { Stage } from '~/lib/procedure/schema';
import { useTrainer, useTrainerStore } from './context';
import { Assembly } from './scene/Assembly';
import { buildLayout, homeView } from './scene/layout';
import { SceneApiHook } from './scene/SceneApi';

// The 3D view of the trainer: canvas, lights and camera controls. What is drawn and what a pointer
// does live in scene/; everything here also works from the lists beside it, so the canvas is optional.

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
  const controls = useRef<OrbitControlsImpl>(null);
  const distance = home.position.distanceTo(home.target);
  // Key light from over the learner's shoulder, so the faces the camera sees first are lit.
  const keyLight = useMemo(
    () => home.position.clone().sub(home.target).normalize().add(new Vector3(0.3, 0.8, 0)).add(home.target).toArray(),
    [home],
  );

  const resetView = () => {
    const c = controls.current;
    if (!c) return;
    c.object.position.copy(home.position);
    c.target.copy(home.target);
    // update() dispatches 'change', which asks the on-demand canvas for a new frame.
    c.update();
  };

  return (
    <div className="flex flex-col gap-2">
      <div
        data-testid="scene"
        className="relative h-[24rem] overflow-hidden rounded-xl border border-steel-200 bg-gradient-to-b from-steel-100 to-steel-300 sm:h-[32rem]"
      >
        <Canvas
          frameloop="demand"
          flat
          dpr={[1, 1.5]}
          camera={{ position: home.position.toArray(), fov: home.fov, near: 0.01, far: 20 }}
          fallback={<p className="p-4 text-sm">The 3D view needs WebGL. Every stage also works from the lists.</p>}
          aria-label={`3D view of ${procedure.engine.name}: ${procedure.title}`}
          // A click on empty space puts down whatever was picked out.
          onPointerMissed={() => store.getState().setHovered(null)}
        >
          <hemisphereLight args={['#ffffff', '#9db3c2', 2]} />
          <directionalLight position={keyLight} intensity={2} />
          <OrbitControls
            ref={controls}
            makeDefault
            target={home.target.toArray()}
            enableDamping={false}
            minDistance={distance * 0.2}
            maxDistance={distance * 3}
          />
          <Assembly layout={layout} />
          <SceneApiHook layout={layout} />
        </Canvas>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn-quiet" onClick={resetView}>
          Reset view
        </button>
        <p className="text-sm text-steel-600">{HINTS[stage]}</p>
      </div>
    </div>
  );
}
