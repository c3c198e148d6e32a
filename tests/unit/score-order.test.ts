import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { scoreOrder } from '~/lib/scoring/order';
import { nearestLinearExtension } from '~/lib/scoring/kendall';
import { SUMP_MINI_ORDER, sumpMini } from './fixtures/sump-mini';
import { dagArb, dagWithExtensionArb, procedureFromDag, stepText } from './fixtures/random-dag';

// Scoring rule (this project's): marks = floor(placed × (1 − d / pairs)) − stray entries, d = Kendall
// distance to the nearest valid order; full marks for any order that keeps every rule.

describe('scoreOrder on the sump job', () => {
  it('gives full marks for the listed order', () => {
    const s = scoreOrder(sumpMini(), { sequence: SUMP_MINI_ORDER });
    expect(s).toMatchObject({ stage: 'order', score: 7, maxScore: 7, passed: true });
    expect(s.results.every((r) => r.ok)).toBe(true);
    expect(s.results.map((r) => r.key)).toEqual(SUMP_MINI_ORDER);
  });

  it('gives full marks for a different valid order', () => {
    const seq = ['lube', 'pin-b', 'check-seal', 'pin-a', 'fit-gasket', 'seat-sump', 'start-bolts'];
    expect(scoreOrder(sumpMini(), { sequence: seq })).toMatchObject({ score: 7, passed: true });
  });

  it('names the step that came too early and the rule it broke', () => {
    const seq = ['check-seal', 'pin-a', 'fit-gasket', 'pin-b', 'lube', 'seat-sump', 'start-bolts'];
    const s = scoreOrder(sumpMini(), { sequence: seq });
    // Hand count: one swap (gasket ↔ pin B); floor(7 × (1 − 1/21)) = floor(6.67) = 6
    expect(s.score).toBe(6);
    expect(s.passed).toBe(false);
    const gasket = s.results.find((r) => r.key === 'fit-gasket')!;
    expect(gasket).toEqual({
      key: 'fit-gasket',
      ok: false,
      message: '“Fit the new gasket” came before “Seat dowel pin B” (needs: “Seat dowel pin A”, “Seat dowel pin B”)',
    });
    expect(s.results.filter((r) => !r.ok).map((r) => r.key)).toEqual(['fit-gasket']);
    expect(s.notes).toContain('1 swap of neighbouring steps from the nearest correct order');
    expect(s.notes).toContain('Order marks: 7 placed × (1 − 1/21) = 6.67, rounded down to 6');
  });

  it('reports a left-out step and the steps that needed it', () => {
    const seq = SUMP_MINI_ORDER.filter((k) => k !== 'pin-a');
    const s = scoreOrder(sumpMini(), { sequence: seq });
    // 6 placed, in a valid order among themselves: 6 marks of 7
    expect(s).toMatchObject({ score: 6, maxScore: 7, passed: false });
    expect(s.results.find((r) => r.key === 'pin-a')).toEqual({
      key: 'pin-a',
      ok: false,
      message: '“Seat dowel pin A”: left out of the sequence',
    });
    expect(s.results.find((r) => r.key === 'fit-gasket')!.message).toBe(
      '“Fit the new gasket” needs “Seat dowel pin A”, which was left out',
    );
  });

  it('reports unknown and repeated entries instead of throwing, one mark each', () => {
    const seq = ['check-seal', 'check-seal', 'bogus-step', ...SUMP_MINI_ORDER.slice(1)];
    const s = scoreOrder(sumpMini(), { sequence: seq });
    expect(s).toMatchObject({ score: 5, maxScore: 7, passed: false });
    expect(s.results.find((r) => r.key === 'bogus-step')).toEqual({
      key: 'bogus-step',
      ok: false,
      message: '"bogus-step" is not a step of this procedure',
    });
    expect(s.results.find((r) => r.key === 'check-seal')!.message).toBe(
      '“Check the sump oil seal” was placed 2 times; only the first counts',
    );
    expect(s.notes).toContain('2 stray entries (unknown or repeated) cost one mark each');
  });

  it('scores an empty sequence as zero with every step left out', () => {
    const s = scoreOrder(sumpMini(), { sequence: [] });
    expect(s).toMatchObject({ score: 0, maxScore: 7, passed: false });
    expect(s.results).toHaveLength(7);
    expect(s.results.every((r) => !r.ok && r.message.endsWith('left out of the sequence'))).toBe(true);
  });

  it('scales a reversed order by its distance to the nearest valid order', () => {
    const seq = [...SUMP_MINI_ORDER].reverse();
    const s = scoreOrder(sumpMini(), { sequence: seq });
    const d = nearestLinearExtension(seq, sumpMini().steps).distance;
    expect(d).toBeGreaterThan(0);
    expect(s.score).toBe(Math.floor((7 * (21 - d)) / 21));
    expect(s.passed).toBe(false);
  });
});

describe('scoreOrder properties (random DAGs)', () => {
  it('gives every linear extension full marks', () => {
    fc.assert(
      fc.property(dagWithExtensionArb(1, 12), ({ dag, order }) => {
        const p = procedureFromDag(dag);
        const s = scoreOrder(p, { sequence: order });
        expect(s.score).toBe(p.steps.length);
        expect(s.maxScore).toBe(p.steps.length);
        expect(s.passed).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it('takes marks off for swapping a step with one it needs, and names both', () => {
    fc.assert(
      fc.property(dagWithExtensionArb(2, 12), fc.nat(), ({ dag, order }, pick) => {
        const needs = new Map(dag.steps.map((s) => [s.key, s.after] as const));
        const swappable = order.slice(0, -1).flatMap((k, i) => (needs.get(order[i + 1]!)!.includes(k) ? [i] : []));
        fc.pre(swappable.length > 0);
        const i = swappable[pick % swappable.length]!;
        const seq = [...order];
        [seq[i], seq[i + 1]] = [seq[i + 1]!, seq[i]!];
        const s = scoreOrder(procedureFromDag(dag), { sequence: seq });
        expect(s.score).toBeLessThan(s.maxScore);
        expect(s.passed).toBe(false);
        const early = seq[i]!;
        const needed = seq[i + 1]!;
        const r = s.results.find((x) => x.key === early)!;
        expect(r.ok).toBe(false);
        const ix = (k: string) => Number(k.slice(1));
        expect(r.message).toContain(`“${stepText(ix(early))}” came before`);
        expect(r.message).toContain(`“${stepText(ix(needed))}”`);
      }),
      { numRuns: 300 },
    );
  });

  it('is deterministic and never outside 0..maxScore for any sequence', () => {
    fc.assert(
      fc.property(
        dagArb(1, 10).chain((dag) =>
          fc.tuple(
            fc.constant(dag),
            fc.array(fc.oneof(fc.constantFrom(...dag.steps.map((s) => s.key)), fc.constant('bogus')), { maxLength: 14 }),
          ),
        ),
        ([dag, seq]) => {
          const p = procedureFromDag(dag);
          const a = scoreOrder(p, { sequence: seq });
          const b = scoreOrder(procedureFromDag(dag), { sequence: [...seq] });
          expect(a).toEqual(b);
          expect(a.score).toBeGreaterThanOrEqual(0);
          expect(a.score).toBeLessThanOrEqual(a.maxScore);
          // Passed exactly when the sequence is a clean, complete, valid order.
          const clean = new Set(seq).size === seq.length && seq.length === p.steps.length && !seq.includes('bogus');
          if (a.passed) expect(clean && a.score === a.maxScore).toBe(true);
          if (clean) {
            const d = nearestLinearExtension(seq, p.steps).distance;
            expect(a.passed).toBe(d === 0);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
