// Dates shown in the reader's own time zone. The server renders an instant; the browser formats it
// with its own zone and language, so a learner never converts a due date in their head.

const PARTS: Intl.DateTimeFormatOptions = {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: 'numeric',
  minute: '2-digit',
  timeZoneName: 'short',
};

/** 'Tue, May 12, 2026, 5:00 PM GMT+2'; `timeZone` and `locale` default to the browser's. */
export function formatLocalDateTime(at: Date, options: { locale?: string; timeZone?: string } = {}): string {
  return new Intl.DateTimeFormat(options.locale, { ...PARTS, timeZone: options.timeZone }).format(at);
}

/** The value a datetime-local input shows for an instant, in the browser's zone: '2026-05-12T17:00'. */
export function toDateTimeLocal(at: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${at.getFullYear()}-${pad(at.getMonth() + 1)}-${pad(at.getDate())}T${pad(at.getHours())}:${pad(at.getMinutes())}`;
}

/**
 * A datetime-local value read in the browser's zone, as an ISO instant; null when empty or unreadable.
 * 'YYYY-MM-DDTHH:mm' without an offset is local time by the ECMAScript date-time string rules.
 */
export function fromDateTimeLocal(value: string): string | null {
  if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2})?$/.test(value)) return null;
  const at = new Date(value);
  return Number.isNaN(at.getTime()) ? null : at.toISOString();
}

/** 'Tue 12 May 2026, 15:00 UTC': for mail and for pages before their script runs, where the zone is unknown. */
export function formatUtcDateTime(at: Date): string {
  // Built from parts so the punctuation does not depend on the runtime's locale data.
  const parts = new Intl.DateTimeFormat('en-GB', {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    timeZone: 'UTC',
  }).formatToParts(at);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  return `${part('weekday')} ${part('day')} ${part('month')} ${part('year')}, ${part('hour')}:${part('minute')} UTC`;
}
