import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  appliedTorque,
  passSchedule,
  wrenchGeometryProblem,
  wrenchSetting,
  WrenchSetupError,
} from '~/lib/wrench';

describe('wrenchSetting: extension compensation', () => {
  it('L = 10 in, E = 4 in, 300 in·lbf → 214.2857 in·lbf', () => {
    const result = wrenchSetting({
      torque: 300,
      unit: 'in·lbf',
      toUnit: 'in·lbf',
      wrenchLength: 10,
      extension: 4,
      lengthUnit: 'in',
    });
    // US Army TM 1-1500-204-23-9, Figure 8-16 (the manual rounds to 214)
    expect(result.setting).toBeCloseTo(214.2857, 4);
    expect(result.unit).toBe('in·lbf');
    expect(result.steps).toContain('setting = T × L / (L + E) = 300 × 10 / (10 + 4) = 214.3 in·lbf');
  });

  it('100 in·lbf, L = 12 in, E = 6 in → 66.7 in·lbf', () => {
    const result = wrenchSetting({ torque: 100, unit: 'in·lbf', toUnit: 'in·lbf', wrenchLength: 12, extension: 6 });
    // US Navy aviation training manual, torque wrench chapter
    expect(result.setting).toBeCloseTo(66.7, 1);
  });

  it('an adapter pointing back toward the handle uses L − E', () => {
    const result = wrenchSetting({
      torque: 300,
      unit: 'in·lbf',
      toUnit: 'in·lbf',
      wrenchLength: 10,
      extension: 4,
      direction: 'back',
    });
    // US Army TM 1-1500-204-23-9, Figure 8-16 text: a backward adapter shortens the lever, use L − E
    expect(result.setting).toBeCloseTo((300 * 10) / 6, 10);
    expect(result.steps).toContain('setting = T × L / (L − E) = 300 × 10 / (10 − 4) = 500 in·lbf');
  });

  it('converts first, then compensates, and says so step by step', () => {
    const result = wrenchSetting({ torque: 17, unit: 'ft·lbf', toUnit: 'in·lbf', wrenchLength: 10, extension: 4 });
    // common practice, no source: 17 ft·lbf is 204 in·lbf; then TM 1-1500-204-23-9 formula
    expect(result.steps[0]).toContain('17 ft·lbf × 12 = 204 in·lbf');
    expect(result.setting).toBeCloseTo((204 * 10) / 14, 10);
  });

  it('without an extension the setting is the converted spec', () => {
    const result = wrenchSetting({ torque: 11, unit: 'N·m', toUnit: 'in·lbf' });
    // NIST SP 811 (2008), App. B.9: 1 N·m = 8.850745791327185 lbf·in
    expect(result.setting).toBeCloseTo(11 * 8.850745791327185, 10);
    expect(result.steps[0]).toBe("Convert the spec to the dial's unit: 11 N·m × 8.85075 = 97.36 in·lbf.");
    expect(result.steps).toHaveLength(2);
  });

  it('writes a division when the factor is below 1', () => {
    const result = wrenchSetting({ torque: 204, unit: 'in·lbf', toUnit: 'ft·lbf' });
    // NIST SP 811 (2008): 1 lbf·ft = 12 lbf·in
    expect(result.setting).toBe(17);
    expect(result.steps[0]).toContain('204 in·lbf ÷ 12 = 17 ft·lbf');
  });

  it('refuses an adapter pointing back that is as long as the wrench', () => {
    const call = () =>
      wrenchSetting({ torque: 50, unit: 'N·m', toUnit: 'N·m', wrenchLength: 10, extension: 10, direction: 'back' });
    expect(call).toThrow(WrenchSetupError);
    expect(call).toThrow(/shorter than the wrench/);
  });

  it('refuses negative lengths, a missing wrench length and a zero torque', () => {
    expect(() => wrenchSetting({ torque: 50, unit: 'N·m', toUnit: 'N·m', wrenchLength: -10, extension: 2 })).toThrow(
      WrenchSetupError,
    );
    expect(() => wrenchSetting({ torque: 50, unit: 'N·m', toUnit: 'N·m', wrenchLength: 10, extension: -2 })).toThrow(
      /extension length/,
    );
    expect(() => wrenchSetting({ torque: 50, unit: 'N·m', toUnit: 'N·m', extension: 2 })).toThrow(/wrench length/);
    expect(() => wrenchSetting({ torque: 0, unit: 'N·m', toUnit: 'N·m' })).toThrow(/positive/);
  });

  it('names the geometry problem, or none', () => {
    expect(wrenchGeometryProblem(12, 6, 'forward')).toBeNull();
    expect(wrenchGeometryProblem(12, 6, 'back')).toBeNull();
    expect(wrenchGeometryProblem(12, 14, 'back')).toMatch(/L − E = -2/);
    expect(wrenchGeometryProblem(0, 0)).toMatch(/wrench length/);
  });
});

describe('appliedTorque', () => {
  it('L = 12 in, E = 2 in, setting 60 in·lbf → 70 in·lbf applied', () => {
    // US Army TM 9-254 (reverse direction)
    expect(appliedTorque(60, 12, 2)).toBeCloseTo(70, 10);
  });

  it('a backward adapter delivers less than the dial', () => {
    // US Army TM 1-1500-204-23-9, Fig. 8-16 text: L − E for an adapter pointing back
    expect(appliedTorque(500, 10, 4, 'back')).toBeCloseTo(300, 10);
  });

  it('undoes wrenchSetting for any usable geometry', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1000, noNaN: true }),
        fc.double({ min: 1, max: 40, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.constantFrom('forward' as const, 'back' as const),
        (torque, wrenchLength, share, direction) => {
          // Keep L − E clear of zero for a backward adapter.
          const extension = share * wrenchLength * 0.9;
          const { setting } = wrenchSetting({
            torque,
            unit: 'in·lbf',
            toUnit: 'in·lbf',
            wrenchLength,
            extension,
            direction,
          });
          const applied = appliedTorque(setting, wrenchLength, extension, direction);
          return Math.abs(applied - torque) <= 1e-9 * torque;
        },
      ),
    );
  });
});

describe('passSchedule', () => {
  it('one third, two thirds, full of 24 N·m', () => {
    const [a, b, c] = passSchedule(24, [1 / 3, 2 / 3, 1]);
    expect(a).toBeCloseTo(8, 12);
    expect(b).toBeCloseTo(16, 12);
    expect(c).toBe(24);
  });

  it('a first pass at 70 % of a final above 30 lbf·ft', () => {
    // US Army TB 9-2320-279-13&P-2, torque limits: first pass at 70 % of final
    expect(passSchedule(40, [0.7, 1])).toEqual([28, 40]);
  });

  it('refuses fractions outside (0, 1] and a non-positive final torque', () => {
    expect(() => passSchedule(11, [0, 1])).toThrow(WrenchSetupError);
    expect(() => passSchedule(11, [0.5, 1.2])).toThrow(WrenchSetupError);
    expect(() => passSchedule(-1, [1])).toThrow(WrenchSetupError);
  });
});
