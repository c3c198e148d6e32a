import { describe, expect, it } from 'vitest';
import { wrenchTaskSchema, type TorqueSpec, type WrenchTask } from '~/lib/procedure/schema';
import { scoreWrench } from '~/lib/scoring/wrench';
import { WrenchSetupError } from '~/lib/wrench';

function task(overrides: Partial<WrenchTask> = {}): WrenchTask {
  return wrenchTaskSchema.parse({
    group: 'sump-bolts',
    dialUnit: 'in·lbf',
    wrenchLength: 10,
    extension: 0,
    lengthUnit: 'in',
    direction: 'forward',
    specShownIn: 'in·lbf',
    ...overrides,
  });
}

const spec = (value: number, unit: TorqueSpec['unit'], tolerancePct = 2): TorqueSpec => ({ value, unit, tolerancePct });
const result = (score: ReturnType<typeof scoreWrench>, key: string) => score.results.find((r) => r.key === key)!;

describe('scoreWrench, extension compensation', () => {
  const withExtension = task({ wrenchLength: 10, extension: 4 });

  it('300 in·lbf through a 4 in extension on a 10 in wrench: 214 on the dial', () => {
    // US Army TM 1-1500-204-23-9, Figure 8-16: setting 214.2857, the manual rounds to 214
    const score = scoreWrench(withExtension, spec(300, 'in·lbf'), { setting: 214, unit: 'in·lbf' });
    expect(score).toMatchObject({ stage: 'wrench', score: 2, maxScore: 2, passed: true });
    expect(score.results.map((r) => r.key)).toEqual(['unit', 'setting']);
    expect(score.notes).toContain('setting = T × L / (L + E) = 300 × 10 / (10 + 4) = 214.3 in·lbf');
  });

  it('dialling the spec itself ignores the extension and is wrong', () => {
    // US Army TM 1-1500-204-23-9, Figure 8-16
    const score = scoreWrench(withExtension, spec(300, 'in·lbf'), { setting: 300, unit: 'in·lbf' });
    expect(score).toMatchObject({ score: 1, passed: false });
    expect(result(score, 'setting').message).toBe(
      '300 on the dial is off; the dial should read 214.3 in·lbf (±2 %: 210 to 218.6)',
    );
  });

  it('100 in·lbf, L = 12 in, E = 6 in: 66.7 on the dial', () => {
    // US Navy aviation training manual, torque wrench chapter
    const score = scoreWrench(task({ wrenchLength: 12, extension: 6 }), spec(100, 'in·lbf', 1), { setting: 66.7, unit: 'in·lbf' });
    expect(score.passed).toBe(true);
  });

  it('70 in·lbf wanted, L = 12 in, E = 2 in: 60 on the dial', () => {
    // US Army TM 9-254: setting 60 with L = 12, E = 2 applies 70 in·lbf
    const score = scoreWrench(task({ wrenchLength: 12, extension: 2 }), spec(70, 'in·lbf', 1), { setting: 60, unit: 'in·lbf' });
    expect(score.passed).toBe(true);
  });

  it('an adapter pointing back toward the handle uses L − E', () => {
    // US Army TM 1-1500-204-23-9, Figure 8-16 text: L − E for an adapter pointing back
    const back = task({ wrenchLength: 10, extension: 4, direction: 'back' });
    expect(scoreWrench(back, spec(300, 'in·lbf'), { setting: 500, unit: 'in·lbf' }).passed).toBe(true);
    expect(scoreWrench(back, spec(300, 'in·lbf'), { setting: 214, unit: 'in·lbf' }).passed).toBe(false);
  });

  it('refuses a task whose adapter is as long as the wrench', () => {
    const broken = task({ wrenchLength: 6, extension: 6, direction: 'back' });
    expect(() => scoreWrench(broken, spec(300, 'in·lbf'), { setting: 1, unit: 'in·lbf' })).toThrow(WrenchSetupError);
  });
});

describe('scoreWrench, units', () => {
  it('17 ft·lbf on an inch-pound dial is 204', () => {
    // common practice, no source
    const score = scoreWrench(task({ specShownIn: 'ft·lbf' }), spec(17, 'ft·lbf'), { setting: 204, unit: 'in·lbf' });
    expect(score.passed).toBe(true);
    expect(score.notes?.[0]).toBe("Convert the spec to the dial's unit: 17 ft·lbf × 12 = 204 in·lbf.");
  });

  it('setting the spec number in the spec unit is the classic mistake', () => {
    // common practice, no source: 17 ft·lbf is 204 in·lbf
    const score = scoreWrench(task({ specShownIn: 'ft·lbf' }), spec(17, 'ft·lbf'), { setting: 17, unit: 'ft·lbf' });
    expect(score).toMatchObject({ score: 0, passed: false });
    expect(result(score, 'unit').message).toBe(
      "the answer is in ft·lbf but this wrench's dial reads in·lbf; a wrench set in the wrong unit is the classic mistake, so convert the spec to in·lbf first",
    );
    expect(result(score, 'setting').message).toMatch(/^17 ft·lbf is the right torque, but the dial reads in·lbf/);
    expect(result(score, 'setting').message).toContain('the dial should read 204 in·lbf');
  });

  it('the right dial number with the wrong unit label keeps the setting point only', () => {
    // common practice, no source: 17 ft·lbf is 204 in·lbf
    const score = scoreWrench(task({ specShownIn: 'ft·lbf' }), spec(17, 'ft·lbf'), { setting: 204, unit: 'N·m' });
    expect(result(score, 'unit').ok).toBe(false);
    expect(result(score, 'setting').ok).toBe(true);
    expect(score).toMatchObject({ score: 1, passed: false });
  });

  it('a spec kept in N·m, shown in ft·lbf, set on an inch-pound dial', () => {
    // NIST SP 811 (2008), App. B.9: 1 N·m = 8.850745791327185 lbf·in = 0.7375621492772654 lbf·ft
    const expected = 11 * 8.850745791327185;
    const t = task({ specShownIn: 'ft·lbf' });
    expect(scoreWrench(t, spec(11, 'N·m'), { setting: expected * 1.019, unit: 'in·lbf' }).passed).toBe(true);
    expect(scoreWrench(t, spec(11, 'N·m'), { setting: expected * 1.021, unit: 'in·lbf' }).passed).toBe(false);
    const notes = scoreWrench(t, spec(11, 'N·m'), { setting: expected, unit: 'in·lbf' }).notes!;
    expect(notes[0]).toBe(`Convert the spec to the dial's unit: ${(11 * 0.7375621492772654).toFixed(3)} ft·lbf × 12 = 97.36 in·lbf.`);
  });

  it('a kgf·m spec on a N·m dial', () => {
    // NIST SP 811 (2008), App. B.9: 1 kgf·m = 9.80665 N·m (exact)
    const score = scoreWrench(task({ dialUnit: 'N·m', specShownIn: 'kgf·m' }), spec(2, 'kgf·m', 1), {
      setting: 19.6133,
      unit: 'N·m',
    });
    expect(score.passed).toBe(true);
  });

  it('does not trust the shape of the answer', () => {
    for (const answer of [null, {}, { setting: '204', unit: 'in·lbf' }, { setting: Number.NaN, unit: 'in-lb' }]) {
      const score = scoreWrench(task(), spec(204, 'in·lbf'), answer as never);
      expect(result(score, 'setting').ok).toBe(false);
      expect(score.passed).toBe(false);
    }
    const noUnit = scoreWrench(task(), spec(204, 'in·lbf'), { setting: 204, unit: 'lbs' } as never);
    expect(result(noUnit, 'unit').message).toBe("no unit chosen; this wrench's dial reads in·lbf");
  });
});
