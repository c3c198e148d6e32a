import type { StepResult } from '../scoring/types';

// A drill may keep the right answers back until its due date, so learners cannot pass them around
// while it is open. The learner still learns which lines were right; the words that would say what the
// right answer is (a hole's pin, the torque a pass needs, the worked setting) wait for the due date.

export interface AnswerRule {
  answersAfterDue: boolean;
  dueAt: Date;
}

/** True while the drill holds its answers back. */
export function answersHidden(rule: AnswerRule, now: Date): boolean {
  return rule.answersAfterDue && now.getTime() < rule.dueAt.getTime();
}

/** 'dowel-hole-a' → 'Dowel hole a', 'pass-2-torque' → 'Pass 2 torque'. */
function subject(key: string): string {
  const words = key.split('-').filter(Boolean).join(' ');
  return words ? words.charAt(0).toUpperCase() + words.slice(1) : 'This line';
}

export const RIGHT_MESSAGE = 'right';
export const HIDDEN_MESSAGE = 'not right yet. The right answer shows after the due date.';

/**
 * The feedback without the answers: each line keeps its key and ok, its message becomes neutral, and
 * the worked notes go. Every message is replaced, right ones too: a right line can name the answer
 * ("… left in the kit: it is not for this job" says which part is the decoy).
 */
export function withoutAnswers<T extends { results: StepResult[]; notes: string[] }>(attempt: T): T {
  return {
    ...attempt,
    results: attempt.results.map((line) => ({
      ...line,
      message: `${subject(line.key)}: ${line.ok ? RIGHT_MESSAGE : HIDDEN_MESSAGE}`,
    })),
    notes: [],
  };
}
