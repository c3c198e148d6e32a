import { State, type Card } from 'ts-fsrs';

// Pure pieces of a learner's progress: which rework items count as mastered, and the streak of days
// practised in the learner's own time zone.

/**
 * An item is mastered once the schedule trusts it for a week: in review (past the learning steps) with
 * a week or more until it is asked again. A week is about the gap between two sessions of a shop class.
 */
export const MASTERED_DAYS = 7;

export type ItemStanding = 'mastered' | 'due' | 'learning';

export function standingOf(card: Pick<Card, 'state' | 'scheduled_days' | 'due'>, now: Date): ItemStanding {
  if (card.due.getTime() <= now.getTime()) return 'due';
  if (card.state === State.Review && card.scheduled_days >= MASTERED_DAYS) return 'mastered';
  return 'learning';
}

/** True for a time zone name the runtime knows (IANA names such as "Europe/Oslo", and "UTC"). */
export function isTimeZone(name: string): boolean {
  if (name.length === 0 || name.length > 64) return false;
  try {
    new Intl.DateTimeFormat('en', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

/** The calendar day of an instant in a time zone, as YYYY-MM-DD. */
export function dayIn(instant: Date, timeZone: string): string {
  // en-CA writes dates as YYYY-MM-DD.
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(instant);
}

/** The day before or after a YYYY-MM-DD day (calendar arithmetic, no time zone involved). */
export function addDays(day: string, days: number): string {
  const date = new Date(`${day}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + days);
  return date.toISOString().slice(0, 10);
}

export interface Streak {
  /** Days in a row with practice, up to today; a streak still counts today before today's practice. */
  current: number;
  longest: number;
  practisedToday: boolean;
  /** Every day practised, oldest first. */
  days: string[];
}

/** The streak from the instants a learner practised (attempts and rework answers), seen from `now`. */
export function streakOf(instants: readonly Date[], now: Date, timeZone: string): Streak {
  const days = [...new Set(instants.map((t) => dayIn(t, timeZone)))].sort();
  const practised = new Set(days);
  const today = dayIn(now, timeZone);
  const practisedToday = practised.has(today);
  // Yesterday's streak is still alive today until the day is over.
  let cursor = practisedToday ? today : addDays(today, -1);
  let current = 0;
  while (practised.has(cursor)) {
    current += 1;
    cursor = addDays(cursor, -1);
  }
  let longest = 0;
  let run = 0;
  days.forEach((day, i) => {
    run = i > 0 && addDays(days[i - 1]!, 1) === day ? run + 1 : 1;
    longest = Math.max(longest, run);
  });
  return { current, longest, practisedToday, days };
}
