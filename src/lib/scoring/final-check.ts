import type { Procedure } from '../procedure/schema';
import type { FinalCheckAnswer } from './answers';
import type { StageScore, StepResult } from './types';

// Final check: every fastener accounted for (none left over) and the crankshaft turned enough times
// to show nothing binds. Two marks: one for the count, one for the turns.

export function scoreFinalCheck(procedure: Procedure, answer: FinalCheckAnswer): StageScore {
  const check = procedure.finalCheck;
  if (!check) throw new Error(`procedure ${procedure.slug} has no final check`);

  const results: StepResult[] = [];
  const countOk = answer.fastenersCounted === check.fastenerCount;
  results.push({
    key: 'fasteners',
    ok: countOk,
    message: countOk
      ? `Counted ${answer.fastenersCounted} of ${check.fastenerCount} fasteners`
      : `Counted ${answer.fastenersCounted} fasteners; the job uses ${check.fastenerCount}, so count again before you close up`,
  });

  const leftoverOk = answer.leftover === undefined || answer.leftover === 0;
  if (answer.leftover !== undefined) {
    results.push({
      key: 'leftover',
      ok: leftoverOk,
      message: leftoverOk
        ? 'Nothing left over on the bench'
        : `${answer.leftover} left over on the bench: something was not fitted, so find where it goes before the engine runs`,
    });
  }

  const turnsOk = answer.crankTurns >= check.crankTurns;
  results.push({
    key: 'crank-turns',
    ok: turnsOk,
    message: turnsOk
      ? `Turned the crankshaft ${answer.crankTurns} times (at least ${check.crankTurns})`
      : `Turned the crankshaft ${answer.crankTurns} times; turn it at least ${check.crankTurns} full turns to show nothing binds`,
  });

  const score = (countOk && leftoverOk ? 1 : 0) + (turnsOk ? 1 : 0);
  return { stage: 'final-check', score, maxScore: 2, passed: score === 2, results };
}
