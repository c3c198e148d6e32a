import type { Stage } from '../../lib/procedure/schema';

// The JSON of GET /api/me/progress and GET /api/learners/:id/progress, as the browser reads it.

export interface StandingCounts {
  mastered: number;
  due: number;
  learning: number;
}

export interface ProgressJson {
  learner: { id: string; name: string };
  timeZone: string;
  today: string;
  procedures: {
    slug: string;
    title: string;
    stages: { stage: Stage; attempts: { at: string; score: number; maxScore: number; percent: number; passed: boolean }[]; best: number; latest: number }[];
    rework: StandingCounts;
  }[];
  rework: StandingCounts & { total: number };
  streak: { current: number; longest: number; practisedToday: boolean; days: string[] };
}
