import type { Procedure } from '../procedure/schema';
import { scoreFinalCheck } from '../scoring/final-check';
import type { FinalCheckAnswer } from '../scoring/answers';
import type { Asker, Choice, Judgement } from './question-types';

// Final check: how many fasteners to count, how many parts may be left over, how far to turn the crank.
// Each choice goes into an otherwise right final check and the Final check scorer judges its line.

export function askFinalCheck(procedure: Procedure, key: string, variant: number): Asker | null {
  const check = procedure.finalCheck;
  if (!check) return null;
  const right: Required<FinalCheckAnswer> = { fastenersCounted: check.fastenerCount, crankTurns: check.crankTurns, leftover: 0 };
  const judgeWith = (change: Partial<FinalCheckAnswer>): Judgement => {
    const line = scoreFinalCheck(procedure, { ...right, ...change }).results.find((r) => r.key === key)!;
    return { correct: line.ok, results: [line] };
  };
  const numbers = (values: number[], unit: (n: number) => string): Choice[] =>
    [...new Set(values.filter((n) => n >= 0))].sort((a, b) => a - b).map((n) => ({ id: String(n), label: unit(n) }));
  const group = procedure.fastenerGroups[0];

  switch (key) {
    case 'fasteners': {
      const n = check.fastenerCount;
      return {
        question: {
          kind: 'fastener-count',
          stage: 'final-check',
          itemKey: key,
          variant,
          prompt: 'How many fasteners do you count installed before you call the job done?',
          // The kit's count is not shown: counting against it is the very thing asked.
          context: [group ? `${procedure.title}: ${group.name.toLowerCase()}.` : procedure.title],
          choices: numbers([n - 2, n - 1, n, n + 1, n + 2], (c) => String(c)),
          hint: 'Every fastener the kit holds for this job goes in; count them on the part, not in the tray.',
        },
        judge: (choice) => judgeWith({ fastenersCounted: Number(choice) }),
      };
    }
    case 'leftover':
      return {
        question: {
          kind: 'leftover',
          stage: 'final-check',
          itemKey: key,
          variant,
          prompt: 'How many parts may be left over on the bench when you are done?',
          context: [procedure.title],
          choices: numbers([0, 1, 2], (c) => String(c)),
          hint: 'A part left over means something was not fitted.',
        },
        judge: (choice) => judgeWith({ leftover: Number(choice) }),
      };
    case 'crank-turns': {
      const n = check.crankTurns;
      // Nothing to get wrong when no turn is asked for.
      if (n === 0) return null;
      return {
        question: {
          kind: 'crank-turns',
          stage: 'final-check',
          itemKey: key,
          variant,
          prompt: 'How many full turns do you give the crankshaft to show nothing binds?',
          context: [procedure.title],
          choices: numbers([0, 0.5, 1, n, n + 1], (c) => (c === 0.5 ? 'Half a turn' : `${c} ${c === 1 ? 'turn' : 'turns'}`)),
          hint: 'Turn it through a whole cycle at least: on a four-stroke that is more than one turn of the crankshaft.',
        },
        judge: (choice) => judgeWith({ crankTurns: Number(choice) }),
      };
    }
    default:
      return null;
  }
}
