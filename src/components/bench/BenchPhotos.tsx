import { useId, useRef, useState } from 'react';
import { UploadStatusLine, type UploadStatus } from '../uploads/UploadStatus';
import { checkSize, formatBytes, type UploadRule } from '../../lib/uploads/check';
import type { BenchPhotoJson } from '../../lib/uploads/views';
import { PhotoTile } from './PhotoTile';
import { uploadFile } from '../uploads/upload-file';

interface Props {
  procedure: string;
  procedureTitle: string;
  initial: BenchPhotoJson[];
  rule: UploadRule;
}


/** The learner's photos of one procedure's finished assembly: upload (with progress), view, delete until attached. */
export default function BenchPhotos({ procedure, procedureTitle, initial, rule }: Props) {
  const [photos, setPhotos] = useState(initial);
  const [status, setStatus] = useState<UploadStatus>({ kind: 'idle' });
  const [errors, setErrors] = useState<string[]>([]);
  const [confirming, setConfirming] = useState<string | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const id = useId();
  const busy = status.kind === 'uploading';

  async function send(files: File[]) {
    const problems: string[] = [];
    let added = 0;
    for (const [index, file] of files.entries()) {
      // A file over the limit is refused here at once instead of after a long upload.
      const sizeProblem = checkSize(file.size, rule);
      if (sizeProblem) {
        problems.push(`${file.name}: ${sizeProblem.message}`);
        continue;
      }
      setStatus({ kind: 'uploading', name: file.name, index: index + 1, total: files.length, percent: 0 });
      const result = await uploadFile<BenchPhotoJson>(file, { purpose: 'bench-photo', procedure }, (f) =>
        setStatus({ kind: 'uploading', name: file.name, index: index + 1, total: files.length, percent: Math.round(f * 100) }),
      );
      if (result.ok) {
        added += 1;
        setPhotos((list) => [result.body, ...list]);
      } else {
        problems.push(`${file.name}: ${result.message}`);
      }
    }
    setErrors(problems);
    setStatus(added ? { kind: 'done', message: added === 1 ? '✓ Photo uploaded.' : `✓ ${added} photos uploaded.` } : { kind: 'idle' });
    if (input.current) input.current.value = '';
  }

  async function remove(photo: BenchPhotoJson) {
    const res = await fetch(`/api/uploads/${photo.id}`, { method: 'DELETE' });
    setConfirming(null);
    if (res.status === 204) {
      setPhotos((list) => list.filter((p) => p.id !== photo.id));
      setStatus({ kind: 'done', message: `✓ ${photo.originalName} deleted.` });
      setErrors([]);
    } else {
      const body = (await res.json().catch(() => null)) as { error?: string } | null;
      setErrors([`${photo.originalName}: ${body?.error ?? `could not be deleted (status ${res.status})`}`]);
    }
  }

  return (
    <div data-testid={`bench-photos-${procedure}`}>
      <div className="flex flex-wrap items-center gap-3">
        <input
          ref={input}
          id={id}
          type="file"
          accept={rule.accept}
          multiple
          disabled={busy}
          className="peer sr-only"
          aria-describedby={`${id}-hint`}
          aria-label={`Add photos of ${procedureTitle}`}
          onChange={(e) => {
            const files = Array.from(e.currentTarget.files ?? []);
            if (files.length) void send(files);
          }}
        />
        {/* The input stays in the tab order but out of sight; its label is the button people see, and shows its focus. */}
        <label
          htmlFor={id}
          className={`btn-quiet cursor-pointer peer-focus-visible:outline peer-focus-visible:outline-[3px] peer-focus-visible:outline-offset-2 peer-focus-visible:outline-brass-400 ${busy ? 'pointer-events-none opacity-60' : ''}`}
        >
          <span aria-hidden="true">⇪</span> Add photos
        </label>
        <p id={`${id}-hint`} className="text-sm text-steel-600">
          {rule.formats}, up to {formatBytes(rule.maxBytes)} each.
        </p>
      </div>

      <UploadStatusLine status={status} />
      {errors.length > 0 && (
        <ul role="alert" className="mt-1 space-y-1 text-sm font-medium text-signal-700">
          {errors.map((e) => (
            <li key={e} className="flex items-start gap-1">
              <span aria-hidden="true">⚠</span> {e}
            </li>
          ))}
        </ul>
      )}

      {photos.length === 0 ? (
        <p className="mt-3 text-steel-600">No photos yet.</p>
      ) : (
        <ul className="mt-3 flex flex-wrap gap-3" aria-label={`Your photos of ${procedureTitle}`}>
          {photos.map((photo) => (
            <li key={photo.id}>
              <PhotoTile photo={photo}>
                <div className="px-2 pb-2">
                  {photo.attached ? (
                    <p className="text-xs font-semibold text-go-700">
                      <span aria-hidden="true">✓</span> On a sign-off
                    </p>
                  ) : confirming === photo.id ? (
                    <div className="flex gap-1">
                      <button type="button" className="text-sm font-semibold text-signal-700 underline" onClick={() => void remove(photo)}>
                        Delete it
                      </button>
                      <button type="button" className="text-sm text-steel-700 underline" onClick={() => setConfirming(null)}>
                        Keep
                      </button>
                    </div>
                  ) : (
                    <button
                      type="button"
                      className="text-sm text-steel-700 underline"
                      aria-label={`Delete ${photo.originalName}`}
                      onClick={() => setConfirming(photo.id)}
                    >
                      Delete
                    </button>
                  )}
                </div>
              </PhotoTile>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
