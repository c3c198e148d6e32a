import { describe, expect, it } from 'vitest';
import { DEMO_ATTEMPT_PLAN, demoClientId, slipAnswer } from '../../scripts/demo-attempts';
import { scoreAttempt } from '~/lib/scoring';
import { correctAnswer } from '~/lib/procedure/reference-answers';
import { demoProcedure } from '../support/demo-procedures';

const sump = demoProcedure('wren-160-sump');

describe('the demo class attempts', () => {
  it('scores every slip below full marks and every right answer at full marks', () => {
    for (const stage of sump.stages) {
      const slip = scoreAttempt(sump, stage, slipAnswer(sump, stage));
      const right = scoreAttempt(sump, stage, correctAnswer(sump, stage));
      if (!slip.ok || !right.ok) throw new Error(`${stage} did not score`);
      expect(slip.score.passed, stage).toBe(false);
      expect(right.score.score, stage).toBe(right.score.maxScore);
    }
  });

  it('keeps within the sump drill: its stages, at most 3 attempts a stage', () => {
    for (const plan of Object.values(DEMO_ATTEMPT_PLAN)) {
      for (const stage of sump.stages) expect(plan.filter(([s]) => s === stage).length).toBeLessThanOrEqual(3);
      for (const [stage] of plan) expect(sump.stages).toContain(stage);
    }
  });

  it('makes the same UUID-shaped clientId every run, a different one per attempt', () => {
    expect(demoClientId('learner3@larkspur.example', 0)).toBe(demoClientId('learner3@larkspur.example', 0));
    expect(demoClientId('learner3@larkspur.example', 0)).not.toBe(demoClientId('learner3@larkspur.example', 1));
    expect(demoClientId('a', 0)).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-8[0-9a-f]{3}-[0-9a-f]{12}$/);
  });
});
