import type { Stage } from '../procedure/schema';
import type { StageScore, StepResult } from './types';

/** One mark per feedback line, passed only when every line is right. */
export function markPerResult(stage: Stage, results: StepResult[], notes?: string[]): StageScore {
  const score = results.filter((r) => r.ok).length;
  return { stage, score, maxScore: results.length, passed: score === results.length, results, ...(notes ? { notes } : {}) };
}
