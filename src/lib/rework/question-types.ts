import type { Stage } from '../procedure/schema';
import type { StepResult } from '../scoring/types';

// The shape of a rework question as the browser gets it (no answer key), and the judge the server keeps.

export type QuestionKind =
  | 'next-step'
  | 'previous-step'
  | 'pin-for-hole'
  | 'hole-for-pin'
  | 'next-bolt'
  | 'pass-torque'
  | 'pass-count'
  | 'wrench-setting'
  | 'fastener-count'
  | 'leftover'
  | 'crank-turns';

export interface Choice {
  id: string;
  label: string;
}

/** What the 3D view shows for a question; the list of choices always works without it. */
export type QuestionModel =
  /** Bolts of a fastener group; `done` are already tightened in this pass, in order; choices are bolt keys. */
  | { kind: 'bolts'; group: string; done: string[] }
  /** Holes: `focus` is the hole asked about; when `pickHoles`, choices are hole keys to click. */
  | { kind: 'holes'; focus: string | null; pickHoles: boolean };

export interface Question {
  kind: QuestionKind;
  stage: Stage;
  itemKey: string;
  /** Which of the item's question variants this is; the answer sends it back so the same question is judged. */
  variant: number;
  prompt: string;
  /** Lines the learner needs to answer (the step asked about, the bolts already tightened, the spec …). */
  context: string[];
  choices: Choice[];
  /** Shown only when asked for; using it lowers the rating. */
  hint: string;
  model?: QuestionModel;
}

export interface Judgement {
  correct: boolean;
  /** The scorer's lines about this answer: why it is right, or what it breaks. */
  results: StepResult[];
  /** Worked arithmetic, when the scorer gives some. */
  notes?: string[];
}

/** A question and the server-side function that judges a choice. */
export interface Asker {
  question: Question;
  judge(choiceId: string): Judgement;
}
