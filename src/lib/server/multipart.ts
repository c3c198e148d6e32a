import { jsonError, readBodyWithin, type BodyWithin } from './http';

type FormResult = { ok: true; form: FormData } | { ok: false; response: Response };

/**
 * Reads a multipart/form-data body of at most maxBytes (readBodyWithin: an oversized upload is never
 * buffered whole). `tooLarge` words the 413 for the caller's limit.
 */
export async function readMultipartWithin(request: Request, maxBytes: number, tooLarge: string): Promise<FormResult> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data;/i.test(type)) {
    return { ok: false, response: jsonError(400, 'Send the file as multipart/form-data') };
  }
  let body: BodyWithin;
  try {
    body = await readBodyWithin(request, maxBytes);
  } catch {
    return { ok: false, response: jsonError(400, 'The upload was interrupted; try again') };
  }
  // Announced: not a byte is buffered; Node discards the announced body, so the browser gets to read this answer.
  if (body.kind === 'over') return { ok: false, response: body.announced ? jsonError(413, tooLarge, { file: [tooLarge] }) : refuseAndClose(tooLarge) };
  if (body.kind === 'absent') return { ok: false, response: jsonError(400, 'The form is empty', { file: ['Choose a file'] }) };
  try {
    const form = await new Response(body.bytes, { headers: { 'content-type': type } }).formData();
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
