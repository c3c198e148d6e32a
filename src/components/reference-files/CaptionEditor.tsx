import { useEffect, useId, useRef, useState } from 'react';
import { ApiError, errorText, send } from '../api-client';
import { CAPTION_MAX, uploadUrl, type ReferenceFileJson } from '../../lib/uploads/views';

interface Props {
  file: ReferenceFileJson;
  onSaved: (file: ReferenceFileJson) => void;
}

/** Saves a caption (blank clears it); the server's words on a refusal. */
async function saveCaption(file: ReferenceFileJson, caption: string): Promise<ReferenceFileJson> {
  const response = await send(
    uploadUrl(file.id),
    { method: 'PATCH', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ caption }) },
    'The caption was not saved: no connection. Try again.',
  );
  if (response.ok) return (await response.json()) as ReferenceFileJson;
  if (response.status === 401) throw new ApiError(401, 'You were signed out. Sign in again, then save the caption.');
  throw new ApiError(response.status, (await errorText(response)) ?? `The caption was not saved (status ${response.status}).`);
}

/**
 * A reference file's caption: what learners see in place of the file name beside the trainer. Shown as
 * text with an Edit button; editing opens one field, saved on Enter or Save, left with Escape or Cancel.
 */
export function CaptionEditor({ file, onSaved }: Props) {
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(file.caption ?? '');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const field = useRef<HTMLInputElement>(null);
  const editButton = useRef<HTMLButtonElement>(null);
  const returnFocus = useRef(false);
  const id = useId();

  useEffect(() => {
    if (editing) field.current?.focus();
    else if (returnFocus.current) editButton.current?.focus();
    returnFocus.current = false;
  }, [editing]);

  const close = () => {
    returnFocus.current = true;
    setEditing(false);
    setError(null);
  };

  async function save() {
    if (busy) return;
    setBusy(true);
    setError(null);
    try {
      onSaved(await saveCaption(file, text));
      close();
    } catch (e) {
      setError(e instanceof Error ? e.message : 'The caption was not saved.');
    } finally {
      setBusy(false);
    }
  }

  if (!editing) {
    return (
      <p className="text-sm text-steel-700">
        {file.caption ? (
          <>
            <span className="font-semibold">Caption:</span> {file.caption}
          </>
        ) : (
          <span className="text-steel-600">No caption: learners see the file name.</span>
        )}{' '}
        <button
          ref={editButton}
          type="button"
          className="underline decoration-brass-400 underline-offset-4"
          aria-label={`Edit the caption of ${file.originalName}`}
          onClick={() => {
            setText(file.caption ?? '');
            setEditing(true);
          }}
        >
          Edit caption
        </button>
      </p>
    );
  }

  return (
    <form
      className="mt-1 flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
      onKeyDown={(e) => {
        if (e.key === 'Escape') close();
      }}
    >
      <div className="min-w-[16rem] flex-1">
        <label htmlFor={`${id}-caption`} className="block text-sm font-semibold text-steel-800">
          Caption for {file.originalName}
        </label>
        <input
          ref={field}
          id={`${id}-caption`}
          value={text}
          maxLength={CAPTION_MAX}
          onChange={(e) => setText(e.currentTarget.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={`${id}-hint ${id}-error`}
          className="field-input w-full"
        />
        <p id={`${id}-hint`} className="text-xs text-steel-600">
          What the file shows, in your class's words; blank to show the file name. {text.length} of {CAPTION_MAX} characters.
        </p>
        <p id={`${id}-error`} role="alert" className="text-sm font-medium text-signal-700">
          {error && (
            <>
              <span aria-hidden="true">⚠</span> {error}
            </>
          )}
        </p>
      </div>
      <button type="submit" className="btn-quiet" disabled={busy}>
        {busy ? 'Saving…' : 'Save caption'}
      </button>
      <button type="button" className="btn-quiet" onClick={close}>
        Cancel
      </button>
    </form>
  );
}
