import type { UploadPurpose } from '../../lib/schemas/uploads';

export type UploadOutcome<T> = { ok: true; body: T } | { ok: false; message: string };

/**
 * Sends one file to POST /api/uploads as multipart/form-data (bench photos and reference files alike).
 * XMLHttpRequest rather than fetch because only it reports upload progress, which matters for a 10 MB
 * file on a workshop's Wi-Fi.
 */
export function uploadFile<T>(
  file: File,
  fields: { purpose: UploadPurpose; procedure: string },
  onProgress: (fraction: number) => void,
): Promise<UploadOutcome<T>> {
  const form = new FormData();
  form.set('purpose', fields.purpose);
  form.set('procedure', fields.procedure);
  form.set('file', file, file.name);
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/uploads');
    xhr.responseType = 'json';
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => {
      const body = xhr.response as (T & { error?: string }) | null;
      if (xhr.status === 201 && body) resolve({ ok: true, body });
      else resolve({ ok: false, message: body?.error ?? `The upload failed (status ${xhr.status}).` });
    };
    xhr.onerror = () => resolve({ ok: false, message: 'The upload did not reach the server. Check the connection and try again.' });
    xhr.send(form);
  });
}
