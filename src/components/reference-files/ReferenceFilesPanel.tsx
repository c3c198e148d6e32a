import { useEffect, useId, useRef, useState } from 'react';
import { UploadStatusLine, type UploadStatus } from '../uploads/UploadStatus';
import { checkSize, formatBytes, type UploadRule } from '../../lib/uploads/check';
import { fileKindLabel, uploadUrl, type ReferenceFileJson } from '../../lib/uploads/views';
import { uploadFile } from '../uploads/upload-file';
import { CaptionEditor } from './CaptionEditor';

interface Props {
  procedure: string;
  procedureTitle: string;
  initial: ReferenceFileJson[];
  rule: UploadRule;
  /** How many files the procedure may have. */
  max: number;
}


/**
 * A procedure's reference files for those who may edit it: attach photos or PDFs (with progress), open them,
 * delete one after a confirmation. Files belong to the procedure, not to a version: learners see them at once.
 */
export default function ReferenceFilesPanel({ procedure, procedureTitle, initial, rule, max }: Props) {
  const [files, setFiles] = useState(initial);
  const [status, setStatus] = useState<UploadStatus>({ kind: 'idle' });
  const [errors, setErrors] = useState<string[]>([]);
  const [confirming, setConfirming] = useState<string | null>(null);
  // Where keyboard focus goes after a confirmation closes: back to the row's button, or the heading once the row is gone.
  const [focusTarget, setFocusTarget] = useState<string | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const id = useId();
  const busy = status.kind === 'uploading';
  const full = files.length >= max;

  useEffect(() => {
    if (focusTarget) document.getElementById(focusTarget)?.focus();
    setFocusTarget(null);
  }, [focusTarget]);

  async function send(chosen: File[]) {
    const problems: string[] = [];
    let added = 0;
    let room = max - files.length;
    for (const [index, file] of chosen.entries()) {
      if (room <= 0) {
        problems.push(`${file.name}: this procedure already has ${max} files; delete one first.`);
        continue;
      }
      // A file over the limit is refused here at once instead of after a long upload; the server checks again.
      const sizeProblem = checkSize(file.size, rule);
      if (sizeProblem) {
        problems.push(`${file.name}: ${sizeProblem.message}`);
        continue;
      }
      const progress = (percent: number) => setStatus({ kind: 'uploading', name: file.name, index: index + 1, total: chosen.length, percent });
      progress(0);
      const result = await uploadFile<ReferenceFileJson>(file, { purpose: 'procedure-reference', procedure }, (f) => progress(Math.round(f * 100)));
      if (result.ok) {
        added += 1;
        room -= 1;
        setFiles((list) => [...list, result.body]);
      } else {
        problems.push(`${file.name}: ${result.message}`);
      }
    }
    setErrors(problems);
    setStatus(added ? { kind: 'done', message: added === 1 ? '✓ File attached.' : `✓ ${added} files attached.` } : { kind: 'idle' });
    if (input.current) input.current.value = '';
  }

  async function remove(file: ReferenceFileJson) {
    const res = await fetch(uploadUrl(file.id), { method: 'DELETE' });
    setConfirming(null);
    if (res.status === 204 || res.status === 404) {
      // 404: someone else removed it meanwhile; either way it is gone.
      setFiles((list) => list.filter((f) => f.id !== file.id));
      setStatus({ kind: 'done', message: `✓ ${file.originalName} deleted.` });
      setErrors([]);
      setFocusTarget(`${id}-heading`);
    } else {
      const body = (await res.json().catch(() => null)) as { error?: string } | null;
      setErrors([`${file.originalName}: ${body?.error ?? `could not be deleted (status ${res.status})`}`]);
      setFocusTarget(`${id}-delete-${file.id}`);
    }
  }

  return (
    <section className="panel" aria-labelledby={`${id}-heading`} data-testid="reference-files-panel">
      <h2 id={`${id}-heading`} tabIndex={-1} className="mb-1 text-xl font-bold focus-visible:outline-none">
        Reference files
      </h2>
      <p className="mb-4 max-w-3xl text-steel-600">
        Spec sheets and photos learners can open beside the trainer for {procedureTitle}. They belong to the procedure, not to a
        version: learners see a file as soon as it is attached, and it stays when you publish a new version.
      </p>

      <div className="flex flex-wrap items-center gap-3">
        <input
          ref={input}
          id={`${id}-input`}
          type="file"
          accept={rule.accept}
          multiple
          disabled={busy || full}
          className="peer sr-only"
          aria-describedby={`${id}-hint ${id}-errors`}
          onChange={(e) => {
            const chosen = Array.from(e.currentTarget.files ?? []);
            if (chosen.length) void send(chosen);
          }}
        />
        {/* The input stays in the tab order but out of sight; its label is the button people see, and shows its focus. */}
        <label
          htmlFor={`${id}-input`}
          className={`btn-quiet cursor-pointer peer-focus-visible:outline peer-focus-visible:outline-[3px] peer-focus-visible:outline-offset-2 peer-focus-visible:outline-brass-400 ${busy || full ? 'pointer-events-none opacity-60' : ''}`}
        >
          <span aria-hidden="true">⇪</span> Attach files
        </label>
        <p id={`${id}-hint`} className="text-sm text-steel-600">
          {rule.formats}, up to {formatBytes(rule.maxBytes)} each; {files.length} of {max} files
          {full ? ': delete one to attach another.' : '.'}
        </p>
      </div>

      <UploadStatusLine status={status} />
      <ul id={`${id}-errors`} role="alert" className="mt-1 space-y-1 text-sm font-medium text-signal-700">
        {errors.map((e) => (
          <li key={e} className="flex items-start gap-1">
            <span aria-hidden="true">⚠</span> {e}
          </li>
        ))}
      </ul>

      {files.length === 0 ? (
        <p className="mt-3 text-steel-600">No files attached yet.</p>
      ) : (
        <ul className="mt-3 divide-y divide-steel-100" aria-label={`Reference files of ${procedureTitle}`}>
          {files.map((file) => (
            <li key={file.id} className="flex flex-wrap items-center justify-between gap-3 py-2" data-testid="reference-file">
              <div className="min-w-0 flex-1">
                <a href={uploadUrl(file.id)} target="_blank" rel="noopener" className="break-all font-semibold underline decoration-brass-400 underline-offset-4">
                  {file.originalName}
                  <span className="sr-only"> (opens in a new tab)</span>
                </a>
                <p className="text-sm text-steel-600">
                  {fileKindLabel(file.contentType)} · {formatBytes(file.sizeBytes)}
                </p>
                <CaptionEditor
                  file={file}
                  onSaved={(saved) => {
                    setFiles((list) => list.map((f) => (f.id === saved.id ? saved : f)));
                    setStatus({ kind: 'done', message: saved.caption ? `✓ Caption of ${saved.originalName} saved.` : `✓ Caption of ${saved.originalName} cleared.` });
                  }}
                />
              </div>
              {confirming === file.id ? (
                <div className="flex flex-wrap items-center gap-2" role="group" aria-label={`Delete ${file.originalName}?`}>
                  <span className="text-sm font-semibold text-steel-800">Delete it for everyone?</span>
                  <button type="button" className="btn-quiet text-signal-700" autoFocus onClick={() => void remove(file)}>
                    Delete it
                  </button>
                  <button
                    type="button"
                    className="btn-quiet"
                    onClick={() => {
                      setConfirming(null);
                      setFocusTarget(`${id}-delete-${file.id}`);
                    }}
                  >
                    Keep
                  </button>
                </div>
              ) : (
                <button
                  type="button"
                  id={`${id}-delete-${file.id}`}
                  className="btn-quiet"
                  aria-label={`Delete ${file.originalName}`}
                  onClick={() => setConfirming(file.id)}
                >
                  Delete
                </button>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
