import type { Stage } from '../../lib/procedure/schema';
import type { DrillStatus } from '../../lib/drills/progress';

// The class page's calls to the drills API. Errors come back with the server's field messages so the
// form can show each one next to its field.

export interface ClassDrillView {
  id: string;
  procedure: { slug: string; title: string; version: number };
  stages: Stage[];
  dueAt: string;
  passMarkPct: number;
  attemptLimit: number | null;
  answersAfterDue: boolean;
  closedAt: string | null;
  learners: number;
  counts: Record<DrillStatus, number>;
}

export type Saved = { ok: true; drill: ClassDrillView } | { ok: false; error: string; fields: Record<string, string[]> };

async function send(method: 'POST' | 'PATCH', path: string, body: unknown): Promise<Saved> {
  let response: Response;
  try {
    response = await fetch(path, {
      method,
      credentials: 'same-origin',
      headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
      body: JSON.stringify(body),
    });
  } catch {
    return { ok: false, error: 'No connection to the server. Nothing was saved; try again.', fields: {} };
  }
  const json = (await response.json().catch(() => null)) as (ClassDrillView & { error?: string; fields?: Record<string, string[]> }) | null;
  if (response.ok && json) return { ok: true, drill: json };
  if (response.status === 401) return { ok: false, error: 'You are signed out. Sign in again in another tab, then save again.', fields: {} };
  return { ok: false, error: json?.error ?? `The server refused it (${response.status}).`, fields: json?.fields ?? {} };
}

export const createDrill = (classId: string, body: unknown) => send('POST', `/api/classes/${classId}/drills`, body);
export const updateDrill = (drillId: string, body: unknown) => send('PATCH', `/api/drills/${drillId}`, body);

export async function listDrills(classId: string): Promise<ClassDrillView[] | null> {
  try {
    const response = await fetch(`/api/classes/${classId}/drills`, { credentials: 'same-origin', headers: { Accept: 'application/json' } });
    return response.ok ? ((await response.json()) as ClassDrillView[]) : null;
  } catch {
    return null;
  }
}
