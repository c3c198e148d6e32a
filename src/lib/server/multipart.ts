import { jsonError, readBodyWithin, type BodyWithin } from './http';
import { hasNul, NUL_MESSAGE } from '../text/nul';

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
  // Announced, Node discards the body it announced; unannounced, the rest was read and dropped. Either way the
  // sender gets to read this answer. Only a body too long even to drain leaves unread bytes behind.
  if (body.kind === 'over') {
    const refused = jsonError(413, tooLarge, { file: [tooLarge] });
    return { ok: false, response: body.announced || body.drained ? refused : closing(refused) };
  }
  if (body.kind === 'absent') return { ok: false, response: jsonError(400, 'The form is empty', { file: ['Choose a file'] }) };
  let form: FormData;
  try {
    form = await new Response(body.bytes, { headers: { 'content-type': type } }).formData();
  } catch {
    return { ok: false, response: jsonError(400, 'The form could not be read as multipart/form-data') };
  }
  // Text fields only: a file's bytes may hold anything (its name is cleaned where it is kept).
  const texts = [...form].flatMap(([name, value]) => (typeof value === 'string' ? [name, value] : [name]));
  return hasNul(texts) ? { ok: false, response: jsonError(400, NUL_MESSAGE) } : { ok: true, form };
}

/**
 * A body cut off while reading leaves bytes nobody will read, so its socket must not carry another
 * request (a kept-alive one would wait on them).
 */
function closing(response: Response): Response {
  response.headers.set('connection', 'close');
  return response;
}
