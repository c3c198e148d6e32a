import type { APIRoute } from 'astro';
import { MAX_DRAFT_BYTES, saveDraftSchema } from '../../../lib/schemas/drafts';
import { db } from '../../../lib/server/db';
import { readDraft, saveDraft } from '../../../lib/server/drafts';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, readJson, versionParam } from '../../../lib/server/http';
import { findVersion, type StoredVersion } from '../../../lib/server/procedure-store';

// The signed-in learner's work in progress on a procedure version (the latest when ?version is left out).
// Drafts are keyed by the session user; no other user's id appears in the route.

type Found = { ok: true; stored: StoredVersion } | { ok: false; response: Response };

async function versionFrom(slug: string | undefined, url: URL): Promise<Found> {
  const version = versionParam(url);
  if (version === null) {
    return { ok: false, response: jsonError(400, 'version must be a whole number from 1', { version: ['Not a version number'] }) };
  }
  const stored = await findVersion(db, slug ?? '', version);
  if (!stored) return { ok: false, response: jsonError(404, 'No such procedure') };
  return { ok: true, stored };
}

export const GET: APIRoute = async ({ locals, params, url }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const found = await versionFrom(params.procedure, url);
  if (!found.ok) return found.response;
  const { stored } = found;
  const draft = await readDraft(gate.user.id, stored.id);
  return Response.json({
    procedure: stored.slug,
    version: stored.version,
    drafts: draft?.drafts ?? null,
    savedAt: draft?.savedAt.toISOString() ?? null,
  });
};

/** 204 when stored; 409 with the server's savedAt when a newer copy is already there. */
export const PUT: APIRoute = async ({ locals, params, url, request }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const body = await readJson(request, MAX_DRAFT_BYTES);
  if (!body.ok) return body.response;
  const parsed = saveDraftSchema.safeParse(body.body);
  if (!parsed.success) {
    // Drafts nest deeply: name the full path of each problem, not only the top-level field.
    const issues = parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
    return Response.json({ error: `${issues[0]!.path}: ${issues[0]!.message}`, issues }, { status: 400 });
  }
  const found = await versionFrom(params.procedure, url);
  if (!found.ok) return found.response;

  const result = await saveDraft(gate.user.id, found.stored.id, parsed.data);
  if (result.kind === 'stale') {
    return Response.json({ error: 'A newer copy of this work is already saved', savedAt: result.savedAt.toISOString() }, { status: 409 });
  }
  return new Response(null, { status: 204 });
};
