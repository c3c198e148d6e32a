import type { Procedure, Stage } from '../procedure/schema';
import type { StepResult } from '../scoring/types';
import { canAsk } from './questions';

// Which lines of a scored attempt become rework items. Pure: the server calls it after an attempt is stored.

export const MISS_KINDS = ['out-of-order', 'wrong-pin', 'broken-pattern', 'wrong-wrench-setting', 'failed-final-check'] as const;
export type MissKind = (typeof MISS_KINDS)[number];

/** One kind of miss per stage: the stage is what the learner got wrong. */
export const MISS_KIND_OF_STAGE: Record<Stage, MissKind> = {
  order: 'out-of-order',
  pins: 'wrong-pin',
  pattern: 'broken-pattern',
  wrench: 'wrong-wrench-setting',
  'final-check': 'failed-final-check',
};

export interface Miss {
  stage: Stage;
  itemKey: string;
  missKind: MissKind;
}

/** Whether an attempt has anything for the queue to look at: the mark an attempt is stored with until it has. */
export function hasFailedLines(results: readonly StepResult[]): boolean {
  return results.some((line) => !line.ok);
}

/**
 * Each failed line, once, when a question can be built for it. Lines about things the procedure does
 * not have (an unknown step key typed by a client) are left out: there is nothing to practise.
 */
export function missesOf(procedure: Procedure, stage: Stage, results: readonly StepResult[]): Miss[] {
  const keys = new Set<string>();
  for (const line of results) if (!line.ok && canAsk(procedure, stage, line.key)) keys.add(line.key);
  return [...keys].map((itemKey) => ({ stage, itemKey, missKind: MISS_KIND_OF_STAGE[stage] }));
}
