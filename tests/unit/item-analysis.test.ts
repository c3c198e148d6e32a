import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { corr } from 'mathjs';
import { mean, sampleCorrelation, standardDeviation } from 'simple-statistics';
import { analyseItems, groupSizeFor, type Answer } from '~/lib/results/item-analysis';

// The worked class of 30 from CHECK-VALUES.md ("Item analysis", item-analysis teaching handouts):
// ten filler steps set the ranking (learners 0–14 right on all ten, 15–29 on none), then
//   step A: right for learners 0–23 (24 of 30)
//   step B: right for learners 0–11 (12 of 30)
//   step C: right for the whole upper half (0–14) and 5 of the lower half (15–19)
const A = 10;
const B = 11;
const C = 12;
const worked: Answer[][] = Array.from({ length: 30 }, (_, i) => [
  ...Array.from({ length: 10 }, (): Answer => (i < 15 ? 1 : 0)),
  i < 24 ? 1 : 0,
  i < 12 ? 1 : 0,
  i < 20 ? 1 : 0,
]);
const column = (m: Answer[][], j: number) => m.map((row) => row[j]!);

describe('item analysis against the worked values (CHECK-VALUES.md, item-analysis teaching handouts)', () => {
  const result = analyseItems(worked);

  it('difficulty p = share right: 24 of 30 → .80, 12 of 30 → .40', () => {
    // Source: item-analysis teaching handouts, as quoted in CHECK-VALUES.md "Item analysis".
    expect(result.items[A]!.p).toBeCloseTo(0.8, 12);
    expect(result.items[B]!.p).toBeCloseTo(0.4, 12);
    expect(result.items[A]!.missed).toBeCloseTo(0.2, 12);
    expect(result.items[B]!.correct).toBe(12);
  });

  it('discrimination D = (15 − 5) / 15 = .67 with upper and lower halves of 15', () => {
    // Source: item-analysis teaching handouts, as quoted in CHECK-VALUES.md "Item analysis".
    expect(result.groupSize).toBe(15);
    expect(result.items[C]!.upperCorrect).toBe(15);
    expect(result.items[C]!.lowerCorrect).toBe(5);
    expect(result.items[C]!.d).toBeCloseTo(0.67, 2);
    expect(result.items[C]!.d).toBeCloseTo(10 / 15, 12);
  });

  it('r_pb = (M_p − M_q)/S_t · √(p·q) with simple-statistics means and population SD (reference library)', () => {
    // Formula from CHECK-VALUES.md "Item analysis"; means and SDs from simple-statistics (npm), the
    // reference it names. S_t is the population SD (standardDeviation divides by n).
    for (const j of [A, B, C]) {
      const item = column(worked, j);
      const right = result.totals.filter((_, i) => item[i] === 1);
      const wrong = result.totals.filter((_, i) => item[i] === 0);
      const p = right.length / item.length;
      const expected = ((mean(right) - mean(wrong)) / standardDeviation(result.totals)) * Math.sqrt(p * (1 - p));
      expect(result.items[j]!.rpb).toBeCloseTo(expected, 12);
    }
  });

  it('r_pb equals Pearson r of the 0/1 step and the total (simple-statistics sampleCorrelation, mathjs corr)', () => {
    // With the population SD in the formula, r_pb is Pearson's r; sampleCorrelation's n − 1 cancels
    // between covariance and SDs, so it needs no convention. mathjs (npm) is a second, independent check.
    for (const j of [A, B, C]) {
      const item = column(worked, j);
      expect(result.items[j]!.rpb).toBeCloseTo(sampleCorrelation(item, result.totals), 12);
      expect(result.items[j]!.rpb).toBeCloseTo(corr(item, result.totals) as number, 12);
    }
  });

  it('a class of four worked by hand: r_pb = 2/√5', () => {
    // Totals 3, 2, 1, 0; the first step right for the two strongest. M_p = 2.5, M_q = 0.5,
    // S_t = √1.25 (population), p = q = .5: r_pb = (2/√1.25)·.5 = 2/√5 ≈ .894 (worked here by hand).
    const four: Answer[][] = [
      [1, 1, 1],
      [1, 1, 0],
      [0, 1, 0],
      [0, 0, 0],
    ];
    const r = analyseItems(four);
    expect(r.totals).toEqual([3, 2, 1, 0]);
    expect(r.sdTotal).toBeCloseTo(Math.sqrt(1.25), 12);
    expect(r.items[0]!.rpb).toBeCloseTo(2 / Math.sqrt(5), 12);
    // Halves of 2: the first step is right for both upper learners and neither lower one.
    expect(r.items[0]!.d).toBe(1);
  });

  it('any class: r_pb is Pearson r whenever it is defined (property, against simple-statistics)', () => {
    const matrix = fc.integer({ min: 2, max: 40 }).chain((n) =>
      fc.integer({ min: 1, max: 8 }).chain((k) => fc.array(fc.array(fc.constantFrom<Answer>(0, 1), { minLength: k, maxLength: k }), { minLength: n, maxLength: n })),
    );
    fc.assert(
      fc.property(matrix, (m) => {
        const r = analyseItems(m);
        r.items.forEach((item, j) => {
          if (item.rpb === null) return;
          expect(item.rpb).toBeCloseTo(sampleCorrelation(column(m, j), r.totals), 9);
        });
      }),
      { numRuns: 200 },
    );
  });
});

describe('item analysis edge cases', () => {
  it('a step everyone got right: p 1, D 0, r_pb undefined (null)', () => {
    const r = analyseItems([
      [1, 1],
      [1, 0],
      [1, 0],
      [1, 1],
    ]);
    expect(r.items[0]).toMatchObject({ correct: 4, p: 1, missed: 0, d: 0, rpb: null });
  });

  it('a step no one got right: p 0, D 0, r_pb null', () => {
    const r = analyseItems([
      [0, 1],
      [0, 0],
    ]);
    expect(r.items[0]).toMatchObject({ p: 0, d: 0, rpb: null });
  });

  it('r_pb is null when every total is the same (S_t = 0), even though the step varies', () => {
    const r = analyseItems([
      [1, 0],
      [0, 1],
    ]);
    expect(r.sdTotal).toBe(0);
    expect(r.items[0]!.p).toBe(0.5);
    expect(r.items[0]!.rpb).toBeNull();
  });

  it('one learner: p only; no groups, D and r_pb null', () => {
    const r = analyseItems([[1, 0]]);
    expect(r.groupSize).toBe(0);
    expect(r.items[0]).toMatchObject({ p: 1, d: null, rpb: null, upperCorrect: null });
    expect(r.items[1]).toMatchObject({ p: 0, missed: 1, d: null, rpb: null });
  });

  it('no learners: the steps are still listed, with nothing computed', () => {
    const r = analyseItems([], { items: 3 });
    expect(r.items).toHaveLength(3);
    expect(r.items[0]).toEqual({ correct: 0, p: null, missed: null, upperCorrect: null, lowerCorrect: null, d: null, rpb: null });
    expect(r.meanTotal).toBeNull();
  });

  it('group sizes: halves of 30 are 15, 27 % of 30 is 8, an odd class leaves its middle learner out', () => {
    expect(groupSizeFor(30, 0.5)).toBe(15);
    expect(groupSizeFor(30, 0.27)).toBe(8); // Kelley's 27 %, rounded: 8.1 → 8
    expect(groupSizeFor(7, 0.5)).toBe(3);
    expect(groupSizeFor(3, 0.27)).toBe(1); // at least one learner a group
    expect(groupSizeFor(1, 0.5)).toBe(0);
    const r = analyseItems(worked, { groupShare: 0.27 });
    expect(r.upper).toHaveLength(8);
    expect(r.lower).toHaveLength(8);
    // Step C with groups of 8: all 8 upper learners right; the lowest 8 (22–29) all wrong.
    expect(r.items[C]!.d).toBe(1);
  });

  it('ties keep the order given, so the same input always gives the same groups', () => {
    const tied: Answer[][] = [[1], [0], [1], [0]];
    const r = analyseItems(tied);
    expect(r.ranking).toEqual([0, 2, 1, 3]);
    expect(r.upper).toEqual([0, 2]);
    expect(r.lower).toEqual([1, 3]);
  });

  it('refuses a group share outside (0, .5] and rows of different lengths', () => {
    expect(() => analyseItems(worked, { groupShare: 0.6 })).toThrow(RangeError);
    expect(() => analyseItems(worked, { groupShare: 0 })).toThrow(RangeError);
    expect(() => analyseItems([[1, 0], [1]])).toThrow(RangeError);
  });
});
