import { useMemo, useState } from 'react';
import type { ClassResults, StepAnalysis as Analysis } from '../../lib/results/class-results';
import { regroupAnalysis } from '../../lib/results/regroup';
import type { GroupSplit } from '../../lib/results/item-analysis';
import { STAGE_LABELS } from '../trainer/labels';
import { formatIndex, formatPct } from './format';
import StepHeatMap from './StepHeatMap';

// Which steps the class missed on its first try, and which separate stronger from weaker learners.
// The table lists the most-missed steps first: those are the ones to re-teach.

const SPLIT_TEXT: Record<GroupSplit, string> = {
  halves: 'Upper and lower halves',
  '27': 'Top and bottom 27 %',
};

/** Rough reading of D, from memory of the usual classroom rules of thumb (Ebel): .40 and up good, below .20 poor. */
function readD(d: number | null): string {
  if (d === null) return 'too few learners';
  if (d < 0) return 'weaker learners did better: check the step';
  if (d < 0.2) return 'separates poorly';
  if (d < 0.4) return 'separates fairly';
  return 'separates well';
}

export default function StepAnalysis({ results }: { results: Pick<ClassResults, 'drills' | 'stepAnalysis' | 'groups'> }) {
  // Open on the drill with the most learners to analyse: the first in due order may have none yet.
  const [drillId, setDrillId] = useState(() => {
    const busiest = [...results.stepAnalysis].sort((a, b) => b.counted - a.counted)[0];
    return busiest && busiest.counted > 0 ? busiest.drillId : (results.drills[0]?.id ?? '');
  });
  const [groups, setGroups] = useState<GroupSplit>(results.groups);
  const base = results.stepAnalysis.find((a) => a.drillId === drillId);
  const analysis: Analysis | undefined = useMemo(() => (base ? regroupAnalysis(base, groups) : undefined), [base, groups]);
  const drill = results.drills.find((d) => d.id === drillId);

  if (!drill || !analysis) return <p className="text-steel-600">No drills in this class yet: the step analysis needs a drill with attempts.</p>;

  const ranked = analysis.steps
    .map((step, index) => ({ step, index }))
    .sort((a, b) => (b.step.missed ?? -1) - (a.step.missed ?? -1) || a.index - b.index);

  return (
    <div>
      <div className="mb-4 flex flex-wrap items-end gap-4">
        {results.drills.length > 1 && (
          <label className="block min-w-[16rem] flex-1">
            <span className="field-label">Drill</span>
            <select className="field-input" value={drillId} onChange={(e) => setDrillId(e.target.value)}>
              {results.drills.map((d) => (
                <option key={d.id} value={d.id}>
                  {d.title} (due {d.dueAt.slice(0, 10)})
                </option>
              ))}
            </select>
          </label>
        )}
        <label className="block min-w-[14rem]">
          <span className="field-label">Upper and lower groups</span>
          <select className="field-input" value={groups} onChange={(e) => setGroups(e.target.value as GroupSplit)}>
            {(Object.keys(SPLIT_TEXT) as GroupSplit[]).map((g) => (
              <option key={g} value={g}>
                {SPLIT_TEXT[g]}
              </option>
            ))}
          </select>
        </label>
      </div>

      <p className="mb-4 max-w-3xl text-steel-700" data-testid="analysis-basis">
        Counts each learner's <strong>first attempt</strong> on each stage of <strong>{drill.title}</strong>: what they knew before
        practising. {analysis.counted} {analysis.counted === 1 ? 'learner has' : 'learners have'} tried every stage
        {analysis.notCounted > 0 && ` (${analysis.notCounted} not yet, so not counted)`}.{' '}
        {analysis.groupSize > 0
          ? `Upper and lower groups: ${analysis.groupSize} ${analysis.groupSize === 1 ? 'learner' : 'learners'} each, by steps right.`
          : 'The upper and lower groups need at least 2 learners.'}
      </p>

      {analysis.counted === 0 ? (
        <p className="rounded-lg border border-steel-200 bg-steel-50 p-4 text-steel-700">Nobody has tried every stage of this drill yet.</p>
      ) : (
        <>
          <div className="overflow-x-auto rounded-lg border border-steel-200">
            <table className="w-full border-collapse text-left" data-testid="step-table">
              <caption className="sr-only">Steps of {drill.title}, most missed first</caption>
              <thead className="bg-steel-50 text-sm text-steel-700">
                <tr>
                  <th scope="col" className="px-3 py-2">Stage</th>
                  <th scope="col" className="px-3 py-2">Step</th>
                  <th scope="col" className="px-3 py-2 text-right">Missed</th>
                  <th scope="col" className="px-3 py-2 text-right" title="Difficulty: share who got it right">p</th>
                  <th scope="col" className="px-3 py-2 text-right" title="Discrimination index: upper group right minus lower group right, over the group size">D</th>
                  <th scope="col" className="px-3 py-2 text-right" title="Point-biserial correlation of the step with the learner's total">r<sub>pb</sub></th>
                  <th scope="col" className="px-3 py-2">Reading</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-steel-100 bg-white">
                {ranked.map(({ step }) => (
                  <tr key={`${step.stage}/${step.key}`}>
                    <td className="whitespace-nowrap px-3 py-2 text-sm text-steel-700">{STAGE_LABELS[step.stage]}</td>
                    <th scope="row" className="px-3 py-2 text-left font-medium">{step.label}</th>
                    <td className="whitespace-nowrap px-3 py-2 text-right">
                      <span className="font-semibold">{formatPct(step.missed === null ? null : Math.round(step.missed * 1000) / 10)}</span>
                      <span className="block text-xs text-steel-600">
                        {analysis.counted - step.correct} of {analysis.counted}
                      </span>
                    </td>
                    <td className="px-3 py-2 text-right font-mono">{formatIndex(step.p)}</td>
                    <td className="whitespace-nowrap px-3 py-2 text-right font-mono">
                      {formatIndex(step.d)}
                      {step.upperCorrect !== null && (
                        <span className="block font-sans text-xs text-steel-600" title="right in the upper group vs the lower group">
                          {step.upperCorrect} vs {step.lowerCorrect}
                        </span>
                      )}
                    </td>
                    <td className="px-3 py-2 text-right font-mono">{formatIndex(step.rpb)}</td>
                    <td className="px-3 py-2 text-sm text-steel-700">
                      {step.missed !== null && step.missed >= 0.5 && (
                        <span className="mr-1 font-semibold text-signal-700">
                          <span aria-hidden="true">⚠ </span>Re-teach ·
                        </span>
                      )}
                      {step.p === 1 ? 'everyone got it right' : readD(step.d)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <p className="mt-2 max-w-3xl text-sm text-steel-600">
            p: share right on the first try. D: (right in the upper group − right in the lower group) ÷ group size; from .40 up a
            step separates well, below .20 poorly (a usual rule of thumb). r<sub>pb</sub>: correlation of the step with the learner's
            total; — when everyone (or no one) got it right.
          </p>

          <h3 className="mb-2 mt-8 text-lg font-bold">Heat map: who missed which step</h3>
          <StepHeatMap analysis={analysis} />
        </>
      )}
    </div>
  );
}
