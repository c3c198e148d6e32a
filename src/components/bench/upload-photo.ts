import type { BenchPhotoJson } from '../../lib/uploads/views';

export type UploadOutcome = { ok: true; photo: BenchPhotoJson } | { ok: false; message: string };

/**
 * Sends one bench photo as multipart/form-data. XMLHttpRequest rather than fetch because only it
 * reports upload progress, which matters for a 10 MB photo on a workshop's Wi-Fi.
 */
export function uploadPhoto(file: File, procedure: string, onProgress: (fraction: number) => void): Promise<UploadOutcome> {
  const form = new FormData();
  form.set('purpose', 'bench-photo');
  form.set('procedure', procedure);
  form.set('file', file, file.name);
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/uploads');
    xhr.responseType = 'json';
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => {
      const body = xhr.response as (BenchPhotoJson & { error?: string }) | null;
      if (xhr.status === 201 && body) resolve({ ok: true, photo: body });
      else resolve({ ok: false, message: body?.error ?? `The upload failed (status ${xhr.status}).` });
    };
    xhr.onerror = () => resolve({ ok: false, message: 'The upload did not reach the server. Check the connection and try again.' });
    xhr.send(form);
  });
}
