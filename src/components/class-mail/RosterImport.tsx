import { useState, type ChangeEvent } from 'react';
import type { PlannedRow } from '../../lib/roster/plan';
import { ROSTER_LIMITS } from '../../lib/roster/rows';
import { EnrolledSummary } from './EnrolledSummary';
import { RosterPreview } from './RosterPreview';
import { plural, postJson, type Enrolled, type Preview } from './api';

type State =
  | { step: 'edit' }
  | { step: 'busy' }
  | { step: 'preview'; preview: Preview }
  | { step: 'refused'; message: string; rows?: PlannedRow[] }
  | { step: 'done'; result: Enrolled };

/** Roster import on the class page: paste or pick a CSV → preview of every row → import → what happened. */
export default function RosterImport({ classId }: { classId: string }) {
  const [csv, setCsv] = useState('');
  const [state, setState] = useState<State>({ step: 'edit' });
  const base = `/api/classes/${classId}/roster`;

  function edit(text: string) {
    setCsv(text);
    // A preview of other text would mislead; the rows must be checked again.
    if (state.step !== 'busy') setState({ step: 'edit' });
  }

  async function pickFile(event: ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    if (!file) return;
    if (file.size > ROSTER_LIMITS.maxBytes) {
      setState({ step: 'refused', message: `That file is too large: at most ${ROSTER_LIMITS.maxBytes / 1024} KB.` });
      return;
    }
    // File.text() reads UTF-8; the server drops a byte-order mark if one is left.
    edit(await file.text());
  }

  async function check() {
    setState({ step: 'busy' });
    const answer = await postJson<Preview>(`${base}/preview`, { csv });
    setState(answer.ok ? { step: 'preview', preview: answer.body } : { step: 'refused', message: answer.refusal.error, rows: answer.refusal.rows });
  }

  async function runImport() {
    setState({ step: 'busy' });
    const answer = await postJson<Enrolled>(`${base}/import`, { csv });
    if (answer.ok) {
      setState({ step: 'done', result: answer.body });
      setCsv('');
    } else {
      setState({ step: 'refused', message: answer.refusal.error, rows: answer.refusal.rows });
    }
  }

  const preview = state.step === 'preview' ? state.preview : null;
  const problem = state.step === 'refused' ? state.message : null;
  return (
    <div>
      <div className="mb-4 max-w-3xl">
        <label htmlFor="roster-file" className="field-label">
          CSV file
        </label>
        <input id="roster-file" type="file" accept=".csv,text/csv,text/plain" onChange={pickFile} className="block min-h-touch text-steel-800" />
      </div>
      <div className="mb-4 max-w-3xl">
        <label htmlFor="roster-csv" className="field-label">
          Rows (name, e-mail)
        </label>
        <textarea
          id="roster-csv"
          value={csv}
          onChange={(e) => edit(e.target.value)}
          rows={6}
          spellCheck={false}
          placeholder={'name,email\nAva Lindqvist,ava@example.org'}
          aria-describedby={problem ? 'roster-hint roster-error' : 'roster-hint'}
          aria-invalid={problem ? true : undefined}
          className="field-input py-2 font-mono text-sm"
        />
        <p id="roster-hint" className="mt-1 text-sm text-steel-500">
          One person per row. A header row is optional (name and e-mail in any order). At most {ROSTER_LIMITS.maxRows} rows.
        </p>
        {problem && (
          <p id="roster-error" className="field-error" role="alert">
            <span aria-hidden="true">⚠</span> {problem}
          </p>
        )}
      </div>

      <button type="button" className="btn-quiet" onClick={check} disabled={state.step === 'busy' || csv.trim() === ''}>
        {state.step === 'busy' ? 'Working…' : 'Check the rows'}
      </button>

      {preview && (
        <>
          <p className="mt-4 font-semibold" data-testid="roster-counts">
            {plural(preview.counts.add, 'person joins', 'people join')} now · {plural(preview.counts.invite, 'invitation', 'invitations')} to send
            {preview.counts.withErrors > 0 && (
              <span className="text-signal-700"> · ⚠ {plural(preview.counts.withErrors, 'row has', 'rows have')} problems</span>
            )}
          </p>
          <RosterPreview rows={preview.rows} />
          {preview.ok ? (
            <button type="button" className="btn-primary mt-4" onClick={runImport}>
              Import {plural(preview.counts.add + preview.counts.invite, 'person', 'people')}
            </button>
          ) : (
            <p className="mt-4 text-steel-700" role="status">
              Fix the rows marked ⚠ above in the text and check again. Nothing is imported while any row has a problem.
            </p>
          )}
        </>
      )}
      {state.step === 'refused' && state.rows && <RosterPreview rows={state.rows} />}
      {state.step === 'done' && <EnrolledSummary result={state.result} testId="roster-result" />}
    </div>
  );
}
