import type { Stage } from '../procedure/schema';

/** What a drill asks: the stages to do, the pass mark, the attempt limit (per stage) and its dates. */
export interface DrillRules {
  stages: readonly Stage[];
  passMarkPct: number;
  /** Attempts allowed per stage; null for no limit. */
  attemptLimit: number | null;
  dueAt: Date;
  closedAt: Date | null;
}

/** One scored attempt made on the drill. */
export interface DrillAttempt {
  stage: Stage;
  score: number;
  maxScore: number;
  createdAt: Date;
}

export type DrillStatus = 'not-started' | 'in-progress' | 'passed' | 'missed' | 'overdue';

export interface StageProgress {
  stage: Stage;
  attempts: number;
  /** Best score as a percentage of the stage's marks; null before the first attempt. */
  bestPct: number | null;
  passed: boolean;
  /** Null when the drill has no attempt limit. */
  attemptsLeft: number | null;
}

export interface DrillProgress {
  status: DrillStatus;
  stages: StageProgress[];
  /** Mean of the stages' best percentages, a stage not yet tried counting 0; null before any attempt. */
  bestPct: number | null;
  passed: boolean;
  attempts: number;
  /** The fewest attempts left on a stage not yet passed; null when unlimited. */
  attemptsLeft: number | null;
  lastActivity: Date | null;
}

const pct = (a: DrillAttempt) => (a.maxScore > 0 ? (a.score / a.maxScore) * 100 : 0);

/**
 * A learner's standing on one drill. Passed: every stage's best reaches the pass mark (late passes count).
 * Missed: it can no longer be passed (closed, or a failing stage has no attempts left). Overdue: past the
 * due date, still open and passable. Otherwise in progress once tried, else not started.
 */
export function drillProgress(rules: DrillRules, attempts: readonly DrillAttempt[], now: Date): DrillProgress {
  const stages = rules.stages.map((stage): StageProgress => {
    const mine = attempts.filter((a) => a.stage === stage);
    const bestPct = mine.length ? Math.max(...mine.map(pct)) : null;
    const passed = bestPct !== null && bestPct >= rules.passMarkPct;
    const attemptsLeft = rules.attemptLimit === null ? null : Math.max(0, rules.attemptLimit - mine.length);
    return { stage, attempts: mine.length, bestPct, passed, attemptsLeft };
  });
  const counted = attempts.filter((a) => rules.stages.includes(a.stage));
  const passed = stages.length > 0 && stages.every((s) => s.passed);
  const open = stages.filter((s) => !s.passed);
  let attemptsLeft: number | null = null;
  if (rules.attemptLimit !== null) attemptsLeft = open.length ? Math.min(...open.map((s) => s.attemptsLeft ?? 0)) : 0;
  const exhausted = open.some((s) => s.attemptsLeft === 0);
  const lastActivity = counted.length ? new Date(Math.max(...counted.map((a) => a.createdAt.getTime()))) : null;

  let status: DrillStatus;
  if (passed) status = 'passed';
  else if ((rules.closedAt !== null && rules.closedAt <= now) || exhausted) status = 'missed';
  else if (now > rules.dueAt) status = 'overdue';
  else status = counted.length ? 'in-progress' : 'not-started';

  const bestPct = counted.length ? stages.reduce((sum, s) => sum + (s.bestPct ?? 0), 0) / stages.length : null;
  return { status, stages, bestPct, passed, attempts: counted.length, attemptsLeft, lastActivity };
}
