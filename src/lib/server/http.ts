import type { ZodError } from 'zod';

// Small helpers so every endpoint answers errors in one shape: { error, fields? }.

export function jsonError(status: number, error: string, fields?: Record<string, string[] | undefined>): Response {
  return Response.json(fields ? { error, fields } : { error }, { status });
}

export function validationError(err: ZodError): Response {
  const flat = err.flatten();
  const fields: Record<string, string[]> = {};
  for (const [name, messages] of Object.entries(flat.fieldErrors)) {
    if (messages && messages.length) fields[name] = messages as string[];
  }
  const first = flat.formErrors[0] ?? Object.values(fields)[0]?.[0] ?? 'Invalid input';
  return jsonError(400, first, fields);
}

type JsonBody = { ok: true; body: unknown } | { ok: false; response: Response };

/**
 * Reads a JSON body; a missing or malformed body becomes a 400, never a 500. With `maxBytes`, reading
 * stops once the body passes the limit, so an oversized body is never buffered whole or parsed.
 */
export async function readJson(request: Request, maxBytes?: number): Promise<JsonBody> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.includes('application/json')) {
    return { ok: false, response: jsonError(400, 'Send the body as JSON (Content-Type: application/json)') };
  }
  let text: string | null;
  try {
    text = maxBytes === undefined ? await request.text() : await readTextWithin(request, maxBytes);
  } catch {
    return { ok: false, response: jsonError(400, 'The body could not be read') };
  }
  if (text === null) return { ok: false, response: jsonError(400, `The body is too large: at most ${maxBytes! / 1024} KB`) };
  try {
    return { ok: true, body: JSON.parse(text) };
  } catch {
    return { ok: false, response: jsonError(400, 'The body is not valid JSON') };
  }
}

/** The body as text, or null once it passes maxBytes. */
async function readTextWithin(request: Request, maxBytes: number): Promise<string | null> {
  if (Number(request.headers.get('content-length') ?? 0) > maxBytes) return null;
  const reader = request.body?.getReader();
  if (!reader) return '';
  const decoder = new TextDecoder();
  let text = '';
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel();
      return null;
    }
    text += decoder.decode(value, { stream: true });
  }
  return text + decoder.decode();
}

/** ?version=N: undefined when absent (the latest), null when it is not a whole number from 1. */
export function versionParam(url: URL): number | undefined | null {
  const raw = url.searchParams.get('version');
  if (raw === null) return undefined;
  const version = Number(raw);
  return Number.isInteger(version) && version >= 1 ? version : null;
}
