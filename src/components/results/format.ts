import type { DrillStatus } from '../../lib/drills/progress';

// Words and numbers as the results pages show them; every status has an icon and a word, never colour alone.

export const STATUS_TEXT: Record<DrillStatus, { icon: string; text: string; tone: string }> = {
  passed: { icon: '✓', text: 'Passed', tone: 'bg-go-50 text-go-700 border-go-500' },
  'in-progress': { icon: '◐', text: 'In progress', tone: 'bg-steel-50 text-steel-800 border-steel-300' },
  'not-started': { icon: '○', text: 'Not started', tone: 'bg-white text-steel-600 border-steel-200' },
  overdue: { icon: '⚠', text: 'Overdue', tone: 'bg-brass-50 text-brass-800 border-brass-500' },
  missed: { icon: '✗', text: 'Missed', tone: 'bg-signal-50 text-signal-700 border-signal-500' },
};

/** Sort order of statuses: the learners who need help first when sorted ascending. */
export const STATUS_RANK: Record<DrillStatus, number> = { missed: 0, overdue: 1, 'not-started': 2, 'in-progress': 3, passed: 4 };

export const formatPct = (pct: number | null) => (pct === null ? '—' : `${pct.toLocaleString('en', { maximumFractionDigits: 1 })} %`);

/** .80 style, as item-analysis tables print shares and indices. */
export function formatIndex(value: number | null): string {
  if (value === null) return '—';
  const fixed = Math.abs(value).toFixed(2).replace(/^0/, '');
  return value < 0 ? `−${fixed}` : fixed;
}

const dateTime = new Intl.DateTimeFormat('en', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });
const dateOnly = new Intl.DateTimeFormat('en', { dateStyle: 'medium', timeZone: 'UTC' });

/** Times in UTC, so the server's render and the browser's agree (the CSV holds the same instant). */
export const formatDateTime = (iso: string | null) => (iso ? `${dateTime.format(new Date(iso))} UTC` : '—');
export const formatDate = (isoDate: string) => dateOnly.format(new Date(`${isoDate.slice(0, 10)}T00:00:00Z`));

export const attemptHref = (id: string) => `/teach/attempts/${id}`;
