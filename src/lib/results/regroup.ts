import { analyseItems, GROUP_SPLITS, type GroupSplit } from './item-analysis';
import type { StepAnalysis } from './class-results';

// Kept apart from class-results.ts so the results page's island loads only the statistics, not the scorers.

/**
 * The same analysis with another group split, from the answers it already holds (the learners are
 * in ranking order, so equal totals keep their places). The results page switches splits with it.
 */
export function regroupAnalysis(analysis: StepAnalysis, groups: GroupSplit): StepAnalysis {
  const again = analyseItems(
    analysis.learners.map((l) => l.answers),
    { groupShare: GROUP_SPLITS[groups], items: analysis.steps.length },
  );
  const upper = new Set(again.upper);
  const lower = new Set(again.lower);
  return {
    ...analysis,
    groupSize: again.groupSize,
    steps: analysis.steps.map((step, j) => ({ ...step, ...again.items[j]! })),
    learners: analysis.learners.map((l, i) => ({ ...l, group: upper.has(i) ? 'upper' : lower.has(i) ? 'lower' : null })),
  };
}
