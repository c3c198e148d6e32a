import type { attempts } from '../../db/schema';
import type { AttemptRequest } from '../schemas/attempts';
import type { StageScore } from '../scoring/types';

/** The row stored for a scored attempt; pure, so the benchmark's bare baseline writes the very same row. */
export function attemptRow(
  userId: string,
  input: AttemptRequest,
  procedureVersionId: string,
  score: StageScore,
): typeof attempts.$inferInsert {
  return {
    userId,
    clientId: input.clientId,
    procedureVersionId,
    stage: input.stage,
    answer: input.answer as object,
    score: score.score,
    maxScore: score.maxScore,
    passed: score.passed,
    results: score.results,
    notes: score.notes ?? [],
  };
}
