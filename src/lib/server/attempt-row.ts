import type { attempts } from '../../db/schema';
import type { AttemptRequest } from '../schemas/attempts';
import type { StageScore, StepResult } from '../scoring/types';
import { withoutAnswers } from '../drills/answers';
import { hasFailedLines } from '../rework/misses';

// Pure pieces of an attempt, shared by the endpoint and the benchmark's bare baseline so both write
// the very same row and answer the very same JSON.

export interface AttemptView {
  id: string;
  learnerId: string;
  procedure: string;
  version: number;
  stage: string;
  drillId: string | null;
  score: number;
  maxScore: number;
  passed: boolean;
  results: StepResult[];
  notes: string[];
  answer: unknown;
  createdAt: Date;
}

/** The row stored for a scored attempt. */
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
    drillId: input.drillId ?? null,
    answer: input.answer as object,
    score: score.score,
    maxScore: score.maxScore,
    passed: score.passed,
    results: score.results,
    notes: score.notes ?? [],
    // Cleared by the rework queue once the failed lines are in it; a learner's next visit queues what a fault left.
    reworkPending: hasFailedLines(score.results),
  };
}

/** The view of an attempt just inserted, built from what the insert returned (no read-back). */
export function createdAttempt(
  userId: string,
  input: AttemptRequest,
  version: { slug: string; version: number },
  score: StageScore,
  inserted: { id: string; createdAt: Date },
): AttemptView {
  return {
    ...inserted,
    learnerId: userId,
    procedure: version.slug,
    version: version.version,
    stage: input.stage,
    drillId: input.drillId ?? null,
    score: score.score,
    maxScore: score.maxScore,
    passed: score.passed,
    results: score.results,
    notes: score.notes ?? [],
    answer: input.answer,
  };
}

/**
 * The JSON shape of an attempt (docs/api.md documents it). With `answersHidden` (a drill that keeps its
 * answers until the due date, shown to its learner) the lines keep ok/not ok but lose their words.
 */
export function attemptJson(attempt: AttemptView, { answersHidden = false }: { answersHidden?: boolean } = {}) {
  const a = answersHidden ? withoutAnswers(attempt) : attempt;
  return {
    id: a.id,
    procedure: a.procedure,
    version: a.version,
    stage: a.stage,
    score: a.score,
    maxScore: a.maxScore,
    passed: a.passed,
    results: a.results,
    notes: a.notes,
    answer: a.answer,
    learnerId: a.learnerId,
    drillId: a.drillId,
    answersHidden,
    createdAt: a.createdAt,
  };
}
