import { Suspense, lazy, useEffect, useMemo, useRef, useState, type ComponentType, type LazyExoticComponent, type ReactNode } from 'react';
import { SceneBoundary } from '../SceneBoundary';
import type { PublicProcedure } from '../../lib/procedure/public-view';
import type { Stage } from '../../lib/procedure/schema';
import { CheckStage } from './CheckStage';
import { TrainerContext, useTrainer } from './context';
import { DrillContext, type DrillHandle, type TrainerDrill } from './drill';
import { startDraftSync, type DraftStorage } from './draft-sync';
import { Feedback } from './Feedback';
import { STAGE_LABELS } from './labels';
import { SaveStatus } from './SaveStatus';
import { STAGE_PANEL_ID, StageTabs, stageTabId } from './StageTabs';
import { createTrainerStore } from './store';

// The trainer island: stage tabs, the 3D view beside the stage panel, and the learner's work kept
// safe as they go. Three.js and each stage's panel load only when needed.

const Scene = lazy(() => import('./Scene'));

const STAGE_PANELS = {
  order: () => import('./stages/OrderStage'),
  pins: () => import('./stages/PinsStage'),
  pattern: () => import('./stages/PatternStage'),
  wrench: () => import('./stages/WrenchStage'),
  'final-check': () => import('./stages/FinalCheckStage'),
} satisfies Record<Stage, () => Promise<{ default: ComponentType }>>;
const PANELS: Record<Stage, LazyExoticComponent<ComponentType>> = {
  order: lazy(STAGE_PANELS.order),
  pins: lazy(STAGE_PANELS.pins),
  pattern: lazy(STAGE_PANELS.pattern),
  wrench: lazy(STAGE_PANELS.wrench),
  'final-check': lazy(STAGE_PANELS['final-check']),
};

/** Side by side only when the island itself is wide enough: the page around it decides its width. */
const WIDE_PX = 900;

function browserStorage(): DraftStorage | null {
  try {
    return window.localStorage;
  } catch {
    // Storage can be switched off; the server copy still works.
    return null;
  }
}

export default function Trainer({ procedure, drill }: { procedure: PublicProcedure; drill?: TrainerDrill }) {
  const [store] = useState(() => createTrainerStore(procedure));
  const [drillState, setDrillState] = useState<TrainerDrill | null>(drill ?? null);
  const drillHandle = useMemo<DrillHandle>(
    () => ({ drill: drillState, setStanding: (stages) => setDrillState((d) => (d ? { ...d, stages } : d)) }),
    [drillState],
  );

  useEffect(() => {
    const sync = startDraftSync({ store, storage: browserStorage() });
    const saveNow = () => void sync.flush();
    const onHide = () => {
      if (document.visibilityState === 'hidden') saveNow();
    };
    window.addEventListener('pagehide', saveNow);
    document.addEventListener('visibilitychange', onHide);
    // The other stages' panels are small: fetch them while the learner reads the first one.
    const warm = window.setTimeout(() => procedure.stages.forEach((s) => void STAGE_PANELS[s]()), 1500);
    return () => {
      window.clearTimeout(warm);
      window.removeEventListener('pagehide', saveNow);
      document.removeEventListener('visibilitychange', onHide);
      sync.stop();
    };
  }, [store]);

  return (
    <TrainerContext value={store}>
      <DrillContext value={drillHandle}>
        <TrainerLayout />
      </DrillContext>
    </TrainerContext>
  );
}

function TrainerLayout() {
  const stage = useTrainer((s) => s.stage);
  const announcement = useTrainer((s) => s.announcement);
  const box = useRef<HTMLDivElement>(null);
  const [wide, setWide] = useState(false);

  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => setWide((entry?.contentRect.width ?? 0) >= WIDE_PX));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);

  const Panel = PANELS[stage];
  return (
    <div ref={box} className="space-y-4" data-testid="trainer">
      <div className="flex flex-wrap items-end justify-between gap-x-4 gap-y-2">
        <StageTabs />
        <SaveStatus />
      </div>

      <div className={wide ? 'grid grid-cols-[minmax(0,3fr)_minmax(0,2fr)] items-start gap-4' : 'space-y-4'}>
        <div className={wide ? 'sticky top-4 min-w-0 space-y-2' : 'min-w-0 space-y-2'}>
          {/* The scene sizes its own canvas and puts "Reset view" under it; the slider follows. */}
          <SceneBoundary fallback={<SceneMessage>The 3D view could not start on this device. Every stage works from the panel beside it.</SceneMessage>}>
            <Suspense fallback={<SceneMessage>Loading the 3D view…</SceneMessage>}>
              <Scene />
            </Suspense>
          </SceneBoundary>
          <ExplodeSlider />
        </div>

        <section
          id={STAGE_PANEL_ID}
          role="tabpanel"
          aria-labelledby={stageTabId(stage)}
          className="panel min-w-0"
          data-testid={`stage-panel-${stage}`}
        >
          <h2 className="mb-4 text-xl font-bold">{STAGE_LABELS[stage]}</h2>
          <Suspense fallback={<p className="text-steel-600">Loading…</p>}>
            <Panel />
          </Suspense>
          <CheckStage stage={stage} />
          <Feedback key={stage} stage={stage} />
        </section>
      </div>

      <div className="sr-only" aria-live="polite" aria-atomic="true" data-testid="announcer">
        {announcement}
      </div>
    </div>
  );
}

function ExplodeSlider() {
  const explode = useTrainer((s) => s.explode);
  const setExplode = useTrainer((s) => s.setExplode);
  return (
    <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
      <label htmlFor="explode" className="font-semibold text-steel-800">
        Exploded view
      </label>
      <span aria-hidden="true" className="text-sm text-steel-600">
        Together
      </span>
      <input
        id="explode"
        type="range"
        min={0}
        max={1}
        step={0.05}
        value={explode}
        aria-valuetext={`${Math.round(explode * 100)} % apart`}
        onChange={(e) => setExplode(Number(e.target.value))}
        className="h-12 min-w-[10rem] flex-1 accent-brass-500"
      />
      <span aria-hidden="true" className="text-sm text-steel-600">
        Apart
      </span>
    </div>
  );
}

function SceneMessage({ children }: { children: ReactNode }) {
  // Same height as the scene's canvas, so nothing jumps when it arrives.
  return (
    <div className="flex h-[24rem] items-center justify-center rounded-xl border border-steel-200 bg-steel-100 p-6 text-center text-steel-700 sm:h-[32rem]">
      {children}
    </div>
  );
}
