import { describe, expect, it } from 'vitest';
import { fastenerGroupSchema, type FastenerGroup, type Vec3 } from '~/lib/procedure/schema';
import { crossPattern, exampleSequence } from '~/lib/patterns';
import { scorePattern } from '~/lib/scoring/pattern';

// Wren 160 groups (demo values for a fictional engine): 8 sump flange bolts, cross pattern,
// two passes to 11 N·m; 5 head bolts, three passes to 24 N·m.

function circlePositions(n: number, radius = 0.07): Record<string, Vec3> {
  const out: Record<string, Vec3> = {};
  for (let i = 0; i < n; i++) {
    const a = Math.PI / 2 - (2 * Math.PI * i) / n; // numbered clockwise seen from +z
    out[`hole-${i + 1}`] = [radius * Math.cos(a), radius * Math.sin(a), 0];
  }
  return out;
}

function sumpGroup(overrides: Partial<FastenerGroup> = {}): FastenerGroup {
  return fastenerGroupSchema.parse({
    key: 'sump-bolts',
    name: 'Sump flange bolts',
    part: 'flange-bolt',
    axis: [0, 0, 1],
    bolts: Array.from({ length: 8 }, (_, i) => ({ key: `${i + 1}`, anchor: `hole-${i + 1}` })),
    torque: { value: 11, unit: 'N·m', tolerancePct: 10 },
    passes: [0.5, 1],
    rule: 'cross',
    ...overrides,
  });
}

const SUMP_POSITIONS = circlePositions(8);
const CROSS_8 = crossPattern(8).map(String);
const keysOf = (score: ReturnType<typeof scorePattern>) => score.results.map((r) => r.key);
const result = (score: ReturnType<typeof scorePattern>, key: string) => score.results.find((r) => r.key === key)!;

describe('scorePattern, cross pattern in two passes', () => {
  it('full marks for the cross pattern at 50 % then 100 %', () => {
    // from memory of ASME PCC-1 (8-bolt cross pattern); demo torque 11 N·m
    const score = scorePattern(sumpGroup(), SUMP_POSITIONS, {
      passes: [
        { torque: 5.5, sequence: CROSS_8 },
        { torque: 11, sequence: CROSS_8 },
      ],
    });
    expect(score).toMatchObject({ stage: 'pattern', score: 5, maxScore: 5, passed: true });
    expect(keysOf(score)).toEqual(['passes', 'pass-1', 'pass-1-torque', 'pass-2', 'pass-2-torque']);
    expect(score.notes?.[0]).toBe('Passes for this group: 5.5 N·m, then 11 N·m.');
  });

  it('each pass may start at a different bolt and go the other way', () => {
    // from memory of ASME PCC-1: the pattern does not depend on which bolt is called 1
    const turned = ['3', '7', '5', '1', '4', '8', '6', '2'];
    const score = scorePattern(sumpGroup(), SUMP_POSITIONS, {
      passes: [
        { torque: 5.5, sequence: CROSS_8 },
        { torque: 11, sequence: turned },
      ],
    });
    expect(score.passed).toBe(true);
  });

  it('a pass run around the circle loses its point and names the bolt', () => {
    // from memory of ASME PCC-1: fasteners are not run down in a circle
    const score = scorePattern(sumpGroup(), SUMP_POSITIONS, {
      passes: [
        { torque: 5.5, sequence: ['1', '2', '3', '4', '5', '6', '7', '8'] },
        { torque: 11, sequence: CROSS_8 },
      ],
    });
    expect(score).toMatchObject({ score: 4, maxScore: 5, passed: false });
    expect(result(score, 'pass-1').ok).toBe(false);
    expect(result(score, 'pass-1').message).toMatch(/^pass 1: bolt 2 is not across the circle from bolt 1/);
    expect(result(score, 'pass-2').ok).toBe(true);
  });

  it('a pass that leaves a bolt out or repeats one is wrong', () => {
    const score = scorePattern(sumpGroup(), SUMP_POSITIONS, {
      passes: [
        { torque: 5.5, sequence: CROSS_8.slice(0, 7) },
        { torque: 11, sequence: [...CROSS_8.slice(0, 7), '1'] },
      ],
    });
    expect(result(score, 'pass-1').message).toBe('pass 1: the sequence leaves out bolt 8; every bolt is tightened once per pass');
    expect(result(score, 'pass-2').message).toMatch(/^pass 2: bolt 1 appears twice/);
  });

  it('says what a wrong pass torque should be', () => {
    // demo torque 11 N·m, first pass at 50 %
    const score = scorePattern(sumpGroup(), SUMP_POSITIONS, {
      passes: [
        { torque: 8, sequence: CROSS_8 },
        { torque: 11, sequence: CROSS_8 },
      ],
    });
    expect(result(score, 'pass-1-torque')).toEqual({
      key: 'pass-1-torque',
      ok: false,
      message: 'pass 1 at 8 N·m; it should be 5.5 N·m (50 % of 11 N·m, ±10 %)',
    });
    expect(score.score).toBe(4);
  });

  it('accepts a pass torque inside the tolerance and refuses one outside', () => {
    const score = (first: number, last: number) =>
      scorePattern(sumpGroup(), SUMP_POSITIONS, {
        passes: [
          { torque: first, sequence: CROSS_8 },
          { torque: last, sequence: CROSS_8 },
        ],
      });
    // 5.5 ± 10 % is 4.95 … 6.05; 11 ± 10 % is 9.9 … 12.1
    expect(score(6.05, 11).passed).toBe(true);
    expect(score(4.95, 12.1).passed).toBe(true);
    expect(result(score(6.1, 11), 'pass-1-torque').ok).toBe(false);
    expect(result(score(5.5, 12.2), 'pass-2-torque').message).toBe(
      'pass 2 at 12.2 N·m; it should be 11 N·m (the final torque, ±10 %)',
    );
  });

  it('each pass must rise above the one before', () => {
    // from memory of ASME PCC-1: passes rise toward the target; close passes can overlap in tolerance
    const group = sumpGroup({ passes: [0.95, 1] });
    const score = scorePattern(group, SUMP_POSITIONS, {
      passes: [
        { torque: 11, sequence: CROSS_8 },
        { torque: 10.5, sequence: CROSS_8 },
      ],
    });
    expect(result(score, 'pass-1-torque').ok).toBe(true);
    expect(result(score, 'pass-2-torque').message).toBe(
      'pass 2 at 10.5 N·m does not rise above pass 1 (11 N·m); each pass goes higher',
    );
  });

  it('the wrong number of passes is marked, and missing passes score nothing', () => {
    const one = scorePattern(sumpGroup(), SUMP_POSITIONS, { passes: [{ torque: 11, sequence: CROSS_8 }] });
    expect(result(one, 'passes')).toEqual({
      key: 'passes',
      ok: false,
      message: '1 pass given; this group takes 2: 5.5 N·m, then 11 N·m',
    });
    expect(result(one, 'pass-2')).toEqual({ key: 'pass-2', ok: false, message: 'pass 2 is missing' });
    expect(one.maxScore).toBe(5);
    expect(one.score).toBe(1); // only the first pass's sequence

    const three = scorePattern(sumpGroup(), SUMP_POSITIONS, {
      passes: [
        { torque: 5.5, sequence: CROSS_8 },
        { torque: 11, sequence: CROSS_8 },
        { torque: 11, sequence: CROSS_8 },
      ],
    });
    expect(result(three, 'passes').ok).toBe(false);
    expect(three.passed).toBe(false);
    expect(three.maxScore).toBe(5);
  });

  it('first pass at 70 % of a final above 30 lbf·ft', () => {
    // US Army TB 9-2320-279-13&P-2, torque limits: above 30 lbf·ft, first pass at 70 % of final
    const group = sumpGroup({ torque: { value: 40, unit: 'ft·lbf', tolerancePct: 5 }, passes: [0.7, 1] });
    const score = scorePattern(group, SUMP_POSITIONS, {
      passes: [
        { torque: 28, sequence: CROSS_8 },
        { torque: 40, sequence: CROSS_8 },
      ],
    });
    expect(score.passed).toBe(true);
    const low = scorePattern(group, SUMP_POSITIONS, {
      passes: [
        { torque: 20, sequence: CROSS_8 },
        { torque: 40, sequence: CROSS_8 },
      ],
    });
    expect(result(low, 'pass-1-torque').message).toBe('pass 1 at 20 ft·lbf; it should be 28 ft·lbf (70 % of 40 ft·lbf, ±5 %)');
  });

  it('does not trust the shape of the answer', () => {
    for (const answer of [null, {}, { passes: 'all' }]) {
      const score = scorePattern(sumpGroup(), SUMP_POSITIONS, answer as never);
      expect(score.score).toBe(0);
      expect(score.passed).toBe(false);
    }
    // Two malformed passes: the count is right, nothing else is.
    const score = scorePattern(sumpGroup(), SUMP_POSITIONS, {
      passes: [null, { torque: '11', sequence: 'cross' }],
    } as never);
    expect(score.results.filter((r) => r.ok).map((r) => r.key)).toEqual(['passes']);
    expect(result(score, 'pass-2-torque').message).toBe('pass 2 has no torque; it should be 11 N·m (the final torque, ±10 %)');
  });

  it('refuses a group whose anchors have no position', () => {
    const { ['hole-3']: _gone, ...rest } = SUMP_POSITIONS;
    expect(() => scorePattern(sumpGroup(), rest, { passes: [] })).toThrow(/hole-3/);
  });
});

describe('scorePattern, opposite rule on the 5-bolt head', () => {
  // common practice, no source: odd counts go "each next bolt roughly opposite the last, middle out"
  const positions: Record<string, Vec3> = {
    'head-1': [0.035, 0.035, 0.1],
    'head-2': [-0.035, 0.035, 0.1],
    'head-3': [-0.035, -0.035, 0.1],
    'head-4': [0.035, -0.035, 0.1],
    'head-5': [0, 0.055, 0.1],
  };
  const group = fastenerGroupSchema.parse({
    key: 'head-bolts',
    name: 'Head bolts',
    part: 'head-bolt',
    axis: [0, 0, 1],
    bolts: [1, 2, 3, 4, 5].map((i) => ({ key: `h${i}`, anchor: `head-${i}` })),
    torque: { value: 24, unit: 'N·m', tolerancePct: 5 },
    passes: [1 / 3, 2 / 3, 1],
    rule: 'opposite',
  });
  const bolts = group.bolts.map((b) => ({ key: b.key, position: positions[b.anchor]! }));
  const order = exampleSequence(bolts, group.axis, 'opposite');

  it('three passes, one third, two thirds, full', () => {
    // demo values: one third, two thirds, full of 24 N·m
    const score = scorePattern(group, positions, {
      passes: [
        { torque: 8, sequence: order },
        { torque: 16, sequence: order },
        { torque: 24, sequence: order },
      ],
    });
    expect(score).toMatchObject({ score: 7, maxScore: 7, passed: true });
  });

  it('a same-side move is reported', () => {
    // common practice, no source
    const score = scorePattern(group, positions, {
      passes: [
        { torque: 8, sequence: ['h1', 'h5', 'h3', 'h4', 'h2'] },
        { torque: 16, sequence: order },
        { torque: 24, sequence: order },
      ],
    });
    expect(result(score, 'pass-1').message).toMatch(/^pass 1: bolt h5 follows bolt h1 on the same side/);
    expect(score.score).toBe(6);
  });
});
