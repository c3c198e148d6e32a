import { useEffect, useState } from 'react';
import { DRILL_STATUSES, STATUS_ICONS, STATUS_LABELS } from '../../lib/drills/labels';
import { formatLocalDateTime, formatUtcDateTime } from '../../lib/local-time';
import { STAGE_LABELS } from '../trainer/labels';
import { updateDrill, type ClassDrillView } from './drill-api';

// One drill in the class's list: what it asks, where the class stands, and edit / close / reopen.

interface Props {
  drill: ClassDrillView;
  onEdit(): void;
  onChanged(drill: ClassDrillView): Promise<void>;
}

export function DrillRow({ drill, onEdit, onChanged }: Props) {
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const closed = drill.closedAt !== null;
  const due = useLocalTime(drill.dueAt);

  const setClosed = async (close: boolean) => {
    setBusy(true);
    const saved = await updateDrill(drill.id, { closed: close });
    setBusy(false);
    setConfirming(false);
    if (saved.ok) {
      setError(null);
      await onChanged(saved.drill);
    } else setError(saved.error);
  };

  return (
    <div>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <p className="text-lg font-semibold">
            {drill.procedure.title} <span className="text-sm font-normal text-steel-600">version {drill.procedure.version}</span>
            {closed && <span className="ml-2 rounded-full border border-steel-400 px-2 py-0.5 text-sm font-semibold text-steel-700">Closed</span>}
          </p>
          <p className="text-sm text-steel-700">
            {drill.stages.map((s) => STAGE_LABELS[s]).join(' · ')} · pass mark {drill.passMarkPct} % ·{' '}
            {drill.attemptLimit === null ? 'no attempt limit' : `${drill.attemptLimit} attempts per stage`}
            {drill.answersAfterDue && ' · answers after the due date'}
          </p>
          <p className="text-sm text-steel-800">
            Due{' '}
            <time dateTime={drill.dueAt} className="font-semibold">
              {due}
            </time>
          </p>
        </div>
        {!confirming && (
          <div className="flex flex-wrap gap-2">
            {!closed && (
              <button type="button" className="btn-quiet" onClick={onEdit} aria-label={`Edit drill: ${drill.procedure.title}`}>
                Edit
              </button>
            )}
            <button
              type="button"
              className="btn-quiet"
              disabled={busy}
              onClick={() => (closed ? void setClosed(false) : setConfirming(true))}
              aria-label={`${closed ? 'Reopen' : 'Close'} drill: ${drill.procedure.title}`}
            >
              {closed ? 'Reopen' : 'Close'}
            </button>
          </div>
        )}
      </div>

      <p className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label={`Where the ${drill.learners} learners stand`} data-testid="status-counts">
        {DRILL_STATUSES.map((status) => (
          <span key={status} className={drill.counts[status] ? 'font-semibold text-steel-900' : 'text-steel-500'}>
            <span aria-hidden="true">{STATUS_ICONS[status]}</span> {drill.counts[status]} {STATUS_LABELS[status].toLowerCase()}
          </span>
        ))}
      </p>

      {confirming && (
        <div role="group" aria-label="Close this drill?" className="mt-3 rounded-lg border border-brass-500 bg-brass-50 p-3">
          <p className="mb-2 font-semibold">Close this drill? Learners can no longer submit to it; every attempt made on it is kept.</p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-primary" disabled={busy} onClick={() => void setClosed(true)}>
              Yes, close it
            </button>
            <button type="button" className="btn-quiet" onClick={() => setConfirming(false)}>
              Keep it open
            </button>
          </div>
        </div>
      )}
      {error && (
        <p className="field-error" role="alert">
          <span aria-hidden="true">⚠</span> {error}
        </p>
      )}
    </div>
  );
}

/** UTC on the server's render, the reader's own zone once in the browser. */
function useLocalTime(iso: string): string {
  const [text, setText] = useState(() => formatUtcDateTime(new Date(iso)));
  useEffect(() => setText(formatLocalDateTime(new Date(iso))), [iso]);
  return text;
}
