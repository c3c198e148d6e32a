import { describe, expect, it } from 'vitest';
import { Rating } from 'ts-fsrs';
import { addDays, dayIn, isTimeZone, standingOf, streakOf, MASTERED_DAYS } from '~/lib/rework/progress';
import { newCard, review } from '~/lib/rework/schedule';
import { timeZoneSchema } from '~/lib/schemas/rework';

const at = (iso: string) => new Date(iso);

describe('days in the learner\'s time zone', () => {
  it('an evening in Chicago is already the next day in UTC', () => {
    // 2024-03-05 03:30 UTC is 2024-03-04 21:30 in Chicago (CST, UTC−6; IANA tz database).
    const t = at('2024-03-05T03:30:00Z');
    expect(dayIn(t, 'UTC')).toBe('2024-03-05');
    expect(dayIn(t, 'America/Chicago')).toBe('2024-03-04');
    // Auckland is UTC+13 in March (NZDT).
    expect(dayIn(at('2024-03-04T12:00:00Z'), 'Pacific/Auckland')).toBe('2024-03-05');
  });

  it('calendar arithmetic crosses month and leap-day ends', () => {
    expect(addDays('2024-02-28', 1)).toBe('2024-02-29');
    expect(addDays('2024-03-01', -1)).toBe('2024-02-29');
    expect(addDays('2023-12-31', 1)).toBe('2024-01-01');
  });

  it('knows real time zone names and refuses others', () => {
    expect(isTimeZone('Europe/Oslo')).toBe(true);
    expect(isTimeZone('UTC')).toBe(true);
    expect(isTimeZone('Mars/Olympus')).toBe(false);
    expect(isTimeZone('')).toBe(false);
    expect(timeZoneSchema.parse(undefined)).toBe('UTC');
    expect(timeZoneSchema.safeParse('Not a zone').success).toBe(false);
  });
});

describe('streak of days practised', () => {
  const now = at('2024-03-10T15:00:00Z');

  it('counts days in a row up to today, and the longest run', () => {
    const instants = ['2024-03-01T10:00:00Z', '2024-03-02T10:00:00Z', '2024-03-03T10:00:00Z', '2024-03-08T10:00:00Z', '2024-03-09T10:00:00Z', '2024-03-10T08:00:00Z', '2024-03-10T09:00:00Z'].map(at);
    expect(streakOf(instants, now, 'UTC')).toEqual({
      current: 3,
      longest: 3,
      practisedToday: true,
      days: ['2024-03-01', '2024-03-02', '2024-03-03', '2024-03-08', '2024-03-09', '2024-03-10'],
    });
  });

  it('a streak that reached yesterday still counts until today is over', () => {
    const s = streakOf([at('2024-03-08T10:00:00Z'), at('2024-03-09T10:00:00Z')], now, 'UTC');
    expect(s).toMatchObject({ current: 2, practisedToday: false });
    expect(streakOf([at('2024-03-07T10:00:00Z')], now, 'UTC').current).toBe(0);
    expect(streakOf([], now, 'UTC')).toEqual({ current: 0, longest: 0, practisedToday: false, days: [] });
  });

  it('the same practice makes a streak in one time zone and not in another', () => {
    // Late evenings in Chicago fall on the next UTC day: 21:30 CST on the 8th and 9th, seen on the 10th.
    const evenings = [at('2024-03-09T03:30:00Z'), at('2024-03-10T03:30:00Z')];
    const chicagoNoon = at('2024-03-10T18:00:00Z');
    expect(streakOf(evenings, chicagoNoon, 'America/Chicago')).toMatchObject({ current: 2, practisedToday: false, days: ['2024-03-08', '2024-03-09'] });
    expect(streakOf(evenings, chicagoNoon, 'UTC')).toMatchObject({ current: 2, practisedToday: true, days: ['2024-03-09', '2024-03-10'] });
  });
});

describe('mastered, due or still learning', () => {
  const t0 = at('2024-03-04T09:00:00Z');
  it('a new item is due; answered right once it is learning; once it goes a week out it is mastered', () => {
    const fresh = newCard(t0);
    expect(standingOf(fresh, t0)).toBe('due');
    let card = review(fresh, Rating.Good, t0);
    expect(standingOf(card, t0)).toBe('learning');
    // Keep answering right on time until the gap reaches a week.
    let guard = 0;
    while (card.scheduled_days < MASTERED_DAYS && guard++ < 20) card = review(card, Rating.Good, card.due);
    expect(standingOf(card, new Date(card.due.getTime() - 1))).toBe('mastered');
    expect(standingOf(card, card.due)).toBe('due');
  });
});
