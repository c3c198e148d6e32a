import type { Procedure, Stage } from '../procedure/schema';
import type { StepResult } from '../scoring/types';
import { askFinalCheck } from './ask-final-check';
import { askOrder } from './ask-order';
import { askPattern } from './ask-pattern';
import { askPins } from './ask-pins';
import { askWrench } from './ask-wrench';
import type { Asker, Question } from './question-types';

// Short targeted questions built from the stored procedure for one missed item (a step, hole, pin, pass or
// check), and their scoring. Pure and deterministic: the server builds the question for the browser, then
// builds it again from the same variant to judge the answer. The browser never gets the judge.

export type { Choice, Question, QuestionKind, QuestionModel } from './question-types';

export function asker(procedure: Procedure, stage: Stage, itemKey: string, variant: number): Asker | null {
  if (!procedure.stages.includes(stage)) return null;
  switch (stage) {
    case 'order':
      return askOrder(procedure, itemKey, variant);
    case 'pins':
      return askPins(procedure, itemKey, variant);
    case 'pattern':
      return askPattern(procedure, itemKey, variant);
    case 'wrench':
      return askWrench(procedure, itemKey, variant);
    case 'final-check':
      return askFinalCheck(procedure, itemKey, variant);
  }
}

/** True when the item has a question: only such misses become rework items. */
export function canAsk(procedure: Procedure, stage: Stage, itemKey: string): boolean {
  return asker(procedure, stage, itemKey, 0) !== null;
}

/** The question as the learner sees it, or null when there is none for this item. */
export function buildQuestion(procedure: Procedure, stage: Stage, itemKey: string, variant: number): Question | null {
  return asker(procedure, stage, itemKey, variant)?.question ?? null;
}

export type AnswerVerdict =
  | {
      ok: true;
      correct: boolean;
      results: StepResult[];
      notes: string[];
      /** Every choice that would have been right (shown after the answer, never before). */
      accepted: string[];
    }
  | { ok: false; message: string };

/** Judges one choice; a choice the question did not offer is refused (HTTP 400), not scored. */
export function scoreAnswer(procedure: Procedure, stage: Stage, itemKey: string, variant: number, choice: string): AnswerVerdict {
  const ask = asker(procedure, stage, itemKey, variant);
  if (!ask) return { ok: false, message: 'This item has no question any more' };
  if (!ask.question.choices.some((c) => c.id === choice)) {
    return { ok: false, message: `"${choice}" is not one of this question's choices` };
  }
  const judgement = ask.judge(choice);
  const accepted = ask.question.choices.filter((c) => ask.judge(c.id).correct).map((c) => c.id);
  return { ok: true, correct: judgement.correct, results: judgement.results, notes: judgement.notes ?? [], accepted };
}
