import type { Issue } from '../../lib/procedure/validate';

// The editor's calls to the server. Every failure comes back as a value, never a throw, so the
// editor can say what happened and keep what the instructor typed.

export type SaveOutcome =
  | { kind: 'saved'; revision: number; updatedAt: string }
  | { kind: 'conflict'; revision: number }
  | { kind: 'failed'; message: string };

export async function saveDraft(id: string, document: Record<string, unknown>, revision: number): Promise<SaveOutcome> {
  try {
    const res = await fetch(`/api/procedure-drafts/${id}`, {
      method: 'PUT',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ document, revision }),
    });
    const body = await res.json().catch(() => ({}));
    if (res.ok) return { kind: 'saved', revision: body.revision, updatedAt: body.updatedAt };
    if (res.status === 409) return { kind: 'conflict', revision: body.revision };
    return { kind: 'failed', message: body.error ?? `The server answered ${res.status}` };
  } catch {
    return { kind: 'failed', message: 'No connection to the server' };
  }
}

export type PublishOutcome =
  | { kind: 'published'; slug: string; version: number; created: boolean }
  | { kind: 'invalid'; issues: Issue[] }
  | { kind: 'failed'; message: string };

export async function publishDraft(id: string): Promise<PublishOutcome> {
  try {
    const res = await fetch(`/api/procedure-drafts/${id}/publish`, { method: 'POST' });
    const body = await res.json().catch(() => ({}));
    if (res.ok) return { kind: 'published', slug: body.slug, version: body.version, created: body.created };
    if (res.status === 400 && Array.isArray(body.issues)) return { kind: 'invalid', issues: body.issues };
    return { kind: 'failed', message: body.error ?? `The server answered ${res.status}` };
  } catch {
    return { kind: 'failed', message: 'No connection to the server' };
  }
}
