import { describe, expect, it } from 'vitest';
import { unit as mathUnit } from 'mathjs';
import { planWrench } from '~/lib/tools/wrench-plan';
import { wrenchPlanFormSchema, type WrenchPlanForm } from '~/lib/schemas/wrench-plan';

const blankForm: WrenchPlanForm = {
  torque: '', unit: 'in·lbf', dialUnit: 'in·lbf', wrenchLength: '', extension: '',
  lengthUnit: 'in', direction: 'forward', passes: '100', dialResolution: '',
};

describe('planWrench', () => {
  it('compensates the final setting and every pass for an extension', () => {
    // US Army TM 1-1500-204-23-9, Figure 8-16: 300 in·lbf, L = 10 in, E = 4 in → 214.2857 (the manual rounds to 214).
    const plan = planWrench({ torque: 300, unit: 'in·lbf', dialUnit: 'in·lbf', wrenchLength: 10, extension: 4, passPercents: [30, 60, 100], dialResolution: 1 });
    expect(plan.setting).toBeCloseTo(214.2857, 4);
    expect(plan.dialMark).toBe(214);
    // Each pass is T × L / (L + E) of its own torque (same TM formula): 90, 180 and 300 in·lbf at the fastener.
    expect(plan.passes.map((p) => p.torque)).toEqual([90, 180, 300]);
    expect(plan.passes[0]!.setting).toBeCloseTo((90 * 10) / 14, 10);
    expect(plan.passes[1]!.setting).toBeCloseTo((180 * 10) / 14, 10);
    expect(plan.passes[2]!.setting).toBeCloseTo(plan.setting, 10);
    expect(plan.passes.map((p) => p.dialMark)).toEqual([64, 129, 214]);
  });

  it('matches the Navy worked example and TM 9-254 in the forward direction', () => {
    // US Navy aviation training manual (torque wrench chapter): 100 in·lbf, L = 12 in, E = 6 in → 66.7 in·lbf.
    expect(planWrench({ torque: 100, unit: 'in·lbf', dialUnit: 'in·lbf', wrenchLength: 12, extension: 6, passPercents: [100] }).setting).toBeCloseTo(66.67, 2);
    // US Army TM 9-254: L = 12 in, E = 2 in, a 60 in·lbf setting applies 70 in·lbf; so 70 wanted → set 60.
    expect(planWrench({ torque: 70, unit: 'in·lbf', dialUnit: 'in·lbf', wrenchLength: 12, extension: 2, passPercents: [100] }).setting).toBeCloseTo(60, 10);
  });

  it('shows the spec in every unit with the NIST factors', () => {
    const plan = planWrench({ torque: 17, unit: 'ft·lbf', dialUnit: 'in·lbf', passPercents: [100] });
    const by = Object.fromEntries(plan.conversions.map((c) => [c.unit, c.value]));
    // NIST SP 811 (2008), App. B.9: 1 lbf·ft = 1.3558179483314004 N·m exactly from the definitions.
    expect(by['N·m']).toBeCloseTo(17 * 1.3558179483314004, 12);
    // mathjs units as a second, independent reference.
    expect(by['N·m']).toBeCloseTo(mathUnit(17, 'lbf ft').toNumber('N m'), 10);
    // Common practice, no source: 17 ft·lbf is set as 204 in·lbf; 1 lbf·ft = 12 lbf·in by definition.
    expect(by['in·lbf']).toBe(204);
    expect(plan.setting).toBe(204);
    // NIST SP 811 (2008), App. B.9: 1 kgf·m = 9.80665 N·m exactly.
    expect(by['kgf·m']).toBeCloseTo((17 * 1.3558179483314004) / 9.80665, 12);
  });

  it('writes a summary with the setting and each pass, and the caution', () => {
    const plan = planWrench({ torque: 300, unit: 'in·lbf', dialUnit: 'in·lbf', wrenchLength: 10, extension: 4, passPercents: [30, 60, 100] });
    expect(plan.summary).toContain('Dial setting: 214.3 in·lbf');
    expect(plan.summary).toContain('Pass 1, 30 %: set 64.29 in·lbf (reaches 90 in·lbf)');
    expect(plan.summary).toMatch(/engine maker's figure rules/);
  });
});

describe('wrenchPlanFormSchema', () => {
  const errors = (form: Partial<WrenchPlanForm>) => {
    const parsed = wrenchPlanFormSchema.safeParse({ ...blankForm, ...form });
    return parsed.success ? {} : parsed.error.flatten().fieldErrors;
  };

  it('reads typed numbers and a pass list', () => {
    const parsed = wrenchPlanFormSchema.parse({ ...blankForm, torque: '12,5', passes: '30, 60 % 100' });
    expect(parsed.torque).toBe(12.5);
    expect(parsed.passes).toEqual([30, 60, 100]);
    expect(parsed.wrenchLength).toBeUndefined();
  });

  it('names the field that is wrong', () => {
    expect(errors({ torque: '' }).torque).toEqual(['Give the torque spec']);
    expect(errors({ torque: 'abc' }).torque).toEqual(['The torque spec must be a number']);
    expect(errors({ torque: '10', extension: '4' }).wrenchLength?.[0]).toMatch(/needs the wrench length/);
    expect(errors({ torque: '10', extension: '12', wrenchLength: '10', direction: 'back' }).extension?.[0]).toMatch(/shorter than the wrench/);
    expect(errors({ torque: '10', passes: '60, 30, 100' }).passes?.[0]).toMatch(/tighter than the one before/);
    expect(errors({ torque: '10', passes: '30, 60' }).passes?.[0]).toMatch(/end with 100/);
    expect(errors({ torque: '10', passes: '0, 100' }).passes?.[0]).toMatch(/"0" is not a percentage/);
  });
});
