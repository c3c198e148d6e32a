import { useEffect, useRef } from 'react';
import type { Stage } from '../../lib/procedure/schema';
import { useTrainer } from './context';
import { STAGE_LABELS } from './labels';
import { stageTabId } from './StageTabs';
import { ResultLine } from '../ResultLine';

// The server's verdict on a stage, line by line in words; the scene marks the same lines on the model.

export function Feedback({ stage }: { stage: Stage }) {
  const result = useTrainer((s) => s.results[stage]);
  const steps = useTrainer((s) => s.procedure.steps);
  const stages = useTrainer((s) => s.procedure.stages);
  const resetStage = useTrainer((s) => s.resetStage);
  const setStage = useTrainer((s) => s.setStage);
  const heading = useRef<HTMLHeadingElement>(null);

  // A new verdict takes keyboard focus so the learner reads it next; one already shown (coming back
  // to the tab) does not, or arrow keys in the tab list would lose their place.
  const shown = useRef(result?.id);
  useEffect(() => {
    if (!result || result.id === shown.current) return;
    shown.current = result.id;
    heading.current?.focus();
  }, [result?.id]);

  if (!result) return null;
  const next = stages[stages.indexOf(stage) + 1];
  const stepText = (key: string) => steps.find((s) => s.key === key)?.text;

  const goNext = () => {
    if (!next) return;
    setStage(next);
    document.getElementById(stageTabId(next))?.focus();
  };

  return (
    <section
      aria-labelledby={`feedback-${stage}`}
      className={`mt-4 rounded-xl border-2 p-4 ${result.passed ? 'border-go-500 bg-go-50' : 'border-signal-500 bg-signal-50'}`}
    >
      <h3 id={`feedback-${stage}`} ref={heading} tabIndex={-1} className="flex flex-wrap items-baseline gap-x-3 text-xl font-bold">
        <span className={result.passed ? 'text-go-700' : 'text-signal-700'}>
          <span aria-hidden="true">{result.passed ? '✓ ' : '✗ '}</span>
          {result.passed ? 'Passed' : 'Not yet'}
        </span>
        <span className="text-steel-900">
          {result.score} of {result.maxScore}
        </span>
      </h3>

      <ul className="mt-3 space-y-2" aria-label={`${STAGE_LABELS[stage]} results`}>
        {result.results.map((line, i) => {
          // Order lines name their step; the server usually quotes it already (without the full stop).
          const full = stage === 'order' ? stepText(line.key) : undefined;
          const text = full && !line.message.includes(full.replace(/\.$/, '')) ? full : undefined;
          return (
            <ResultLine key={`${line.key}-${i}`} ok={line.ok} className="rounded-lg bg-white/70 p-2" markClass="mt-0.5 font-bold">
              {text && <span className="block font-semibold text-steel-900">{text}</span>}
              <span className={text ? 'text-sm text-steel-700' : 'text-steel-900'}>{line.message}</span>
            </ResultLine>
          );
        })}
      </ul>

      {result.answersHidden && (
        <p className="mt-3 text-sm text-steel-700">
          This drill shows the right answers after its due date; until then each line says only whether it is
          right.
        </p>
      )}

      {result.notes.length > 0 && (
        <div className="mt-3">
          <h4 className="text-sm font-semibold text-steel-700">Notes</h4>
          <ul className="mt-1 list-disc space-y-1 pl-5 text-sm text-steel-800">
            {result.notes.map((note, i) => (
              <li key={i}>{note}</li>
            ))}
          </ul>
        </div>
      )}

      <div className="mt-4 flex flex-wrap gap-3">
        <button type="button" className="btn-quiet" onClick={() => resetStage(stage)}>
          Try again
        </button>
        {result.passed && next && (
          <button type="button" className="btn-primary" onClick={goNext}>
            Next stage: {STAGE_LABELS[next]} <span aria-hidden="true">→</span>
          </button>
        )}
      </div>
    </section>
  );
}
