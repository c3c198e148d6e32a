// Due dates in words, in the browser's own time zone: "now", "today at 14:42", "tomorrow at 09:00", "Thu 7 Mar at 09:00".

const MINUTE = 60_000;

function dayKey(date: Date, timeZone?: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(date);
}

function daysBetween(from: Date, to: Date, timeZone?: string): number {
  const a = new Date(`${dayKey(from, timeZone)}T00:00:00Z`).getTime();
  const b = new Date(`${dayKey(to, timeZone)}T00:00:00Z`).getTime();
  return Math.round((b - a) / 86_400_000);
}

/** True when `due` falls on the same calendar day as `now`. */
export function isSameDay(due: Date, now: Date, timeZone?: string): boolean {
  return daysBetween(now, due, timeZone) === 0;
}

export function dueWords(due: Date, now: Date, timeZone?: string): string {
  if (due.getTime() <= now.getTime()) return 'now';
  const time = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit' }).format(due);
  const days = daysBetween(now, due, timeZone);
  if (days === 0) return `today at ${time}`;
  if (days === 1) return `tomorrow at ${time}`;
  const date = new Intl.DateTimeFormat('en-GB', { timeZone, weekday: 'short', day: 'numeric', month: 'short' }).format(due);
  return `${date} at ${time}`;
}

/** "in 10 minutes", "in 2 days": how far off a due date is. */
export function fromNow(due: Date, now: Date): string {
  const minutes = Math.round((due.getTime() - now.getTime()) / MINUTE);
  const format = new Intl.RelativeTimeFormat('en', { numeric: 'auto' });
  if (Math.abs(minutes) < 60) return format.format(minutes, 'minute');
  const hours = Math.round(minutes / 60);
  if (Math.abs(hours) < 36) return format.format(hours, 'hour');
  return format.format(Math.round(hours / 24), 'day');
}
