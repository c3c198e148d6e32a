import type { DrillProgress, DrillStatus } from '../drills/progress';
import type { DrillRecord } from './drill-store';

// The JSON shapes of drills (docs/api.md documents them): one for everyone who may see the drill, the
// class's counts for its instructors, a learner's own standing for the learner.

const tenth = (x: number | null) => (x === null ? null : Math.round(x * 10) / 10);

export function drillJson(d: DrillRecord) {
  return {
    id: d.id,
    classId: d.classId,
    className: d.className,
    procedure: { slug: d.slug, title: d.title, version: d.version },
    stages: d.stages,
    dueAt: d.dueAt,
    passMarkPct: d.passMarkPct,
    attemptLimit: d.attemptLimit,
    answersAfterDue: d.answersAfterDue,
    closedAt: d.closedAt,
    createdAt: d.createdAt,
    updatedAt: d.updatedAt,
  };
}

/** A drill as its class's instructors see it: how many learners stand where. */
export function classDrillJson(d: DrillRecord & { learners: number; counts: StatusCounts }) {
  return { ...drillJson(d), learners: d.learners, counts: d.counts };
}

export function progressJson(p: DrillProgress) {
  return {
    status: p.status,
    bestPct: tenth(p.bestPct),
    attempts: p.attempts,
    attemptsLeft: p.attemptsLeft,
    lastActivity: p.lastActivity,
    stages: p.stages.map((s) => ({ stage: s.stage, attempts: s.attempts, bestPct: tenth(s.bestPct), passed: s.passed, attemptsLeft: s.attemptsLeft })),
  };
}

export type StatusCounts = Record<DrillStatus, number>;

export const emptyCounts = (): StatusCounts => ({ 'not-started': 0, 'in-progress': 0, passed: 0, missed: 0, overdue: 0 });
