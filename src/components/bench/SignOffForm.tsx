import { useEffect, useId, useRef, useState, type FormEvent, type ReactNode } from 'react';
import { MAX_SIGN_OFF_NOTES, type SignOffOutcome } from '../../lib/schemas/sign-offs';
import type { BenchPhotoJson } from '../../lib/uploads/views';
import { PhotoTile } from './PhotoTile';

interface Props {
  classId: string;
  learners: { id: string; name: string }[];
  procedures: { slug: string; title: string }[];
}

type Fields = Record<string, string[] | undefined>;
type Photos = { state: 'none' } | { state: 'loading' } | { state: 'ready'; list: BenchPhotoJson[] } | { state: 'failed'; message: string };

/** Today in the instructor's own time zone, as the date input wants it. */
function localToday(): string {
  const now = new Date();
  return new Date(now.getTime() - now.getTimezoneOffset() * 60_000).toISOString().slice(0, 10);
}

function FieldError({ id, messages }: { id: string; messages: string[] | undefined }) {
  if (!messages?.length) return null;
  return (
    <p id={id} className="field-error" role="alert">
      <span aria-hidden="true">⚠</span> {messages.join(' ')}
    </p>
  );
}

function Row({ children }: { children: ReactNode }) {
  return <div className="mb-4">{children}</div>;
}

/** The instructor's sign-off form: learner, procedure, date, pass/redo, notes and the learner's photos to attach. */
export default function SignOffForm({ classId, learners, procedures }: Props) {
  const id = useId();
  const [learnerId, setLearnerId] = useState('');
  const [procedure, setProcedure] = useState('');
  const [benchDate, setBenchDate] = useState('');
  const [outcome, setOutcome] = useState<SignOffOutcome | ''>('');
  const [notes, setNotes] = useState('');
  const [picked, setPicked] = useState<string[]>([]);
  const [photos, setPhotos] = useState<Photos>({ state: 'none' });
  const [fields, setFields] = useState<Fields>({});
  const [error, setError] = useState<string | null>(null);
  const [sending, setSending] = useState(false);
  const banner = useRef<HTMLParagraphElement>(null);

  // A field's message goes as soon as the field is changed; the others stay until the next send.
  const edit = <T,>(name: string, set: (value: T) => void) => (value: T) => {
    set(value);
    setFields(({ [name]: _gone, ...rest }) => rest);
  };
  useEffect(() => {
    if (error) banner.current?.focus();
  }, [error]);

  // The date defaults to today once the island runs (the server does not know the instructor's time zone).
  useEffect(() => setBenchDate(localToday()), []);

  useEffect(() => {
    setPicked([]);
    if (!learnerId || !procedure) return setPhotos({ state: 'none' });
    let current = true;
    setPhotos({ state: 'loading' });
    const query = new URLSearchParams({ learner: learnerId, procedure });
    fetch(`/api/classes/${classId}/bench-photos?${query}`)
      .then(async (res) => {
        const body = await res.json();
        if (!current) return;
        setPhotos(res.ok ? { state: 'ready', list: body as BenchPhotoJson[] } : { state: 'failed', message: body.error ?? 'Could not load the photos' });
      })
      .catch(() => current && setPhotos({ state: 'failed', message: 'Could not load the photos. Check the connection.' }));
    return () => {
      current = false;
    };
  }, [classId, learnerId, procedure]);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setSending(true);
    setError(null);
    try {
      const res = await fetch(`/api/classes/${classId}/sign-offs`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ learnerId, procedure, benchDate, outcome, notes, photoIds: picked }),
      });
      const body = await res.json().catch(() => ({}));
      if (res.status === 201) {
        // The list below is drawn on the server; load it again with the new sign-off in it.
        window.location.assign(`${window.location.pathname}?saved=${encodeURIComponent(body.id)}#sign-off-list`);
        return;
      }
      const problems = (body.fields ?? {}) as Fields;
      setFields(problems);
      // Field problems are told beside their fields; the banner only says where to look.
      setError(
        Object.keys(problems).length > 0
          ? 'Not saved yet: check the fields marked below.'
          : (body.error ?? `The sign-off was not saved (status ${res.status}).`),
      );
    } catch {
      setError('The sign-off did not reach the server. Check the connection and try again.');
    } finally {
      setSending(false);
    }
  }

  const describe = (name: string, hint?: boolean) =>
    [fields[name]?.length ? `${id}-${name}-error` : '', hint ? `${id}-${name}-hint` : ''].filter(Boolean).join(' ') || undefined;
  const invalid = (name: string) => (fields[name]?.length ? 'true' : undefined);
  const inputClass = (name: string) => `field-input ${fields[name]?.length ? 'border-signal-500' : ''}`;

  return (
    <form onSubmit={submit} noValidate aria-describedby={error ? `${id}-error` : undefined} data-testid="sign-off-form">
      {error && (
        <p ref={banner} tabIndex={-1} id={`${id}-error`} role="alert" className="mb-4 flex items-start gap-2 rounded-lg border border-signal-500 bg-signal-50 px-4 py-3 font-medium text-signal-700">
          <span aria-hidden="true">⚠</span> <span>{error}</span>
        </p>
      )}

      <Row>
        <label htmlFor={`${id}-learner`} className="field-label">
          Learner
        </label>
        <select
          id={`${id}-learner`}
          className={inputClass('learnerId')}
          value={learnerId}
          onChange={(e) => edit('learnerId', setLearnerId)(e.target.value)}
          aria-invalid={invalid('learnerId')}
          aria-describedby={describe('learnerId')}
        >
          <option value="">Choose a learner…</option>
          {learners.map((l) => (
            <option key={l.id} value={l.id}>
              {l.name}
            </option>
          ))}
        </select>
        <FieldError id={`${id}-learnerId-error`} messages={fields.learnerId} />
      </Row>

      <Row>
        <label htmlFor={`${id}-procedure`} className="field-label">
          Procedure
        </label>
        <select
          id={`${id}-procedure`}
          className={inputClass('procedure')}
          value={procedure}
          onChange={(e) => edit('procedure', setProcedure)(e.target.value)}
          aria-invalid={invalid('procedure')}
          aria-describedby={describe('procedure')}
        >
          <option value="">Choose a procedure…</option>
          {procedures.map((p) => (
            <option key={p.slug} value={p.slug}>
              {p.title}
            </option>
          ))}
        </select>
        <FieldError id={`${id}-procedure-error`} messages={fields.procedure} />
      </Row>

      <Row>
        <label htmlFor={`${id}-date`} className="field-label">
          Bench date
        </label>
        <input
          id={`${id}-date`}
          type="date"
          className={inputClass('benchDate')}
          value={benchDate}
          max={localToday()}
          onChange={(e) => edit('benchDate', setBenchDate)(e.target.value)}
          aria-invalid={invalid('benchDate')}
          aria-describedby={describe('benchDate')}
        />
        <FieldError id={`${id}-benchDate-error`} messages={fields.benchDate} />
      </Row>

      <fieldset className="mb-4" aria-describedby={describe('outcome')}>
        <legend className="field-label">Outcome</legend>
        <div className="flex gap-3">
          {(
            [
              ['pass', '✓ Pass', 'peer-checked:border-go-500 peer-checked:bg-go-50 peer-checked:text-go-700'],
              ['redo', '↻ Redo', 'peer-checked:border-signal-500 peer-checked:bg-signal-50 peer-checked:text-signal-700'],
            ] as const
          ).map(([value, label, checked]) => (
            <label key={value} className="flex-1 cursor-pointer">
              <input
                type="radio"
                name={`${id}-outcome`}
                value={value}
                checked={outcome === value}
                onChange={() => edit('outcome', setOutcome)(value)}
                className="peer sr-only"
              />
              <span
                className={`flex min-h-touch items-center justify-center rounded-lg border-2 border-steel-300 bg-white px-4 font-semibold text-steel-800 peer-focus-visible:outline peer-focus-visible:outline-[3px] peer-focus-visible:outline-brass-400 ${checked}`}
              >
                {label}
              </span>
            </label>
          ))}
        </div>
        <FieldError id={`${id}-outcome-error`} messages={fields.outcome} />
      </fieldset>

      <Row>
        <label htmlFor={`${id}-notes`} className="field-label">
          Notes
        </label>
        <textarea
          id={`${id}-notes`}
          rows={4}
          maxLength={MAX_SIGN_OFF_NOTES}
          className={`${inputClass('notes')} py-2`}
          value={notes}
          onChange={(e) => edit('notes', setNotes)(e.target.value)}
          aria-invalid={invalid('notes')}
          aria-describedby={describe('notes', true)}
        />
        <p id={`${id}-notes-hint`} className="mt-1 text-sm text-steel-500">
          What you checked, what to redo. {notes.length} of {MAX_SIGN_OFF_NOTES} characters.
        </p>
        <FieldError id={`${id}-notes-error`} messages={fields.notes} />
      </Row>

      <fieldset className="mb-6" aria-describedby={describe('photoIds')}>
        <legend className="field-label">The learner's photos</legend>
        {photos.state === 'none' && <p className="text-sm text-steel-600">Choose a learner and a procedure to see their photos.</p>}
        {photos.state === 'loading' && (
          <p className="text-sm text-steel-600" role="status">
            Loading photos…
          </p>
        )}
        {photos.state === 'failed' && (
          <p className="field-error" role="alert">
            <span aria-hidden="true">⚠</span> {photos.message}
          </p>
        )}
        {photos.state === 'ready' &&
          (photos.list.length === 0 ? (
            <p className="text-sm text-steel-600">No photos of this procedure from this learner yet. You can sign off without one.</p>
          ) : (
            <ul className="flex flex-wrap gap-3">
              {photos.list.map((photo) => (
                <li key={photo.id}>
                  <PhotoTile photo={photo}>
                    <label className="flex min-h-touch cursor-pointer items-center gap-2 px-2 text-sm font-semibold">
                      <input
                        type="checkbox"
                        className="h-5 w-5 accent-brass-500"
                        checked={picked.includes(photo.id)}
                        onChange={(e) => {
                          const on = e.target.checked;
                          edit('photoIds', setPicked)(on ? [...picked, photo.id] : picked.filter((p) => p !== photo.id));
                        }}
                        aria-label={`Attach ${photo.originalName}`}
                      />
                      Attach
                    </label>
                  </PhotoTile>
                </li>
              ))}
            </ul>
          ))}
        <FieldError id={`${id}-photoIds-error`} messages={fields.photoIds} />
      </fieldset>

      <button type="submit" className="btn-primary w-full" disabled={sending}>
        {sending ? 'Saving…' : 'Record sign-off'}
      </button>
    </form>
  );
}
