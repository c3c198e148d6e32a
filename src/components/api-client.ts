// The islands' JSON calls to our own API: one way to send them, and failures as ApiError with words a
// learner can act on (each caller picks the words, since only it knows what was kept and what to do next).

export type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;

export const defaultFetch: FetchLike = (input, init) => fetch(input, init);

/** A failed request, with words a learner can act on. `status` is 0 when the network failed. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

/** Sends a same-origin request that asks for JSON; a network failure becomes ApiError(0, offline). */
export async function send(path: string, init: RequestInit, offline: string, fetchImpl: FetchLike = defaultFetch): Promise<Response> {
  try {
    return await fetchImpl(path, { credentials: 'same-origin', ...init, headers: { Accept: 'application/json', ...init.headers } });
  } catch {
    throw new ApiError(0, offline);
  }
}

/** POSTs a JSON body with `send`. */
export function postJson(path: string, body: unknown, offline: string, fetchImpl: FetchLike = defaultFetch): Promise<Response> {
  return send(path, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) }, offline, fetchImpl);
}

/** The `error` of a JSON refusal, or null. */
export async function errorText(response: Response): Promise<string | null> {
  try {
    const body: unknown = await response.json();
    if (body && typeof body === 'object' && 'error' in body && typeof body.error === 'string') return body.error;
  } catch {
    // Not JSON (a proxy's error page): the status alone has to do.
  }
  return null;
}

export interface RefusalWords {
  signedOut: string;
  serverDown: string;
  /** When the refusal says nothing itself. */
  refused: (status: number) => string;
}

/** The ApiError for a response that is not ok: signed out, server trouble, or the server's own reason. */
export async function refusal(response: Response, words: RefusalWords): Promise<ApiError> {
  if (response.status === 401) return new ApiError(401, words.signedOut);
  if (response.status >= 500) return new ApiError(response.status, words.serverDown);
  return new ApiError(response.status, (await errorText(response)) ?? words.refused(response.status));
}
