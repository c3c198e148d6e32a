import { jsonError } from './http';

type FormResult = { ok: true; form: FormData } | { ok: false; response: Response };

/**
 * Reads a multipart/form-data body of at most maxBytes. A Content-Length over the limit is refused
 * before a byte is read, and the bytes are counted as they arrive (a chunked body has no length),
 * so an oversized upload is never buffered whole. `tooLarge` words the 413 for the caller's limit.
 */
export async function readMultipartWithin(request: Request, maxBytes: number, tooLarge: string): Promise<FormResult> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data;/i.test(type)) {
    return { ok: false, response: jsonError(400, 'Send the file as multipart/form-data') };
  }
  const declared = Number(request.headers.get('content-length') ?? 0);
  // Not a byte is buffered; Node discards the announced body, so the browser gets to read this answer.
  if (declared > maxBytes) return { ok: false, response: jsonError(413, tooLarge, { file: [tooLarge] }) };

  const chunks: Uint8Array[] = [];
  let size = 0;
  const reader = request.body?.getReader();
  if (!reader) return { ok: false, response: jsonError(400, 'The form is empty', { file: ['Choose a file'] }) };
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      size += value.byteLength;
      if (size > maxBytes) {
        await reader.cancel();
        return { ok: false, response: refuseAndClose(tooLarge) };
      }
      chunks.push(value);
    }
  } catch {
    return { ok: false, response: jsonError(400, 'The upload was interrupted; try again') };
  }
  try {
    const body = new Uint8Array(size);
    let offset = 0;
    for (const chunk of chunks) {
      body.set(chunk, offset);
      offset += chunk.byteLength;
    }
    const form = await new Response(body, { headers: { 'content-type': type } }).formData();
    return { ok: true, form };
  } catch {
    return { ok: false, response: jsonError(400, 'The form could not be read as multipart/form-data') };
  }
}

/**
 * 413 for a body of no announced length, cut off while reading: the rest is never read, so the socket
 * must not carry another request (a kept-alive one would wait on bytes nobody reads).
 */
function refuseAndClose(tooLarge: string): Response {
  const response = jsonError(413, tooLarge, { file: [tooLarge] });
  response.headers.set('connection', 'close');
  return response;
}
