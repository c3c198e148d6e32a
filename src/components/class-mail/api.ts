import type { PlannedRow, RosterPlan } from '../../lib/roster/plan';

// The class page's calls for invitations and the roster import, with answers typed as the server sends them.

export interface EnrolledRow {
  row: number;
  name: string;
  email: string;
  mail: 'sent' | 'failed';
}

export interface Enrolled {
  added: EnrolledRow[];
  invited: EnrolledRow[];
}

export type Preview = Pick<RosterPlan, 'ok' | 'rows' | 'counts'> & { header: boolean };

/** A refused request: the message, field errors and (for bad rows) every row with its problems. */
export interface Refusal {
  error: string;
  fields?: Record<string, string[]>;
  rows?: PlannedRow[];
}

export type Answer<T> = { ok: true; body: T } | { ok: false; refusal: Refusal };

export async function postJson<T>(path: string, body: unknown): Promise<Answer<T>> {
  let res: Response;
  try {
    res = await fetch(path, {
      method: 'POST',
      credentials: 'same-origin',
      headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
      body: JSON.stringify(body),
    });
  } catch {
    return { ok: false, refusal: { error: 'No connection to the server. Nothing was changed; try again.' } };
  }
  let json: unknown = null;
  try {
    json = await res.json();
  } catch {
    // A proxy's error page: the status has to do.
  }
  if (res.ok) return { ok: true, body: json as T };
  const refusal = json && typeof json === 'object' && 'error' in json ? (json as Refusal) : { error: `The server answered ${res.status}.` };
  return { ok: false, refusal };
}

export function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}
