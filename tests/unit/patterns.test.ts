import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  boltLabel,
  checkSequence,
  crossPattern,
  exampleSequence,
  fitCircle,
  isOnCircle,
  nextBolts,
  projectOntoPlane,
  type BoltPosition,
  type PatternRule,
} from '~/lib/patterns';

type P3 = [number, number, number];
const Z: P3 = [0, 0, 1];

/** n bolts keyed '1'…'n', numbered clockwise seen from +z, on a 60 mm radius circle. */
function boltCircle(n: number, radius = 0.06, start = Math.PI / 2): BoltPosition[] {
  return Array.from({ length: n }, (_, i) => {
    const a = start - (2 * Math.PI * i) / n;
    return { key: String(i + 1), position: [radius * Math.cos(a), radius * Math.sin(a), 0.012] as P3 };
  });
}

const asKeys = (order: number[]) => order.map(String);
const rotate = (order: number[], n: number, by: number) => order.map((k) => ((k - 1 + by) % n) + 1);
const mirror = (order: number[], n: number) => order.map((k) => ((n - (k - 1)) % n) + 1);

// Invented Wren 160 layouts (demo geometry, metres).
const HEAD_5: BoltPosition[] = [
  { key: 'h1', position: [0.035, 0.035, 0] },
  { key: 'h2', position: [-0.035, 0.035, 0] },
  { key: 'h3', position: [-0.035, -0.035, 0] },
  { key: 'h4', position: [0.035, -0.035, 0] },
  { key: 'h5', position: [0, 0.055, 0] },
];
const COVER_6: BoltPosition[] = [
  { key: 'c1', position: [-0.06, -0.03, 0] },
  { key: 'c2', position: [0, -0.03, 0] },
  { key: 'c3', position: [0.06, -0.03, 0] },
  { key: 'c4', position: [-0.06, 0.03, 0] },
  { key: 'c5', position: [0, 0.03, 0] },
  { key: 'c6', position: [0.06, 0.03, 0] },
];
const COVER_10: BoltPosition[] = [-0.1, -0.05, 0, 0.05, 0.1].flatMap((x, i) => [
  { key: `b${i + 1}`, position: [x, -0.03, 0] as P3 },
  { key: `t${i + 1}`, position: [x, 0.03, 0] as P3 },
]);

describe('crossPattern', () => {
  it.each([
    // from memory of ASME PCC-1 (legacy cross pattern)
    [4, [1, 3, 2, 4]],
    [8, [1, 5, 3, 7, 2, 6, 4, 8]],
    [12, [1, 7, 4, 10, 2, 8, 5, 11, 3, 9, 6, 12]],
    [16, [1, 9, 5, 13, 3, 11, 7, 15, 2, 10, 6, 14, 4, 12, 8, 16]],
  ])('%i bolts', (n, order) => {
    expect(crossPattern(n)).toEqual(order);
  });

  it('6 bolts go 1-4-2-5-3-6', () => {
    // common practice, no source
    expect(crossPattern(6)).toEqual([1, 4, 2, 5, 3, 6]);
  });

  it('8 and 16 are bit-reversal order + 1', () => {
    // from memory of ASME PCC-1, as noted in CHECK-VALUES
    const bitReverse = (i: number, bits: number) => parseInt(i.toString(2).padStart(bits, '0').split('').reverse().join(''), 2);
    expect(crossPattern(8)).toEqual(Array.from({ length: 8 }, (_, i) => bitReverse(i, 3) + 1));
    expect(crossPattern(16)).toEqual(Array.from({ length: 16 }, (_, i) => bitReverse(i, 4) + 1));
  });

  it('refuses a count below 1', () => {
    expect(() => crossPattern(0)).toThrow(RangeError);
    expect(() => crossPattern(2.5)).toThrow(RangeError);
  });
});

describe('checkSequence, cross rule on a bolt circle', () => {
  it.each([4, 8, 12, 16])('accepts the cross pattern for %i bolts, from every start bolt and both ways', (n) => {
    const bolts = boltCircle(n);
    for (let by = 0; by < n; by++) {
      // from memory of ASME PCC-1: the pattern is the same whichever bolt is numbered 1
      const turned = rotate(crossPattern(n), n, by);
      expect(checkSequence(bolts, Z, 'cross', asKeys(turned))).toEqual({ ok: true });
      expect(checkSequence(bolts, Z, 'cross', asKeys(mirror(turned, n)))).toEqual({ ok: true });
    }
  });

  it('accepts the cross pattern on a bolt circle tilted to any axis', () => {
    const axis: P3 = [1, 2, 2];
    // Build 8 points in the plane normal to (1, 2, 2)/3: u = (2, -1, 0)/√5, v = n × u.
    const n = [1 / 3, 2 / 3, 2 / 3];
    const u = [2 / Math.sqrt(5), -1 / Math.sqrt(5), 0];
    const v = [n[1]! * u[2]! - n[2]! * u[1]!, n[2]! * u[0]! - n[0]! * u[2]!, n[0]! * u[1]! - n[1]! * u[0]!];
    const bolts = boltCircle(8).map((b) => {
      const [x, y] = b.position;
      return { key: b.key, position: [0.1 + x * u[0]! + y * v[0]!, 0.2 + x * u[1]! + y * v[1]!, 0.3 + x * u[2]! + y * v[2]!] as P3 };
    });
    // from memory of ASME PCC-1
    expect(checkSequence(bolts, axis, 'cross', asKeys(crossPattern(8)))).toEqual({ ok: true });
    expect(checkSequence(bolts, axis, 'cross', asKeys([1, 2, 3, 4, 5, 6, 7, 8])).ok).toBe(false);
  });

  it('rejects a run around the circle and names the bolt that breaks the rule', () => {
    // from memory of ASME PCC-1: bolts are not run down in a circle
    const result = checkSequence(boltCircle(8), Z, 'cross', asKeys([1, 2, 3, 4, 5, 6, 7, 8]));
    expect(result).toMatchObject({ ok: false, index: 1, key: '2' });
    if (!result.ok) {
      expect(result.message).toContain('bolt 2 is not across the circle from bolt 1');
      expect(result.message).toContain('bolt 5');
    }
  });

  it('rejects a pair that starts next to the bolts already tightened', () => {
    // from memory of ASME PCC-1: after 1-5 the next pair is 3-7 (or 7-3)
    const result = checkSequence(boltCircle(8), Z, 'cross', asKeys([1, 5, 2, 6, 3, 7, 4, 8]));
    expect(result).toMatchObject({ ok: false, index: 2, key: '2' });
    if (!result.ok) expect(result.message).toMatch(/bolt 2 is close to bolt 1, already tightened.*bolt 3 or bolt 7/);
  });

  it('accepts every order the rule allows, not only the usual one (12 bolts)', () => {
    // 1-7-4-10 then 2-8, 3-9, 5-11, 6-12 are all 30° from the tightened bolts: any of them may come next.
    expect(checkSequence(boltCircle(12), Z, 'cross', asKeys([1, 7, 4, 10, 2, 8, 3, 9, 5, 11, 6, 12]))).toEqual({ ok: true });
    expect(checkSequence(boltCircle(12), Z, 'cross', asKeys([1, 7, 10, 4, 12, 6, 9, 3, 8, 2, 5, 11]))).toEqual({ ok: true });
  });

  it('still works for bolts drawn off the circle by a millimetre', () => {
    const bolts = boltCircle(8).map((b, i) => ({
      key: b.key,
      position: [b.position[0] + (i % 2 ? 0.001 : -0.0007), b.position[1] + (i % 3 ? 0.0005 : 0), 0] as P3,
    }));
    // from memory of ASME PCC-1
    expect(checkSequence(bolts, Z, 'cross', asKeys(crossPattern(8)))).toEqual({ ok: true });
  });
});

describe('checkSequence, key mistakes', () => {
  const bolts = boltCircle(4);

  it('reports a key that is not in the group', () => {
    expect(checkSequence(bolts, Z, 'cross', ['1', '3', '9', '4'])).toMatchObject({
      ok: false,
      index: 2,
      key: '9',
      message: '"9" is not a bolt in this group',
    });
  });

  it('reports a bolt tightened twice', () => {
    const result = checkSequence(bolts, Z, 'cross', ['1', '3', '1', '2', '4']);
    expect(result).toMatchObject({ ok: false, index: 2, key: '1' });
    if (!result.ok) expect(result.message).toBe('bolt 1 appears twice (positions 1 and 3); each bolt is tightened once per pass');
  });

  it('reports the bolts left out', () => {
    const result = checkSequence(bolts, Z, 'cross', ['1', '3']);
    expect(result).toMatchObject({ ok: false, index: 2, key: '2' });
    if (!result.ok) expect(result.message).toBe('the sequence leaves out bolt 2 and bolt 4; every bolt is tightened once per pass');
  });

  it('treats entries that are not strings as unknown keys', () => {
    expect(checkSequence(bolts, Z, 'cross', [1, '3', '2', '4'])).toMatchObject({ ok: false, index: 0, key: '1' });
  });

  it('refuses a zero axis and duplicate bolt keys', () => {
    expect(() => checkSequence(bolts, [0, 0, 0], 'cross', ['1'])).toThrow(RangeError);
    expect(() => checkSequence([...bolts, bolts[0]!], Z, 'cross', ['1'])).toThrow(RangeError);
  });
});

describe('checkSequence, opposite rule', () => {
  // common practice, no source: "each next bolt roughly opposite the last, working from the middle out"
  it('5-bolt head: the example sequence is accepted', () => {
    const order = exampleSequence(HEAD_5, Z, 'opposite');
    expect([...order].sort()).toEqual(['h1', 'h2', 'h3', 'h4', 'h5']);
    expect(order).toEqual(['h1', 'h3', 'h5', 'h4', 'h2']);
    expect(checkSequence(HEAD_5, Z, 'opposite', order)).toEqual({ ok: true });
  });

  it('5-bolt head: a same-side move is rejected', () => {
    // common practice, no source
    const result = checkSequence(HEAD_5, Z, 'opposite', ['h1', 'h5', 'h3', 'h4', 'h2']);
    expect(result).toMatchObject({ ok: false, index: 1, key: 'h5' });
    if (!result.ok) {
      expect(result.message).toMatch(
        /^bolt h5 follows bolt h1 on the same side; the next bolt should be across the part, roughly opposite bolt h1/,
      );
    }
  });

  it('5-bolt head: both the diagonal and the inner bolt across are accepted', () => {
    // common practice, no source: straight across, or across and nearer the middle
    expect(nextBolts(HEAD_5, Z, 'opposite', ['h1'])).toEqual(['h2', 'h3']);
  });

  it('6-bolt cover: not on a circle; starts in the middle and crosses', () => {
    // common practice, no source
    expect(isOnCircle(projectOntoPlane(COVER_6.map((b) => b.position), Z))).toBe(false);
    const order = exampleSequence(COVER_6, Z, 'opposite');
    expect(order.slice(0, 2)).toEqual(['c2', 'c5']);
    expect(checkSequence(COVER_6, Z, 'opposite', order)).toEqual({ ok: true });
    expect(checkSequence(COVER_6, Z, 'opposite', ['c5', 'c2', 'c4', 'c6', 'c1', 'c3'])).toEqual({ ok: true });
  });

  it('6-bolt cover: a same-side move is rejected', () => {
    // common practice, no source
    const result = checkSequence(COVER_6, Z, 'opposite', ['c2', 'c1', 'c5', 'c3', 'c4', 'c6']);
    expect(result).toMatchObject({ ok: false, index: 1, key: 'c1' });
    if (!result.ok) expect(result.message).toContain('bolt c1 follows bolt c2 on the same side');
  });

  it('6-bolt cover: starting at a corner is rejected', () => {
    // common practice, no source: work from the middle out
    const result = checkSequence(COVER_6, Z, 'opposite', ['c1', 'c6', 'c2', 'c5', 'c3', 'c4']);
    expect(result).toMatchObject({ ok: false, index: 0, key: 'c1' });
    if (!result.ok) expect(result.message).toMatch(/bolt c1 is out toward the edge.*bolt c2 or bolt c5/);
  });

  it('10-bolt cover: jumping out to a far corner is rejected', () => {
    // common practice, no source: work from the middle out
    const result = checkSequence(COVER_10, Z, 'opposite', ['b3', 't1']);
    expect(result).toMatchObject({ ok: false, index: 1, key: 't1' });
    if (!result.ok) expect(result.message).toMatch(/across from bolt b3 but neither straight across nor the nearest to the middle/);
    expect(checkSequence(COVER_10, Z, 'opposite', exampleSequence(COVER_10, Z, 'opposite'))).toEqual({ ok: true });
  });

  it('when nothing is left across, the most nearly opposite bolt is the one to take', () => {
    // Bolts clustered on one side after the others are done: the rule must still offer a next bolt.
    const bolts: BoltPosition[] = [
      { key: 'm', position: [0, 0, 0] },
      { key: 'e1', position: [0.05, 0.01, 0] },
      { key: 'e2', position: [0.05, -0.01, 0] },
      { key: 'w', position: [-0.1, 0, 0] },
    ];
    const order = exampleSequence(bolts, Z, 'opposite');
    expect(checkSequence(bolts, Z, 'opposite', order)).toEqual({ ok: true });
    expect(nextBolts(bolts, Z, 'opposite', ['e1', 'w', 'e2'])).toEqual(['m']);
  });
});

describe('example sequences and hints', () => {
  it.each([4, 6, 8, 10, 12, 16])('on an even bolt circle numbered clockwise the example is the usual cross pattern (%i)', (n) => {
    // from memory of ASME PCC-1 (4, 8, 12, 16); common practice, no source (6, 10)
    expect(exampleSequence(boltCircle(n), Z, 'cross')).toEqual(asKeys(crossPattern(n)));
  });

  it('nextBolts lists what may come next', () => {
    // from memory of ASME PCC-1: after 1-5 on 8 bolts, 3 or 7
    expect(nextBolts(boltCircle(8), Z, 'cross', ['1', '5'])).toEqual(['3', '7']);
    expect(nextBolts(boltCircle(8), Z, 'cross', ['1'])).toEqual(['5']);
    expect(nextBolts(boltCircle(8), Z, 'cross', asKeys(crossPattern(8)))).toEqual([]);
  });

  it('labels bolts plainly', () => {
    expect(boltLabel('bolt-3')).toBe('bolt 3');
    expect(boltLabel('7')).toBe('bolt 7');
    expect(boltLabel('h2')).toBe('bolt h2');
  });
});

describe('circle test', () => {
  it('finds the circle through bolts on a circle, in metres or millimetres', () => {
    const points = projectOntoPlane(boltCircle(5, 0.04).map((b) => b.position), Z);
    const fit = fitCircle(points);
    expect(fit?.radius).toBeCloseTo(0.04, 12);
    expect(isOnCircle(points)).toBe(true);
    expect(isOnCircle(points.map(([x, y]) => [x * 1000 + 250, y * 1000 - 40] as const))).toBe(true);
  });

  it('finds the circle when the bolts cover only part of it', () => {
    const arc = [0, 0.5, 1, 1.5].map((a) => [3 + 2 * Math.cos(a), -1 + 2 * Math.sin(a)] as const);
    const fit = fitCircle(arc);
    expect(fit?.center[0]).toBeCloseTo(3, 9);
    expect(fit?.center[1]).toBeCloseTo(-1, 9);
    expect(fit?.radius).toBeCloseTo(2, 9);
  });

  it('says no to a line, a single point and a rectangle', () => {
    expect(isOnCircle([[0, 0], [1, 1], [2, 2]])).toBe(false);
    expect(isOnCircle([[0, 0]])).toBe(false);
    expect(isOnCircle([[0, 0], [6, 0], [12, 0], [0, 6], [6, 6], [12, 6]])).toBe(false);
    expect(isOnCircle([[0, 0], [2, 0]])).toBe(true);
  });
});

describe('properties', () => {
  const coord = fc.double({ min: -0.2, max: 0.2, noNaN: true });
  const point = fc.tuple(coord, coord, coord);
  const axis = fc
    .tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }))
    .filter(([x, y, z]) => Math.hypot(x, y, z) > 0.1);
  const layout = fc.array(point, { minLength: 1, maxLength: 14 }).map((points) =>
    points.map((position, i) => ({ key: `k${i}`, position: position as P3 })),
  );
  // Bolt circles with a little drawing error, to exercise the cross rule where it is meant to apply.
  const circleLayout = fc
    .tuple(fc.integer({ min: 2, max: 20 }), fc.array(fc.double({ min: -0.002, max: 0.002, noNaN: true }), { minLength: 40, maxLength: 40 }))
    .map(([n, noise]) =>
      boltCircle(n).map((b, i) => ({
        key: b.key,
        position: [b.position[0] + noise[2 * i]!, b.position[1] + noise[2 * i + 1]!, 0] as P3,
      })),
    );
  const rule = fc.constantFrom<PatternRule>('cross', 'opposite');

  it('exampleSequence is always accepted by checkSequence', () => {
    fc.assert(
      fc.property(fc.oneof(layout, circleLayout), axis, rule, (bolts, ax, r) => {
        const order = exampleSequence(bolts, ax, r);
        expect([...order].sort()).toEqual(bolts.map((b) => b.key).sort());
        expect(checkSequence(bolts, ax, r, order)).toEqual({ ok: true });
      }),
    );
  });

  it('any sequence built from allowed next bolts is accepted; any other bolt is rejected where it stands', () => {
    fc.assert(
      fc.property(
        fc.oneof(layout, circleLayout),
        axis,
        rule,
        fc.array(fc.nat(), { minLength: 20, maxLength: 20 }),
        fc.nat(),
        (bolts, ax, r, picks, breakAt) => {
          const done: string[] = [];
          for (let i = 0; i < bolts.length; i++) {
            const allowed = nextBolts(bolts, ax, r, done);
            expect(allowed.length).toBeGreaterThan(0);
            done.push(allowed[picks[i]! % allowed.length]!);
          }
          expect(checkSequence(bolts, ax, r, done)).toEqual({ ok: true });

          // Swap in a bolt the rule does not allow at one step: rejected exactly there.
          const at = breakAt % bolts.length;
          const allowed = nextBolts(bolts, ax, r, done.slice(0, at));
          const wrong = done.slice(at).find((k) => !allowed.includes(k));
          if (wrong !== undefined) {
            const broken = [...done.slice(0, at), wrong, ...done.slice(at).filter((k) => k !== wrong)];
            expect(checkSequence(bolts, ax, r, broken)).toMatchObject({ ok: false, index: at, key: wrong });
          }
        },
      ),
    );
  });

  it('checkSequence is deterministic', () => {
    fc.assert(
      fc.property(layout, axis, rule, fc.func(fc.integer()), (bolts, ax, r, shuffleKey) => {
        const order = [...bolts.map((b) => b.key)].sort((a, b) => shuffleKey(a) - shuffleKey(b));
        const first = checkSequence(bolts, ax, r, order);
        const again = checkSequence(structuredClone(bolts), [...ax] as P3, r, [...order]);
        expect(again).toEqual(first);
      }),
    );
  });
});
