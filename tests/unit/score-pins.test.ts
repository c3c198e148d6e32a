import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { scorePins } from '~/lib/scoring/pins';
import { procedureSchema } from '~/lib/procedure/schema';
import { sumpMini, sumpMiniInput } from './fixtures/sump-mini';

// Scoring rule (this project's): one mark per seat holding its own pin and nothing else, one per decoy
// pin left in the kit, minus one per stray line; a pin's diameter must match its hole.

const right = [
  { part: 'dowel-8', anchor: 'loc-a' },
  { part: 'dowel-8', anchor: 'loc-b' },
];

describe('scorePins', () => {
  it('gives full marks for both 8 mm pins in their holes and the decoy left out', () => {
    const s = scorePins(sumpMini(), { placements: right });
    expect(s).toMatchObject({ stage: 'pins', score: 3, maxScore: 3, passed: true });
    expect(s.results).toEqual([
      { key: 'loc-a', ok: true, message: 'Dowel pin 8 × 12 mm seated in locating hole loc-a' },
      { key: 'loc-b', ok: true, message: 'Dowel pin 8 × 12 mm seated in locating hole loc-b' },
      { key: 'dowel-10', ok: true, message: 'Dowel pin 10 × 14 mm left in the kit: it is not for this job' },
    ]);
  });

  it('refuses a pin whose diameter does not match the hole (the decoy)', () => {
    const s = scorePins(sumpMini(), { placements: [right[0]!, { part: 'dowel-10', anchor: 'loc-b' }] });
    // Seat loc-b wrong and the decoy used: 1 of 3
    expect(s).toMatchObject({ score: 1, passed: false });
    expect(s.results.find((r) => r.key === 'loc-b')!.message).toBe(
      'locating hole loc-b: Dowel pin 10 × 14 mm is 10 mm across; this hole takes 8 mm',
    );
    expect(s.results.find((r) => r.key === 'dowel-10')!.ok).toBe(false);
  });

  it('explains a same-diameter pin of the wrong length', () => {
    const input = sumpMiniInput();
    input.parts.push({ key: 'dowel-8-long', name: 'Dowel pin 8 × 20 mm', kind: 'dowel-pin', model: 'dowel-pin', pin: { diameterMm: 8, lengthMm: 20 }, decoy: true });
    const s = scorePins(procedureSchema.parse(input), { placements: [right[0]!, { part: 'dowel-8-long', anchor: 'loc-b' }] });
    expect(s.results.find((r) => r.key === 'loc-b')!.message).toBe(
      'locating hole loc-b: Dowel pin 8 × 20 mm is 20 mm long; this hole takes a 12 mm pin',
    );
    // 2 seats + 2 decoys; loc-a right, dowel-10 left out = 2 of 4
    expect(s).toMatchObject({ score: 2, maxScore: 4 });
  });

  it('flags a pin in a threaded hole and takes a mark for it', () => {
    const s = scorePins(sumpMini(), { placements: [...right, { part: 'dowel-10', anchor: 'h1' }] });
    // 2 seats right, decoy used (0), stray in h1 (−1) = 1
    expect(s).toMatchObject({ score: 1, passed: false });
    const h1 = s.results.find((r) => r.key === 'h1')!;
    expect(h1.ok).toBe(false);
    expect(h1.message).toContain('threaded hole h1');
    expect(h1.message).toContain('crushes the pin');
  });

  it('refuses two pins in one hole and reports the empty one', () => {
    const s = scorePins(sumpMini(), { placements: [right[0]!, right[0]!] });
    expect(s.results.find((r) => r.key === 'loc-a')!.message).toBe(
      '2 pins in locating hole loc-a (Dowel pin 8 × 12 mm, Dowel pin 8 × 12 mm); a hole takes one pin',
    );
    expect(s.results.find((r) => r.key === 'loc-b')!.message).toBe('locating hole loc-b (8 mm) was left empty');
    // Only the decoy mark remains
    expect(s).toMatchObject({ score: 1, passed: false });
  });

  it('counts a pin used more often than the kit holds', () => {
    const s = scorePins(sumpMini(), { placements: [...right, { part: 'dowel-8', anchor: 'h2' }] });
    expect(s.results.find((r) => r.key === 'dowel-8')).toEqual({
      key: 'dowel-8',
      ok: false,
      message: 'Dowel pin 8 × 12 mm used 3 times; the kit holds 2',
    });
    // 3 marks − stray in h2 − overuse = 1
    expect(s.score).toBe(1);
  });

  it('reports unknown parts and holes without throwing', () => {
    const s = scorePins(sumpMini(), {
      placements: [
        { part: 'mystery-pin', anchor: 'loc-a' },
        { part: 'dowel-8', anchor: 'nowhere' },
        { part: 'flange-bolt', anchor: 'h3' },
        { part: 'dowel-8', anchor: 'main-bearing' },
      ],
    });
    const msg = (k: string) => s.results.find((r) => r.key === k)!.message;
    expect(msg('loc-a')).toBe('locating hole loc-a: there is no part "mystery-pin" in the kit');
    expect(msg('nowhere')).toBe('there is no hole "nowhere" on this engine (Dowel pin 8 × 12 mm)');
    expect(msg('h3')).toBe('Flange bolt M6 in h3: this stage seats pins only');
    expect(msg('main-bearing')).toBe('bearing main-bearing is not a hole for a pin (Dowel pin 8 × 12 mm)');
    expect(s.score).toBe(0);
    expect(s.passed).toBe(false);
  });

  it('is deterministic and stays within 0..maxScore for any placements', () => {
    const parts = ['dowel-8', 'dowel-10', 'flange-bolt', 'nope'];
    const holes = ['loc-a', 'loc-b', 'h1', 'h4', 'main-bearing', 'nowhere'];
    fc.assert(
      fc.property(
        fc.array(fc.record({ part: fc.constantFrom(...parts), anchor: fc.constantFrom(...holes) }), { maxLength: 8 }),
        (placements) => {
          const a = scorePins(sumpMini(), { placements });
          expect(scorePins(sumpMini(), { placements: placements.map((x) => ({ ...x })) })).toEqual(a);
          expect(a.score).toBeGreaterThanOrEqual(0);
          expect(a.score).toBeLessThanOrEqual(a.maxScore);
          expect(a.maxScore).toBe(3);
          expect(a.passed).toBe(a.results.every((r) => r.ok));
        },
      ),
    );
  });
});
