import { describe, expect, it } from 'vitest';
import { DEMO_PROCEDURES } from '../../models/procedures';
import { validateProcedure } from '../../src/lib/procedure/validate';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { scoreAttempt } from '../../src/lib/scoring';

describe('reference answers', () => {
  for (const input of DEMO_PROCEDURES) {
    const checked = validateProcedure(input);
    if (!checked.ok) throw new Error(`${input.slug} is invalid`);
    const procedure = checked.procedure;
    for (const stage of procedure.stages) {
      it(`${procedure.slug} ${stage}: the worked-out answer scores full marks`, () => {
        const result = scoreAttempt(procedure, stage, correctAnswer(procedure, stage));
        expect(result.ok).toBe(true);
        if (!result.ok) return;
        expect(result.score.passed).toBe(true);
        expect(result.score.score).toBe(result.score.maxScore);
      });
    }
  }
});
