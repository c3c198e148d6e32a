import { describe, expect, it } from 'vitest';
import { drillAssignedMessage, drillLink, drillReminderMessage, type DrillMailFacts } from '~/lib/mail/drill-messages';
import { formatLocalDateTime, formatUtcDateTime, fromDateTimeLocal, toDateTimeLocal } from '~/lib/local-time';

const facts: DrillMailFacts = {
  learnerName: 'Ava Lindqvist',
  className: 'Small Engines I',
  procedureTitle: 'Wren 160: install the sump',
  stages: ['order', 'final-check'],
  dueAt: new Date('2030-05-14T15:00:00Z'),
  passMarkPct: 80,
  attemptLimit: 3,
  answersAfterDue: true,
  link: 'https://bench.example/train/wren-160-sump?drill=d1',
};

describe('drill e-mails', () => {
  it('the notice names the class, the procedure, the rules and the link, with the due date in UTC', () => {
    const mail = drillAssignedMessage(facts);
    expect(mail.subject).toBe('New drill for Small Engines I: Wren 160: install the sump');
    expect(mail.text).toContain('Hello Ava Lindqvist,');
    expect(mail.text).toContain('Stages: Order, Final check');
    // 14 May 2030 is a Tuesday (proleptic Gregorian calendar; checked with `date -u -d 2030-05-14`).
    expect(mail.text).toContain('Due: Tue 14 May 2030, 15:00 UTC');
    expect(mail.text).toContain('Pass mark: 80 % in every stage');
    expect(mail.text).toContain('Attempts: 3 per stage');
    expect(mail.text).toContain('the right answers show after the due date');
    expect(mail.text).toContain('Open it: https://bench.example/train/wren-160-sump?drill=d1');
  });

  it('the reminder says where the learner stands', () => {
    expect(drillReminderMessage({ ...facts, standing: { status: 'not-started', bestPct: null } }).text).toContain('You have not started it yet.');
    const started = drillReminderMessage({ ...facts, attemptLimit: null, standing: { status: 'in-progress', bestPct: 62.5 } });
    expect(started.subject).toBe('Due soon: Wren 160: install the sump (Small Engines I)');
    expect(started.text).toContain('So far: in progress, best score 63 %.');
    expect(started.text).toContain('Attempts: as many as you like');
  });

  it('builds the trainer link without a doubled slash', () => {
    expect(drillLink('http://localhost:4321/', 'wren-160-head', 'abc')).toBe('http://localhost:4321/train/wren-160-head?drill=abc');
  });
});

describe('local time', () => {
  const at = new Date('2030-05-14T15:00:00Z');
  it('formats an instant in a given zone and says which', () => {
    // US Central time is UTC−5 in May (daylight saving time), from memory.
    const text = formatLocalDateTime(at, { locale: 'en-US', timeZone: 'America/Chicago' });
    expect(text).toContain('10:00');
    expect(text).toContain('CDT');
    expect(formatUtcDateTime(at)).toBe('Tue 14 May 2030, 15:00 UTC');
  });

  it('reads a datetime-local value back as the same instant', () => {
    const local = toDateTimeLocal(at);
    expect(local).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/);
    expect(fromDateTimeLocal(local)).toBe(at.toISOString());
    expect(fromDateTimeLocal('')).toBeNull();
    expect(fromDateTimeLocal('14/05/2030 15:00')).toBeNull();
  });
});
