// What an upload panel says while files go up: the file, its place in the batch and a progress bar,
// then a done message. Bench photos and reference files show it the same way.

export type UploadStatus =
  | { kind: 'idle' }
  | { kind: 'uploading'; name: string; index: number; total: number; percent: number }
  | { kind: 'done'; message: string };

export function UploadStatusLine({ status }: { status: UploadStatus }) {
  return (
    <div role="status" aria-live="polite" className="mt-2 min-h-6 text-sm font-semibold">
      {status.kind === 'uploading' && (
        <span className="flex items-center gap-2 text-steel-700">
          Uploading {status.total > 1 ? `${status.index} of ${status.total}: ` : ''}
          {status.name} ({status.percent}%)
          <progress max={100} value={status.percent} className="h-2 w-32" aria-hidden="true" />
        </span>
      )}
      {status.kind === 'done' && <span className="text-go-700">{status.message}</span>}
    </div>
  );
}
