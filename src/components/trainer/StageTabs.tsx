import type { KeyboardEvent } from 'react';
import type { Stage } from '../../lib/procedure/schema';
import { useTrainer } from './context';
import { STAGE_LABELS } from './labels';

// One tab per stage of this procedure; a scored tab says how it went in words and an icon, not colour alone.

export const stageTabId = (stage: Stage) => `stage-tab-${stage}`;
export const STAGE_PANEL_ID = 'stage-panel';

export function StageTabs() {
  const stages = useTrainer((s) => s.procedure.stages);
  const current = useTrainer((s) => s.stage);
  const results = useTrainer((s) => s.results);
  const setStage = useTrainer((s) => s.setStage);

  // Arrow keys move between tabs (the tab list is one stop in the Tab order).
  const onKeyDown = (event: KeyboardEvent<HTMLButtonElement>, index: number) => {
    const last = stages.length - 1;
    const target =
      event.key === 'ArrowRight' ? (index === last ? 0 : index + 1)
      : event.key === 'ArrowLeft' ? (index === 0 ? last : index - 1)
      : event.key === 'Home' ? 0
      : event.key === 'End' ? last
      : null;
    if (target === null) return;
    event.preventDefault();
    const stage = stages[target]!;
    setStage(stage);
    document.getElementById(stageTabId(stage))?.focus();
  };

  return (
    <div role="tablist" aria-label="Stages" className="flex gap-2 overflow-x-auto pb-1">
      {stages.map((stage, index) => {
        const selected = stage === current;
        const result = results[stage];
        return (
          <button
            key={stage}
            id={stageTabId(stage)}
            type="button"
            role="tab"
            aria-selected={selected}
            aria-controls={STAGE_PANEL_ID}
            tabIndex={selected ? 0 : -1}
            onClick={() => setStage(stage)}
            onKeyDown={(event) => onKeyDown(event, index)}
            className={[
              'flex min-h-touch shrink-0 flex-col items-start justify-center rounded-lg border-2 px-4 py-1 text-left',
              selected ? 'border-brass-500 bg-brass-50 text-steel-950' : 'border-steel-200 bg-white text-steel-700 hover:bg-steel-100',
            ].join(' ')}
          >
            <span className="font-semibold">
              <span className="text-steel-500">{index + 1}.</span> {STAGE_LABELS[stage]}
            </span>
            {result && (
              <span className={`text-sm font-semibold ${result.passed ? 'text-go-700' : 'text-signal-700'}`}>
                <span aria-hidden="true">{result.passed ? '✓' : '✗'}</span> {result.passed ? 'Passed' : 'Not yet'} · {result.score}/{result.maxScore}
              </span>
            )}
          </button>
        );
      })}
    </div>
  );
}
