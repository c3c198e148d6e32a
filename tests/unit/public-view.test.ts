import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { mulberry32, seededShuffle, toPublicProcedure } from '~/lib/procedure/public-view';
import { procedureSchema } from '~/lib/procedure/schema';
import { sumpMini, sumpMiniInput } from './fixtures/sump-mini';

/** Every object key anywhere in a JSON value. */
function allKeys(value: unknown, out = new Set<string>()): Set<string> {
  if (Array.isArray(value)) value.forEach((v) => allKeys(v, out));
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      out.add(k);
      allKeys(v, out);
    }
  }
  return out;
}

describe('toPublicProcedure', () => {
  const view = toPublicProcedure(sumpMini(), 'learner-7:attempt-1');

  it('carries none of the answers', () => {
    const keys = allKeys(JSON.parse(JSON.stringify(view)));
    for (const secret of ['after', 'decoy', 'pinSeats', 'passes', 'finalCheck', 'rule']) expect(keys.has(secret)).toBe(false);
    expect(JSON.stringify(view)).not.toContain('0.5');
  });

  it('shows the decoy pin like any other part', () => {
    const decoy = view.parts.find((p) => p.key === 'dowel-10')!;
    const real = view.parts.find((p) => p.key === 'dowel-8')!;
    expect(Object.keys(decoy).sort()).toEqual(Object.keys(real).sort());
    expect(decoy.pin).toEqual({ diameterMm: 10, lengthMm: 14 });
  });

  it('keeps every part, anchor and step, with the step texts and parts', () => {
    const p = sumpMini();
    expect(view.parts.map((x) => x.key).sort()).toEqual(p.parts.map((x) => x.key).sort());
    expect(view.anchors).toEqual(p.anchors);
    expect(view.steps.map((s) => s.key).sort()).toEqual(p.steps.map((s) => s.key).sort());
    expect(view.steps.find((s) => s.key === 'seat-sump')).toEqual({
      key: 'seat-sump',
      text: 'Seat the sump while turning the crankshaft',
      parts: ['sump'],
      caution: 'Keep fingers clear of the mating faces.',
    });
  });

  it('gives bolts their hole positions and only the number of passes', () => {
    const g = view.fastenerGroups[0]!;
    expect(g.passCount).toBe(2);
    expect(g.bolts.map((b) => b.key).sort()).toEqual(['b1', 'b2', 'b3', 'b4']);
    expect(g.bolts.find((b) => b.key === 'b2')).toEqual({ key: 'b2', anchor: 'h2', position: [0, 0.07, 0] });
  });

  it('hides the group torque when the Wrench stage asks for it, and shows the spec converted', () => {
    expect(view.fastenerGroups[0]!.torque).toBeUndefined();
    expect(view.wrench!.spec.unit).toBe('ft·lbf');
    // NIST SP 811 (2008), App. B.9: 1 N·m = 0.7375621492772654 lbf·ft → 11 N·m = 8.11318364205 ft·lbf
    expect(view.wrench!.spec.value).toBeCloseTo(11 * 0.7375621492772654, 10);
    expect(view.wrench).toMatchObject({ group: 'sump-bolts', dialUnit: 'in·lbf', wrenchLength: 10, extension: 0 });
  });

  it('shows the group torque when there is no Wrench stage', () => {
    const input = sumpMiniInput();
    input.stages = ['order', 'pattern'];
    const v = toPublicProcedure(procedureSchema.parse(input), 'x');
    expect(v.fastenerGroups[0]!.torque).toEqual({ value: 11, unit: 'N·m', tolerancePct: 10 });
  });

  it('shuffles the same way for the same seed and differently across seeds', () => {
    expect(toPublicProcedure(sumpMini(), 'learner-7:attempt-1')).toEqual(view);
    const orders = new Set(['a', 'b', 'c', 'd', 'e', 'f'].map((seed) => toPublicProcedure(sumpMini(), seed).steps.map((s) => s.key).join()));
    expect(orders.size).toBeGreaterThan(1);
  });
});

describe('seeded shuffle', () => {
  it('is a permutation and repeatable', () => {
    fc.assert(
      fc.property(fc.array(fc.integer()), fc.string(), (items, seed) => {
        const a = seededShuffle(items, seed);
        expect([...a].sort((x, y) => x - y)).toEqual([...items].sort((x, y) => x - y));
        expect(seededShuffle(items, seed)).toEqual(a);
      }),
    );
  });

  it('draws numbers in [0, 1) and puts each item first about equally often', () => {
    const random = mulberry32(42);
    for (let i = 0; i < 1000; i++) {
      const x = random();
      expect(x).toBeGreaterThanOrEqual(0);
      expect(x).toBeLessThan(1);
    }
    // 4000 seeds over 4 items: each should lead ~1000 times; ±200 is over 7 standard deviations (√750 ≈ 27).
    const firsts = [0, 0, 0, 0];
    for (let s = 0; s < 4000; s++) firsts[seededShuffle([0, 1, 2, 3], `seed-${s}`)[0]!]!++;
    for (const count of firsts) expect(Math.abs(count - 1000)).toBeLessThan(200);
  });
});
