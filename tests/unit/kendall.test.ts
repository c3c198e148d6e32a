import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  greedyLinearExtension,
  kendallTauDistance,
  nearestLinearExtension,
  normalisedKendallDistance,
} from '~/lib/scoring/kendall';
import { isLinearExtension } from '~/lib/procedure/graph';
import { dagArb, permutations } from './fixtures/random-dag';

/** Discordant pairs counted one by one, straight from the definition. */
function pairCount<T>(a: readonly T[], b: readonly T[]): number {
  const pos = new Map(b.map((x, i) => [x, i] as const));
  let d = 0;
  for (let i = 0; i < a.length; i++) for (let j = i + 1; j < a.length; j++) if (pos.get(a[i]!)! > pos.get(a[j]!)!) d++;
  return d;
}

describe('kendallTauDistance', () => {
  it('matches the worked example: 1-2-3-4-5 vs 3-4-1-2-5', () => {
    // Wikipedia, "Kendall tau distance", example: distance 4, normalised 0.4
    expect(kendallTauDistance([1, 2, 3, 4, 5], [3, 4, 1, 2, 5])).toBe(4);
    expect(normalisedKendallDistance([1, 2, 3, 4, 5], [3, 4, 1, 2, 5])).toBeCloseTo(0.4, 12);
  });

  it('matches the textbook example: 0 3 1 6 2 5 4 vs 1 0 3 6 4 2 5', () => {
    // Sedgewick & Wayne, Algorithms 4th ed., §2.5 (Kendall tau distance): 4
    expect(kendallTauDistance([0, 3, 1, 6, 2, 5, 4], [1, 0, 3, 6, 4, 2, 5])).toBe(4);
  });

  it('is 0 for the same order and n(n−1)/2 for the reverse', () => {
    // Definition (Kendall 1938): every pair of a reversed ranking is discordant
    const items = ['a', 'b', 'c', 'd', 'e', 'f'];
    expect(kendallTauDistance(items, items)).toBe(0);
    expect(kendallTauDistance(items, [...items].reverse())).toBe(15);
    expect(normalisedKendallDistance(items, [...items].reverse())).toBe(1);
    expect(normalisedKendallDistance(['a'], ['a'])).toBe(0);
  });

  it('refuses orderings of different items', () => {
    expect(() => kendallTauDistance(['a', 'b'], ['a', 'c'])).toThrow(RangeError);
    expect(() => kendallTauDistance(['a', 'b'], ['a'])).toThrow(RangeError);
    expect(() => kendallTauDistance(['a', 'a'], ['a', 'a'])).toThrow(RangeError);
  });

  it('merge counting agrees with counting every pair (random permutations up to 64)', () => {
    // Definition: the number of discordant pairs
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 64 }).chain((n) =>
          fc.tuple(
            fc.shuffledSubarray([...Array(n).keys()], { minLength: n, maxLength: n }),
            fc.shuffledSubarray([...Array(n).keys()], { minLength: n, maxLength: n }),
          ),
        ),
        ([a, b]) => {
          const d = kendallTauDistance(a, b);
          expect(d).toBe(pairCount(a, b));
          expect(kendallTauDistance(b, a)).toBe(d);
        },
      ),
    );
  });
});

describe('nearestLinearExtension', () => {
  const sump = [
    { key: 'pin-a', after: [] },
    { key: 'pin-b', after: [] },
    { key: 'fit-gasket', after: ['pin-a', 'pin-b'] },
    { key: 'seat-sump', after: ['fit-gasket'] },
  ];

  it('keeps a sequence that is already valid', () => {
    const seq = ['pin-b', 'pin-a', 'fit-gasket', 'seat-sump'];
    expect(nearestLinearExtension(seq, sump)).toEqual({ order: seq, distance: 0, method: 'exact' });
  });

  it('moves a step that came too early by the fewest swaps', () => {
    // Hand count: gasket before pin-b; one swap of neighbours fixes it
    const r = nearestLinearExtension(['pin-a', 'fit-gasket', 'pin-b', 'seat-sump'], sump);
    expect(r).toEqual({ order: ['pin-a', 'pin-b', 'fit-gasket', 'seat-sump'], distance: 1, method: 'exact' });
    // Hand count: fully reversed, the nearest valid order keeps the pins in the learner's order (b, a): 5 of 6 pairs
    const rev = nearestLinearExtension(['seat-sump', 'fit-gasket', 'pin-b', 'pin-a'], sump);
    expect(rev.order).toEqual(['pin-b', 'pin-a', 'fit-gasket', 'seat-sump']);
    expect(rev.distance).toBe(5);
  });

  it('beats the greedy order where greedy is not optimal', () => {
    // Hand count: b1 and b2 both wait for a; the learner put them first and a last.
    const steps = [
      { key: 'a', after: [] },
      { key: 'b1', after: ['a'] },
      { key: 'b2', after: ['a'] },
      { key: 'c', after: [] },
    ];
    const seq = ['b1', 'b2', 'c', 'a'];
    // Greedy takes c (the first ready step), then a, b1, b2: pairs c–b1, c–b2, a–b1, a–b2 flip → 4.
    expect(greedyLinearExtension(seq, steps)).toEqual({ order: ['c', 'a', 'b1', 'b2'], distance: 4, method: 'greedy' });
    // Moving a alone to the front flips only a–b1, a–b2, a–c → 3.
    expect(nearestLinearExtension(seq, steps)).toEqual({ order: ['a', 'b1', 'b2', 'c'], distance: 3, method: 'exact' });
  });

  it('falls back to the greedy order when the state budget runs out, and says so', () => {
    const steps = [
      { key: 'a', after: [] },
      { key: 'b', after: ['a'] },
      { key: 'c', after: [] },
      { key: 'd', after: ['c'] },
    ];
    const seq = ['b', 'd', 'a', 'c'];
    const r = nearestLinearExtension(seq, steps, 0);
    expect(r.method).toBe('greedy');
    expect(isLinearExtension(r.order, steps)).toBe(true);
    expect(r).toEqual(greedyLinearExtension(seq, steps));
  });

  it('solves a long procedure-shaped DAG exactly (three chains of 15 joined at the end)', () => {
    const steps: { key: string; after: string[] }[] = [];
    for (const chain of ['a', 'b', 'c']) {
      for (let i = 0; i < 15; i++) steps.push({ key: `${chain}${i}`, after: i === 0 ? [] : [`${chain}${i - 1}`] });
    }
    steps.push({ key: 'end', after: ['a14', 'b14', 'c14'] });
    // Learner interleaves the chains but runs each one backwards.
    const seq: string[] = [];
    for (let i = 14; i >= 0; i--) seq.push(`a${i}`, `b${i}`, `c${i}`);
    seq.push('end');
    const r = nearestLinearExtension(seq, steps);
    expect(r.method).toBe('exact');
    expect(isLinearExtension(r.order, steps)).toBe(true);
    expect(r.distance).toBe(kendallTauDistance(r.order, seq));
    expect(r.distance).toBeLessThanOrEqual(greedyLinearExtension(seq, steps).distance);
  });

  it('returns a valid order at its stated distance, never worse than greedy (random DAGs up to 14 steps)', () => {
    fc.assert(
      fc.property(
        dagArb(1, 14).chain((dag) =>
          fc.tuple(fc.constant(dag), fc.shuffledSubarray(dag.steps.map((s) => s.key), { minLength: dag.steps.length, maxLength: dag.steps.length })),
        ),
        ([dag, seq]) => {
          const r = nearestLinearExtension(seq, dag.steps);
          expect(isLinearExtension(r.order, dag.steps)).toBe(true);
          expect(r.distance).toBe(kendallTauDistance(r.order, seq));
          expect(r.distance).toBeLessThanOrEqual(greedyLinearExtension(seq, dag.steps).distance);
          expect(r.method).toBe('exact');
        },
      ),
      { numRuns: 200 },
    );
  });

  it('equals brute force over all permutations (random DAGs, n ≤ 7)', () => {
    fc.assert(
      fc.property(
        dagArb(1, 7).chain((dag) =>
          fc.tuple(fc.constant(dag), fc.shuffledSubarray(dag.steps.map((s) => s.key), { minLength: dag.steps.length, maxLength: dag.steps.length })),
        ),
        ([dag, seq]) => {
          const valid = permutations(seq).filter((o) => isLinearExtension(o, dag.steps));
          const best = Math.min(...valid.map((o) => kendallTauDistance(o, seq)));
          expect(nearestLinearExtension(seq, dag.steps).distance).toBe(best);
        },
      ),
      { numRuns: 300 },
    );
  });
});
