import type { ZodError } from 'zod';
import { hasNul, NUL_MESSAGE } from '../text/nul';

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
  let text: string;
  try {
    if (maxBytes === undefined) text = await request.text();
    else {
      const body = await readBodyWithin(request, maxBytes);
      if (body.kind === 'over') return { ok: false, response: jsonError(400, `The body is too large: at most ${maxBytes / 1024} KB`) };
      text = body.kind === 'absent' ? '' : new TextDecoder().decode(body.bytes);
    }
  } catch {
    return { ok: false, response: jsonError(400, 'The body could not be read') };
  }
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    return { ok: false, response: jsonError(400, 'The body is not valid JSON') };
  }
  return hasNul(body) ? { ok: false, response: jsonError(400, NUL_MESSAGE) } : { ok: true, body };
}

export type BodyWithin =
  | { kind: 'read'; bytes: Uint8Array<ArrayBuffer> }
  /** No body at all. */
  | { kind: 'absent' }
  /**
   * Over the limit. `announced`: the Content-Length said so and nothing was read. `drained`: the rest of
   * a body of no announced length was read and thrown away, so the connection can carry the answer.
   */
  | { kind: 'over'; announced: boolean; drained: boolean };

/**
 * How much of an oversized body of no announced length is read and discarded after the limit. A socket
 * closed with bytes still unread is reset, and the reset can wipe the answer before the sender reads it;
 * reading the rest (never keeping it) lets a client that is still sending see its 413. Past this much
 * more, the sender is not an ordinary form and the connection is cut.
 */
export const DRAIN_BYTES = 32 * 1024 * 1024;

/**
 * The body's bytes, at most maxBytes. A Content-Length over the limit is refused before a byte is read,
 * and the bytes are counted as they arrive (a chunked body has no length), so an oversized body is
 * never buffered whole. Throws when the stream fails.
 */
export async function readBodyWithin(request: Request, maxBytes: number, drainBytes = DRAIN_BYTES): Promise<BodyWithin> {
  if (Number(request.headers.get('content-length') ?? 0) > maxBytes) return { kind: 'over', announced: true, drained: false };
  const reader = request.body?.getReader();
  if (!reader) return { kind: 'absent' };
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) return { kind: 'over', announced: false, drained: await discardRest(reader, drainBytes - (size - maxBytes)) };
    chunks.push(value);
  }
  const bytes = new Uint8Array(size);
  let offset = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return { kind: 'read', bytes };
}

/** Reads and drops the rest of a stream, at most `budget` bytes; true when it ended within them. */
async function discardRest(reader: ReadableStreamDefaultReader<Uint8Array>, budget: number): Promise<boolean> {
  let left = budget;
  while (left >= 0) {
    const { done, value } = await reader.read();
    if (done) return true;
    left -= value.byteLength;
  }
  await reader.cancel();
  return false;
}

/** ?version=N: undefined when absent (the latest), null when it is not a whole number from 1. */
export function versionParam(url: URL): number | undefined | null {
  const raw = url.searchParams.get('version');
  if (raw === null) return undefined;
  const version = Number(raw);
  return Number.isInteger(version) && version >= 1 ? version : null;
}
