import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { unit } from 'mathjs';
import { TORQUE_UNIT_IDS, type TorqueUnit } from '~/lib/procedure/schema';
import {
  convertTorque,
  formatNumber,
  formatTorque,
  parseTorqueUnit,
  roundToResolution,
  torqueFactor,
} from '~/lib/torque';

function expectRelative(actual: number, expected: number, rel = 1e-14) {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));
}

describe('convertTorque against NIST SP 811', () => {
  it('1 lbf·ft in N·m', () => {
    // NIST SP 811 (2008), App. B.9: 1.355 818 N·m (table value)
    expect(convertTorque(1, 'ft·lbf', 'N·m')).toBeCloseTo(1.355818, 6);
    // NIST SP 811 (2008), App. B.9, exact from lb = 0.45359237 kg, g_n = 9.80665, ft = 0.3048 m
    expectRelative(convertTorque(1, 'ft·lbf', 'N·m'), 1.3558179483314004);
  });

  it('1 lbf·in in N·m', () => {
    // NIST SP 811 (2008), App. B.9: 1.129 848 E−01 N·m (table value)
    expect(convertTorque(1, 'in·lbf', 'N·m')).toBeCloseTo(0.1129848, 7);
    // NIST SP 811 (2008), App. B.9, exact from the definitions
    expectRelative(convertTorque(1, 'in·lbf', 'N·m'), 0.1129848290276167);
  });

  it('1 kgf·m is exactly 9.80665 N·m', () => {
    // NIST SP 811 (2008), App. B.9 (exact)
    expect(convertTorque(1, 'kgf·m', 'N·m')).toBe(9.80665);
  });

  it('1 N·m in lbf·ft and lbf·in', () => {
    // NIST SP 811 (2008), App. B.9, reciprocals of the exact factors
    expectRelative(convertTorque(1, 'N·m', 'ft·lbf'), 0.7375621492772654);
    expectRelative(convertTorque(1, 'N·m', 'in·lbf'), 8.850745791327185);
  });

  it('1 lbf·ft is exactly 12 lbf·in', () => {
    // NIST SP 811 (2008), definition of the foot: 12 in
    expect(torqueFactor('ft·lbf', 'in·lbf')).toBe(12);
    expect(convertTorque(24, 'in·lbf', 'ft·lbf')).toBe(2);
  });

  it('17 ft·lbf is set as 204 in·lbf', () => {
    // common practice, no source
    expect(convertTorque(17, 'ft·lbf', 'in·lbf')).toBe(204);
  });

  it('the same unit is left alone', () => {
    for (const u of TORQUE_UNIT_IDS) expect(convertTorque(11.3, u, u)).toBe(11.3);
  });
});

describe('convertTorque against mathjs units (independent reference)', () => {
  const MATHJS_NAME: Record<TorqueUnit, string> = {
    'N·m': 'N m',
    'in·lbf': 'lbf in',
    'ft·lbf': 'lbf ft',
    'kgf·m': 'kgf m',
  };

  it('17 lbf ft to N m', () => {
    // mathjs 15 units: unit(17, 'lbf ft').to('N m')
    const reference = unit(17, 'lbf ft').to('N m').toNumber('N m');
    expectRelative(convertTorque(17, 'ft·lbf', 'N·m'), reference);
    expect(reference).toBeCloseTo(23.0489, 4);
  });

  it('every pair of units agrees with mathjs', () => {
    for (const from of TORQUE_UNIT_IDS) {
      for (const to of TORQUE_UNIT_IDS) {
        // mathjs 15 units as the second, independent check
        const reference = unit(24, MATHJS_NAME[from]).toNumber(MATHJS_NAME[to]);
        expectRelative(convertTorque(24, from, to), reference, 1e-12);
      }
    }
  });
});

describe('convertTorque properties', () => {
  const unitArb = fc.constantFrom(...TORQUE_UNIT_IDS);

  it('A → B → A returns the value', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e5, noNaN: true }), unitArb, unitArb, (value, a, b) => {
        const back = convertTorque(convertTorque(value, a, b), b, a);
        return Math.abs(back - value) <= 1e-12 * value;
      }),
    );
  });

  it('A → B → C equals A → C', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e5, noNaN: true }), unitArb, unitArb, unitArb, (value, a, b, c) => {
        const twoSteps = convertTorque(convertTorque(value, a, b), b, c);
        const direct = convertTorque(value, a, c);
        return Math.abs(twoSteps - direct) <= 1e-12 * direct;
      }),
    );
  });
});

describe('parseTorqueUnit', () => {
  it.each([
    ['N·m', 'N·m'],
    ['Nm', 'N·m'],
    ['N m', 'N·m'],
    ['N.m', 'N·m'],
    ['N-m', 'N·m'],
    ['newton metre', 'N·m'],
    ['in·lbf', 'in·lbf'],
    ['in-lb', 'in·lbf'],
    ['inlbf', 'in·lbf'],
    ['lbf·in', 'in·lbf'],
    ['in.lbs', 'in·lbf'],
    ['inch-pounds', 'in·lbf'],
    ['ft·lbf', 'ft·lbf'],
    ['ft-lb', 'ft·lbf'],
    ['ftlbf', 'ft·lbf'],
    ['lbf·ft', 'ft·lbf'],
    ['LB-FT', 'ft·lbf'],
    ['foot pounds', 'ft·lbf'],
    ['kgf·m', 'kgf·m'],
    ['kg-m', 'kgf·m'],
    ['kgfm', 'kgf·m'],
  ])('%s → %s', (label, id) => {
    expect(parseTorqueUnit(label)).toBe(id);
  });

  it.each(['', 'lbf/in', 'N', 'psi', 'ft', 'kg', 'mN·m'])('%s is not a torque unit', (label) => {
    expect(parseTorqueUnit(label)).toBeNull();
  });
});

describe('dial rounding and formatting', () => {
  it('rounds to the dial resolution', () => {
    // US Army TM 1-1500-204-23-9, Fig. 8-16: 214.2857 in·lbf, which the manual rounds to 214
    expect(roundToResolution(214.2857, 1)).toBe(214);
    expect(roundToResolution(214.2857, 0.5)).toBe(214.5);
    expect(roundToResolution(214.2857, 0.1)).toBe(214.3);
    expect(roundToResolution(12.34, 0.25)).toBe(12.25);
    expect(roundToResolution(213, 2)).toBe(214);
  });

  it('refuses a resolution that is not positive', () => {
    expect(() => roundToResolution(10, 0)).toThrow(RangeError);
    expect(() => roundToResolution(10, -1)).toThrow(RangeError);
  });

  it('formats numbers for people', () => {
    expect(formatNumber(214.28571428)).toBe('214.3');
    expect(formatNumber(204.00000000000003)).toBe('204');
    expect(formatNumber(2034.6)).toBe('2035');
    expect(formatNumber(0.1129848)).toBe('0.113');
    expect(formatNumber(8.850745791327185, 6)).toBe('8.85075');
    expect(formatNumber(-0.00001)).toBe('-0.00001');
    expect(formatNumber(0)).toBe('0');
  });

  it('formats a torque, with or without a dial resolution', () => {
    expect(formatTorque(214.2857, 'in·lbf')).toBe('214.3 in·lbf');
    expect(formatTorque(214.2857, 'in·lbf', 0.5)).toBe('214.5 in·lbf');
    expect(formatTorque(214.2857, 'in·lbf', 1)).toBe('214 in·lbf');
    expect(formatTorque(11, 'N·m', 0.1)).toBe('11.0 N·m');
  });
});
