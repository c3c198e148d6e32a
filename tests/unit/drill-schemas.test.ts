import { describe, expect, it } from 'vitest';
import { createDrillSchema, dueAtChangeError, updateDrillSchema } from '~/lib/schemas/drills';

const now = new Date('2030-04-01T12:00:00Z');
const good = {
  procedure: 'wren-160-sump',
  stages: ['order', 'pins'],
  dueAt: '2030-04-08T15:00:00Z',
  passMarkPct: 80,
};

const fieldsOf = (input: unknown) => {
  const parsed = createDrillSchema(now).safeParse(input);
  return parsed.success ? null : parsed.error.flatten().fieldErrors;
};

describe('createDrillSchema', () => {
  it('accepts a full request and fills in no limit and answers shown at once', () => {
    const parsed = createDrillSchema(now).parse(good);
    expect(parsed).toEqual({
      procedure: 'wren-160-sump',
      stages: ['order', 'pins'],
      dueAt: new Date('2030-04-08T15:00:00Z'),
      passMarkPct: 80,
      attemptLimit: null,
      answersAfterDue: false,
    });
  });

  it('keeps stages in the trainer order, once each', () => {
    expect(createDrillSchema(now).parse({ ...good, stages: ['wrench', 'order', 'wrench'] }).stages).toEqual(['order', 'wrench']);
  });

  it('reads a due date with an offset as the instant it names', () => {
    // 17:00 at UTC+02:00 is 15:00 UTC (ISO 8601 offsets).
    expect(createDrillSchema(now).parse({ ...good, dueAt: '2030-04-08T17:00:00+02:00' }).dueAt.toISOString()).toBe('2030-04-08T15:00:00.000Z');
  });

  it('refuses empty or unknown stages', () => {
    expect(fieldsOf({ ...good, stages: [] })?.stages).toEqual(['Pick at least one stage']);
    expect(fieldsOf({ ...good, stages: ['torque'] })?.stages?.[0]).toMatch(/Invalid enum value/);
    expect(fieldsOf({ ...good, stages: undefined })?.stages).toEqual(['Pick at least one stage']);
  });

  it('refuses a pass mark outside 1–100 or not a whole percent', () => {
    expect(fieldsOf({ ...good, passMarkPct: 0 })?.passMarkPct).toEqual(['The pass mark is at least 1 %']);
    expect(fieldsOf({ ...good, passMarkPct: 101 })?.passMarkPct).toEqual(['The pass mark is at most 100 %']);
    expect(fieldsOf({ ...good, passMarkPct: 72.5 })?.passMarkPct).toEqual(['The pass mark is a whole percent']);
    expect(fieldsOf({ ...good, passMarkPct: '80' })?.passMarkPct).toEqual(['The pass mark is a number from 1 to 100']);
    expect(fieldsOf({ ...good, passMarkPct: undefined })?.passMarkPct).toEqual(['A pass mark is required']);
  });

  it('takes an attempt limit of 1–20 per stage, or null for none', () => {
    expect(createDrillSchema(now).parse({ ...good, attemptLimit: 3 }).attemptLimit).toBe(3);
    expect(createDrillSchema(now).parse({ ...good, attemptLimit: null }).attemptLimit).toBeNull();
    expect(fieldsOf({ ...good, attemptLimit: 0 })?.attemptLimit?.[0]).toMatch(/at least 1 attempt/);
    expect(fieldsOf({ ...good, attemptLimit: 21 })?.attemptLimit?.[0]).toMatch(/At most 20/);
  });

  it('refuses a due date that has passed (or is now), and one that is not a date', () => {
    expect(fieldsOf({ ...good, dueAt: '2030-04-01T11:59:00Z' })?.dueAt).toEqual(['The due date has already passed: pick a later one']);
    expect(fieldsOf({ ...good, dueAt: now.toISOString() })?.dueAt).toEqual(['The due date has already passed: pick a later one']);
    expect(fieldsOf({ ...good, dueAt: '2030-04-08' })?.dueAt?.[0]).toMatch(/date and time/);
    expect(fieldsOf({ ...good, dueAt: undefined })?.dueAt).toEqual(['A due date is required']);
  });

  it('needs a procedure', () => {
    expect(fieldsOf({ ...good, procedure: '  ' })?.procedure).toEqual(['Pick a procedure']);
  });
});

describe('updateDrillSchema', () => {
  it('takes any editable field alone, and closed to close or reopen', () => {
    expect(updateDrillSchema.parse({ closed: true })).toEqual({ closed: true });
    expect(updateDrillSchema.parse({ attemptLimit: null })).toEqual({ attemptLimit: null });
    expect(updateDrillSchema.parse({ stages: ['pins', 'order'] })).toEqual({ stages: ['order', 'pins'] });
  });

  it('refuses an empty change and a change of procedure', () => {
    const empty = updateDrillSchema.safeParse({});
    expect(empty.success).toBe(false);
    expect(empty.error?.flatten().formErrors).toEqual(['Nothing to change: send at least one field']);
    const moved = updateDrillSchema.safeParse({ procedure: 'wren-160-head' });
    expect(moved.error?.flatten().formErrors[0]).toMatch(/procedure stays pinned/);
  });

  it('checks each field as creating does', () => {
    expect(updateDrillSchema.safeParse({ passMarkPct: 0 }).error?.flatten().fieldErrors.passMarkPct).toEqual(['The pass mark is at least 1 %']);
    expect(updateDrillSchema.safeParse({ stages: [] }).error?.flatten().fieldErrors.stages).toEqual(['Pick at least one stage']);
  });
});

describe('dueAtChangeError', () => {
  const current = new Date('2030-03-30T15:00:00Z'); // already passed at `now`
  it('lets an unchanged due date stay, even when it has passed', () => {
    expect(dueAtChangeError(undefined, current, now)).toBeNull();
    expect(dueAtChangeError(new Date(current), current, now)).toBeNull();
  });
  it('refuses moving it to another past date, and accepts a later one', () => {
    expect(dueAtChangeError(new Date('2030-03-31T15:00:00Z'), current, now)).toMatch(/already passed/);
    expect(dueAtChangeError(new Date('2030-04-02T15:00:00Z'), current, now)).toBeNull();
  });
});
