import { describe, expect, it } from 'vitest';
import { dueWords, fromNow, isSameDay } from '~/components/rework/when';

// Due dates as the rework page words them; the time zone is fixed so the words do not depend on the machine.

describe('due dates in words', () => {
  const now = new Date('2024-03-04T09:00:00Z');
  it('now, later today, tomorrow, and later days by weekday and date', () => {
    expect(dueWords(new Date('2024-03-04T08:59:00Z'), now, 'UTC')).toBe('now');
    expect(dueWords(new Date('2024-03-04T09:10:00Z'), now, 'UTC')).toBe('today at 09:10');
    expect(dueWords(new Date('2024-03-05T07:00:00Z'), now, 'UTC')).toBe('tomorrow at 07:00');
    // 2024-03-12 was a Tuesday.
    expect(dueWords(new Date('2024-03-12T09:00:00Z'), now, 'UTC')).toBe('Tue 12 Mar at 09:00');
  });

  it('the day boundary is the learner\'s, not UTC\'s', () => {
    // 23:30 UTC on the 4th is already 00:30 on the 5th in Oslo (CET, UTC+1).
    const late = new Date('2024-03-04T23:30:00Z');
    expect(isSameDay(late, now, 'UTC')).toBe(true);
    expect(isSameDay(late, now, 'Europe/Oslo')).toBe(false);
    expect(dueWords(late, now, 'Europe/Oslo')).toBe('tomorrow at 00:30');
  });

  it('how far off: minutes, hours, days', () => {
    expect(fromNow(new Date(now.getTime() + 60_000), now)).toBe('in 1 minute');
    expect(fromNow(new Date(now.getTime() + 10 * 60_000), now)).toBe('in 10 minutes');
    expect(fromNow(new Date(now.getTime() + 5 * 3_600_000), now)).toBe('in 5 hours');
    expect(fromNow(new Date(now.getTime() + 2 * 86_400_000), now)).toBe('in 2 days');
  });
});
