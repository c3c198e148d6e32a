import type { Stage } from '../procedure/schema';

/** One line of feedback: which step/bolt/pin it is about, whether it was right, and why not. */
export interface StepResult {
  key: string;
  ok: boolean;
  message: string;
}

/** What every stage scorer returns; the server stores it beside the attempt. */
export interface StageScore {
  stage: Stage;
  score: number;
  maxScore: number;
  passed: boolean;
  results: StepResult[];
  /** Optional worked arithmetic or explanation lines (wrench stage, similarity). */
  notes?: string[];
}
