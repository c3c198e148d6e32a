import { mean, standardDeviation } from 'simple-statistics';

// Classical item analysis of a drill's steps: for each step, how many learners got it right
// (difficulty p), and how well it separates stronger from weaker learners (discrimination D from
// upper and lower groups, and the point-biserial correlation r_pb with the total).
//
// Formulas as in item-analysis teaching handouts:
//   p    = learners right / learners
//   D    = (right in the upper group − right in the lower group) / group size
//   r_pb = (M_p − M_q) / S_t · √(p·q)
// where M_p and M_q are the mean totals of those who got the step right and wrong, q = 1 − p, and S_t
// is the POPULATION standard deviation of the totals (divided by n; simple-statistics'
// standardDeviation). With that convention r_pb equals Pearson's r between the 0/1 step and the total
// (the n or n − 1 cancels inside Pearson's r, so sampleCorrelation gives the same number). The total
// includes the step itself (the uncorrected r_pb), as the handouts' formula does.

export type Answer = 0 | 1;

/** The usual group splits: halves (the worked example's 15 of 30) and Kelley's top and bottom 27 %. */
export const GROUP_SPLITS = { halves: 0.5, '27': 0.27 } as const;
export type GroupSplit = keyof typeof GROUP_SPLITS;

export interface ItemStats {
  /** Learners who got the step right. */
  correct: number;
  /** Difficulty: share right, 0..1; null without learners. */
  p: number | null;
  /** Share who missed it, 1 − p. */
  missed: number | null;
  upperCorrect: number | null;
  lowerCorrect: number | null;
  /** Discrimination index, −1..1; null with fewer than 2 learners. */
  d: number | null;
  /** Point-biserial correlation; null with fewer than 2 learners, when everyone or no one got it right, or when all totals are equal. */
  rpb: number | null;
}

export interface ItemAnalysis {
  learners: number;
  /** Each learner's total (steps right), in the order given. */
  totals: number[];
  /** Learner indices from the highest total to the lowest; ties keep the order given. */
  ranking: number[];
  /** Learners in each of the upper and lower groups. */
  groupSize: number;
  upper: number[];
  lower: number[];
  meanTotal: number | null;
  /** Population standard deviation of the totals. */
  sdTotal: number | null;
  items: ItemStats[];
}

/**
 * Size of the upper and lower groups: the share of the learners, rounded, at least 1 and at most half
 * (so the groups never overlap; with an odd count at halves the middle learner is in neither).
 */
export function groupSizeFor(learners: number, share: number): number {
  if (learners < 2) return 0;
  const half = Math.floor(learners / 2);
  return Math.min(half, Math.max(1, Math.round(share * learners)));
}

export interface AnalysisOptions {
  /** Share of the learners in each of the upper and lower groups: 0.5 for halves (the default), 0.27 for Kelley's split. */
  groupShare?: number;
  /** Number of steps; needed only when there are no learners to count them from. */
  items?: number;
}

/** Analyses a learners × steps matrix of 0/1 answers (every row as long as the first). */
export function analyseItems(answers: readonly (readonly Answer[])[], options: AnalysisOptions = {}): ItemAnalysis {
  const groupShare = options.groupShare ?? GROUP_SPLITS.halves;
  if (!(groupShare > 0 && groupShare <= 0.5)) throw new RangeError(`groupShare must be in (0, 0.5], not ${groupShare}`);
  const n = answers.length;
  const width = options.items ?? answers[0]?.length ?? 0;
  if (answers.some((row) => row.length !== width)) throw new RangeError('every learner needs an answer for every step');

  const totals = answers.map((row) => row.reduce<number>((sum, a) => sum + a, 0));
  // Array.prototype.sort is stable, so equal totals keep the order given.
  const ranking = totals.map((_, i) => i).sort((a, b) => totals[b]! - totals[a]!);
  const groupSize = groupSizeFor(n, groupShare);
  const upper = ranking.slice(0, groupSize);
  const lower = groupSize ? ranking.slice(-groupSize) : [];
  const meanTotal = n ? mean(totals) : null;
  const sdTotal = n ? standardDeviation(totals) : null;

  const items = Array.from({ length: width }, (_, j): ItemStats => {
    const column = answers.map((row) => row[j]!);
    const correct = column.reduce<number>((sum, a) => sum + a, 0);
    if (n === 0) return { correct, p: null, missed: null, upperCorrect: null, lowerCorrect: null, d: null, rpb: null };
    const p = correct / n;
    // Counted, not 1 − p, so .2 prints as .2 and not .19999999999999996.
    const missed = (n - correct) / n;
    if (n < 2) return { correct, p, missed, upperCorrect: null, lowerCorrect: null, d: null, rpb: null };

    const upperCorrect = upper.reduce((sum, i) => sum + column[i]!, 0);
    const lowerCorrect = lower.reduce((sum, i) => sum + column[i]!, 0);
    const d = (upperCorrect - lowerCorrect) / groupSize;

    let rpb: number | null = null;
    if (correct > 0 && correct < n && sdTotal! > 0) {
      const mp = mean(totals.filter((_, i) => column[i] === 1));
      const mq = mean(totals.filter((_, i) => column[i] === 0));
      rpb = ((mp - mq) / sdTotal!) * Math.sqrt(p * (1 - p));
    }
    return { correct, p, missed, upperCorrect, lowerCorrect, d, rpb };
  });

  return { learners: n, totals, ranking, groupSize, upper, lower, meanTotal, sdTotal, items };
}
