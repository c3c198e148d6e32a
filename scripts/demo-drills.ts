// Drills the demo class starts with, so the learners' and the instructor's pages have something to show.
import type { Stage } from '../src/lib/procedure/schema';

export interface DemoDrill {
  procedure: string;
  stages: Stage[];
  /** Due this many days after seeding, at 15:00 UTC. */
  dueInDays: number;
  passMarkPct: number;
  attemptLimit: number | null;
  answersAfterDue: boolean;
}

export const DEMO_DRILLS: DemoDrill[] = [
  { procedure: 'wren-160-sump', stages: ['order', 'pins', 'pattern', 'wrench', 'final-check'], dueInDays: 7, passMarkPct: 80, attemptLimit: 3, answersAfterDue: false },
  { procedure: 'wren-160-spark-plug', stages: ['order', 'wrench'], dueInDays: 3, passMarkPct: 100, attemptLimit: null, answersAfterDue: true },
];

export function demoDueAt(days: number, from: Date): Date {
  const due = new Date(from.getTime() + days * 24 * 60 * 60 * 1000);
  due.setUTCHours(15, 0, 0, 0);
  return due;
}
