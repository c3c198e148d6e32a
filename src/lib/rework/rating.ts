import { Rating, type Grade } from 'ts-fsrs';

// How one rework answer becomes a review rating for the scheduler. Pure: the server and the tests share it.

export interface AnswerOutcome {
  /** The server's verdict on the answer. */
  correct: boolean;
  /** The learner opened the hint before answering. */
  hinted: boolean;
}

/**
 * Wrong → Again: the step is not known, so it comes back within minutes (the scheduler's first learning step).
 * Right after a hint → Hard: the learner got there with help; it comes back sooner than a clean answer.
 * Right first try → Good: the normal step outward.
 * Easy is never given: one right pick from a short list is weak evidence, and Easy on a new item jumps eight
 * days at once, which would let a learner click a just-missed step out of sight.
 */
export function ratingFor(outcome: AnswerOutcome): Grade {
  if (!outcome.correct) return Rating.Again;
  return outcome.hinted ? Rating.Hard : Rating.Good;
}

export const RATING_WORDS: Record<Grade, string> = {
  [Rating.Again]: 'again',
  [Rating.Hard]: 'hard',
  [Rating.Good]: 'good',
  [Rating.Easy]: 'easy',
};
