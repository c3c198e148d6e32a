import type { StepAnalysis } from '../../lib/results/class-results';
import { STAGE_LABELS } from '../trainer/labels';
import { attemptHref, formatPct } from './format';

// Steps × learners on the first try, learners from the most steps right to the fewest, the upper and
// lower groups marked. Every cell carries its symbol (✓ / ✗) and words for screen readers; the last
// column shades the share who missed the step, with its number printed in the cell.

const HEAT = [
  { upTo: 0.2, className: 'bg-white text-steel-900', label: 'under 20 %' },
  { upTo: 0.4, className: 'bg-brass-100 text-steel-900', label: '20–39 %' },
  { upTo: 0.6, className: 'bg-brass-300 text-steel-950', label: '40–59 %' },
  { upTo: 0.8, className: 'bg-signal-500 text-white', label: '60–79 %' },
  { upTo: Infinity, className: 'bg-signal-700 text-white', label: '80 % and more' },
] as const;

const heatFor = (missed: number) => HEAT.find((h) => missed < h.upTo)!;

export default function StepHeatMap({ analysis }: { analysis: StepAnalysis }) {
  const { learners, steps, groupSize } = analysis;
  const middle = learners.length - 2 * groupSize;

  return (
    <div>
      <div className="overflow-x-auto rounded-lg border border-steel-200 bg-white">
        <table className="border-collapse text-sm" data-testid="heat-map">
          <caption className="sr-only">
            First-try answers per step and learner; learners ordered from the most steps right to the fewest
          </caption>
          <thead>
            {groupSize > 0 && (
              <tr className="text-xs text-steel-700">
                <td className="sticky left-0 bg-white" />
                <th scope="colgroup" colSpan={groupSize} className="border-b-2 border-go-500 px-1 py-1 font-semibold">
                  Upper group
                </th>
                {middle > 0 && <td colSpan={middle} />}
                <th scope="colgroup" colSpan={groupSize} className="border-b-2 border-signal-500 px-1 py-1 font-semibold">
                  Lower group
                </th>
                <td />
              </tr>
            )}
            <tr>
              <th scope="col" className="sticky left-0 z-10 bg-white px-3 py-2 text-left align-bottom">
                Step
              </th>
              {learners.map((l) => (
                <th key={l.id} scope="col" className="h-36 w-9 px-0 align-bottom font-medium" title={`${l.name}: ${l.total} of ${steps.length} steps right`}>
                  <span className="mx-auto block max-h-36 overflow-hidden text-ellipsis whitespace-nowrap [writing-mode:vertical-rl] rotate-180 pb-1">
                    {l.name}
                  </span>
                </th>
              ))}
              <th scope="col" className="px-3 py-2 text-right align-bottom">
                Missed
              </th>
            </tr>
          </thead>
          <tbody>
            {steps.map((step, j) => {
              const missed = step.missed ?? 0;
              const heat = heatFor(missed);
              return (
                <tr key={`${step.stage}/${step.key}`} className="border-t border-steel-100">
                  <th scope="row" className="sticky left-0 z-10 max-w-[18rem] bg-white px-3 py-1 text-left font-normal">
                    <span className="block text-xs text-steel-600">{STAGE_LABELS[step.stage]}</span>
                    <span className="line-clamp-2" title={step.label}>
                      {step.label}
                    </span>
                  </th>
                  {learners.map((l) => {
                    const right = l.answers[j] === 1;
                    const attempt = l.firstAttempts[step.stage];
                    const words = `${l.name}: ${right ? 'right' : 'missed'} on the first try`;
                    const mark = (
                      <>
                        <span aria-hidden="true">{right ? '✓' : '✗'}</span>
                        <span className="sr-only">{words}</span>
                      </>
                    );
                    return (
                      <td
                        key={l.id}
                        title={words}
                        className={`h-9 w-9 border border-white text-center font-bold ${right ? 'bg-go-100 text-go-700' : 'bg-signal-100 text-signal-700'}`}
                      >
                        {attempt ? (
                          <a href={attemptHref(attempt)} tabIndex={-1} className="block leading-9">
                            {mark}
                          </a>
                        ) : (
                          mark
                        )}
                      </td>
                    );
                  })}
                  <td className={`whitespace-nowrap px-3 text-right font-semibold ${heat.className}`} title={`${analysis.counted - step.correct} of ${analysis.counted} missed`}>
                    {formatPct(Math.round(missed * 1000) / 10)}
                  </td>
                </tr>
              );
            })}
            <tr className="border-t-2 border-steel-300 text-xs">
              <th scope="row" className="sticky left-0 z-10 bg-white px-3 py-1 text-left">
                Steps right
              </th>
              {learners.map((l) => (
                <td key={l.id} className="text-center font-semibold">
                  {l.total}
                </td>
              ))}
              <td />
            </tr>
          </tbody>
        </table>
      </div>

      <div className="mt-3 flex flex-wrap items-center gap-x-5 gap-y-2 text-sm text-steel-700" aria-label="Legend">
        <span className="inline-flex items-center gap-1">
          <span className="inline-block h-6 w-6 rounded bg-go-100 text-center font-bold text-go-700" aria-hidden="true">✓</span> right on the first try
        </span>
        <span className="inline-flex items-center gap-1">
          <span className="inline-block h-6 w-6 rounded bg-signal-100 text-center font-bold text-signal-700" aria-hidden="true">✗</span> missed
        </span>
        <span className="inline-flex flex-wrap items-center gap-1">
          Missed column:
          {HEAT.map((h) => (
            <span key={h.label} className={`rounded border border-steel-200 px-2 py-0.5 text-xs font-semibold ${h.className}`}>
              {h.label}
            </span>
          ))}
        </span>
      </div>
    </div>
  );
}
