import { describe, expect, it } from 'vitest';
import { isCalendarDate, latestBenchDate, signOffRequestSchema } from '../../src/lib/schemas/sign-offs';

const now = new Date('2026-03-10T18:30:00Z');
const valid = { learnerId: 'u1', procedure: 'wren-160-sump', benchDate: '2026-03-10', outcome: 'pass' };

describe('bench dates', () => {
  it('knows real calendar dates', () => {
    expect(isCalendarDate('2024-02-29')).toBe(true); // 2024 is a leap year (divisible by 4, not by 100)
    expect(isCalendarDate('2025-02-29')).toBe(false);
    expect(isCalendarDate('2026-13-01')).toBe(false);
    expect(isCalendarDate('10/03/2026')).toBe(false);
  });

  it('"today" reaches as far as the earliest time zone (UTC+14)', () => {
    // 18:30 UTC is 08:30 the next day at UTC+14 (Line Islands, from memory).
    expect(latestBenchDate(now)).toBe('2026-03-11');
    expect(latestBenchDate(new Date('2026-03-10T09:59:59Z'))).toBe('2026-03-10');
  });
});

describe('the sign-off request', () => {
  const schema = signOffRequestSchema(now);

  it('fills in notes and photos when left out', () => {
    expect(schema.parse(valid)).toEqual({ ...valid, notes: '', photoIds: [] });
  });

  it('refuses a bench date in the future, a made-up date and a typo far in the past', () => {
    const problems = (benchDate: string) => {
      const r = schema.safeParse({ ...valid, benchDate });
      return r.success ? [] : r.error.flatten().fieldErrors.benchDate;
    };
    expect(problems('2026-03-11')).toEqual([]);
    expect(problems('2026-03-12')).toEqual(['The bench date cannot be in the future']);
    expect(problems('2026-02-30')).toEqual(['Give the bench date as YYYY-MM-DD']);
    expect(problems('0206-03-10')).toEqual(['The bench date cannot be before 2000-01-01']);
  });

  it('refuses an unknown outcome, long notes and photo ids that are not UUIDs', () => {
    const r = schema.safeParse({ ...valid, outcome: 'ok', notes: 'x'.repeat(2001), photoIds: ['abc'] });
    expect(r.success).toBe(false);
    if (r.success) return;
    const fields = r.error.flatten().fieldErrors;
    expect(fields.outcome).toEqual(['Choose pass or redo']);
    expect(fields.notes).toEqual(['Notes are at most 2000 characters']);
    expect(fields.photoIds).toEqual(['Each photo id must be a UUID']);
  });

  it('counts a photo sent twice once', () => {
    const id = '5b0f8a52-7d0e-4c3b-9a51-2f6e8d1c4b7a';
    expect(schema.parse({ ...valid, photoIds: [id, id] }).photoIds).toEqual([id]);
  });
});
