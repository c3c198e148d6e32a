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

/** Reads a JSON body; a missing or malformed body becomes a 400, never a 500. */
export async function readJson(request: Request): Promise<{ ok: true; body: unknown } | { ok: false; response: Response }> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.includes('application/json')) {
    return { ok: false, response: jsonError(400, 'Send the body as JSON (Content-Type: application/json)') };
  }
  try {
    return { ok: true, body: await request.json() };
  } catch {
    return { ok: false, response: jsonError(400, 'The body is not valid JSON') };
  }
}
