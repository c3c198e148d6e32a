import type { Stage } from '../../lib/procedure/schema';
import type { Question } from '../../lib/rework/questions';
import type { StepResult } from '../../lib/scoring/types';

// The JSON the rework endpoints answer, as the browser reads it (dates as ISO strings).

export interface ReworkItem {
  id: string;
  procedure: { slug: string; title: string; version: number };
  stage: Stage;
  itemKey: string;
  missKind: string;
  due: string;
  missCount: number;
  lastMissedAt: string;
  reviews: number;
  label: string;
  missWords: string;
  question: Question | null;
}

export interface ReworkList {
  now: string;
  due: ReworkItem[];
  upcoming: ReworkItem[];
}

export interface ReworkAnswerResult {
  id: string;
  itemId: string;
  answer: { choice: string; variant: number; hinted: boolean };
  correct: boolean;
  rating: number;
  ratingWord: string;
  results: StepResult[];
  notes: string[];
  accepted: string[];
  dueBefore: string;
  dueAfter: string;
  createdAt: string;
}
