import { useState, type FormEvent } from 'react';
import { EnrolledSummary } from './EnrolledSummary';
import { plural, postJson, type Enrolled } from './api';

interface Entry {
  key: number;
  email: string;
  name: string;
}

let nextKey = 1;
const blank = (): Entry => ({ key: nextKey++, email: '', name: '' });

/** Invite one or a few people by e-mail; each gets a sign-up link that joins the class. */
export default function InviteForm({ classId }: { classId: string }) {
  const [entries, setEntries] = useState<Entry[]>(() => [blank()]);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  // Problems per entry, by position (the server numbers entries from 1).
  const [rowErrors, setRowErrors] = useState<Map<number, string[]>>(new Map());
  const [result, setResult] = useState<Enrolled | null>(null);

  function change(key: number, field: 'email' | 'name', value: string) {
    setEntries((list) => list.map((e) => (e.key === key ? { ...e, [field]: value } : e)));
  }

  async function submit(event: FormEvent) {
    event.preventDefault();
    setBusy(true);
    setResult(null);
    const invites = entries.filter((e) => e.email.trim() || e.name.trim()).map((e) => ({ email: e.email, name: e.name.trim() || undefined }));
    const answer = await postJson<Enrolled>(`/api/classes/${classId}/invitations`, { invites });
    setBusy(false);
    if (answer.ok) {
      setResult(answer.body);
      setEntries([blank()]);
      setProblem(null);
      setRowErrors(new Map());
      return;
    }
    setProblem(answer.refusal.error);
    setRowErrors(new Map((answer.refusal.rows ?? []).filter((r) => r.errors.length).map((r) => [r.row, r.errors])));
  }

  // Entries the server saw are the non-empty ones, numbered in order.
  let position = 0;
  return (
    <form onSubmit={submit} noValidate>
      {problem && (
        <p role="alert" className="mb-4 flex items-start gap-2 rounded-lg border border-signal-500 bg-signal-50 px-4 py-3 font-medium text-signal-700">
          <span aria-hidden="true">⚠</span>
          <span>{problem}</span>
        </p>
      )}
      <ul className="space-y-3">
        {entries.map((entry, i) => {
          const filled = entry.email.trim() || entry.name.trim();
          const errors = filled ? rowErrors.get(++position) : undefined;
          const errorId = `invite-${entry.key}-error`;
          return (
            <li key={entry.key} className="grid gap-2 sm:grid-cols-[1fr_1fr_auto] sm:items-start">
              <div>
                <label htmlFor={`invite-${entry.key}-email`} className="field-label">
                  E-mail {entries.length > 1 ? i + 1 : ''}
                </label>
                <input
                  id={`invite-${entry.key}-email`}
                  type="email"
                  autoComplete="off"
                  value={entry.email}
                  onChange={(e) => change(entry.key, 'email', e.target.value)}
                  aria-invalid={errors ? true : undefined}
                  aria-describedby={errors ? errorId : undefined}
                  className={`field-input ${errors ? 'border-signal-500' : ''}`}
                />
                {errors && (
                  <p id={errorId} className="field-error" role="alert">
                    <span aria-hidden="true">⚠</span> {errors.join(' · ')}
                  </p>
                )}
              </div>
              <div>
                <label htmlFor={`invite-${entry.key}-name`} className="field-label">
                  Name (optional)
                </label>
                <input
                  id={`invite-${entry.key}-name`}
                  autoComplete="off"
                  value={entry.name}
                  onChange={(e) => change(entry.key, 'name', e.target.value)}
                  className="field-input"
                />
              </div>
              {entries.length > 1 && (
                <button
                  type="button"
                  className="btn-quiet sm:mt-6"
                  onClick={() => setEntries((list) => list.filter((e) => e.key !== entry.key))}
                  aria-label={`Remove address ${i + 1}`}
                >
                  Remove
                </button>
              )}
            </li>
          );
        })}
      </ul>
      <div className="mt-4 flex flex-wrap gap-3">
        <button type="button" className="btn-quiet" onClick={() => setEntries((list) => [...list, blank()])}>
          Add another address
        </button>
        <button type="submit" className="btn-primary" disabled={busy}>
          {busy ? 'Sending…' : `Send ${plural(Math.max(1, entries.filter((e) => e.email.trim()).length), 'invitation', 'invitations')}`}
        </button>
      </div>
      {result && <EnrolledSummary result={result} testId="invite-result" />}
    </form>
  );
}
