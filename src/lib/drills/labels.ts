import type { DrillStatus } from './progress';

// Words and icons for a learner's standing on a drill: colour is never the only signal.

export const STATUS_LABELS: Record<DrillStatus, string> = {
  'not-started': 'Not started',
  'in-progress': 'In progress',
  passed: 'Passed',
  missed: 'Missed',
  overdue: 'Overdue',
};

export const STATUS_ICONS: Record<DrillStatus, string> = {
  'not-started': '○',
  'in-progress': '◐',
  passed: '✓',
  missed: '✗',
  overdue: '⚠',
};

export const DRILL_STATUSES: DrillStatus[] = ['not-started', 'in-progress', 'overdue', 'passed', 'missed'];

/** 72.5 → '73 %'; null (nothing tried) → '—'. */
export function formatPct(pct: number | null): string {
  return pct === null ? '—' : `${Math.round(pct)} %`;
}

/** null → 'No limit'; 1 → '1 attempt left'. */
export function attemptsLeftText(left: number | null): string {
  if (left === null) return 'No limit';
  return `${left} attempt${left === 1 ? '' : 's'} left`;
}
