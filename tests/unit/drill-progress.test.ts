import { describe, expect, it } from 'vitest';
import { drillProgress, type DrillAttempt, type DrillRules } from '~/lib/drills/progress';

const due = new Date('2026-03-10T17:00:00Z');
const before = new Date('2026-03-09T12:00:00Z');
const after = new Date('2026-03-11T12:00:00Z');
const rules: DrillRules = { stages: ['order', 'pattern'], passMarkPct: 80, attemptLimit: 3, dueAt: due, closedAt: null };
const at = (stage: DrillAttempt['stage'], score: number, maxScore = 10, day = 8): DrillAttempt => ({
  stage,
  score,
  maxScore,
  createdAt: new Date(`2026-03-0${day}T10:00:00Z`),
});

describe('drillProgress', () => {
  it('is not started before any attempt, and overdue once the due date passes', () => {
    expect(drillProgress(rules, [], before).status).toBe('not-started');
    expect(drillProgress(rules, [], after).status).toBe('overdue');
    expect(drillProgress(rules, [], before).bestPct).toBeNull();
  });

  it('passes only when every stage reaches the pass mark, with the best attempt of each stage counting', () => {
    const some = drillProgress(rules, [at('order', 9), at('pattern', 5)], before);
    expect(some.status).toBe('in-progress');
    expect(some.bestPct).toBe(70); // (90 + 50) / 2
    const all = drillProgress(rules, [at('order', 9), at('pattern', 5), at('pattern', 8, 10, 9)], before);
    expect(all.status).toBe('passed');
    expect(all.stages.map((s) => s.bestPct)).toEqual([90, 80]);
    expect(all.lastActivity?.toISOString()).toBe('2026-03-09T10:00:00.000Z');
  });

  it('counts a stage not yet tried as 0 in the best score', () => {
    expect(drillProgress(rules, [at('order', 10)], before).bestPct).toBe(50);
  });

  it('ignores attempts on stages the drill does not ask for', () => {
    const p = drillProgress(rules, [at('wrench', 10)], before);
    expect(p.attempts).toBe(0);
    expect(p.status).toBe('not-started');
  });

  it('is missed when a failing stage has used its attempts, or the drill is closed', () => {
    const used = [at('order', 1), at('order', 2), at('order', 3)];
    const p = drillProgress(rules, used, before);
    expect(p.status).toBe('missed');
    expect(p.attemptsLeft).toBe(0);
    expect(drillProgress({ ...rules, closedAt: before }, [at('order', 9)], before).status).toBe('missed');
  });

  it('counts attempts left on the tightest stage not yet passed, and none when unlimited', () => {
    expect(drillProgress(rules, [at('order', 10), at('pattern', 1)], before).attemptsLeft).toBe(2);
    expect(drillProgress({ ...rules, attemptLimit: null }, [at('order', 1)], before).attemptsLeft).toBeNull();
  });

  it('keeps a pass after the due date or closing', () => {
    const done = [at('order', 10), at('pattern', 10)];
    expect(drillProgress({ ...rules, closedAt: before }, done, after).status).toBe('passed');
  });
});
