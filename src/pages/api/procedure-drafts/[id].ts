import type { APIRoute } from 'astro';
import { DRAFT_MAX_BYTES, draftSaveSchema } from '../../../lib/editor/drafts';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, readJson } from '../../../lib/server/http';
import { deleteDraft, draftView, findOwnDraft, saveDraft } from '../../../lib/server/procedure-drafts';
import { issuesResponse } from '../../../lib/server/issues';

// One draft of the caller's. Anyone else's draft, or a malformed id, is 404: a draft's existence is private.

export const GET: APIRoute = async ({ locals, params }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const found = await findOwnDraft(params.id ?? '', gate.user.id);
  if (!found) return jsonError(404, 'No such draft');
  return Response.json(draftView(found.row, found.basedOn));
};

/**
 * Saves the document as it is (incomplete is fine; publishing checks it in full). 200 {revision, updatedAt};
 * 409 {revision} when another window saved since the revision sent.
 */
export const PUT: APIRoute = async ({ locals, params, request }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const body = await readJson(request, DRAFT_MAX_BYTES);
  if (!body.ok) return body.response;
  const parsed = draftSaveSchema.safeParse(body.body);
  if (!parsed.success) return issuesResponse(parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message })));

  const saved = await saveDraft(params.id ?? '', gate.user.id, parsed.data.document, parsed.data.revision);
  if (saved.ok) return Response.json({ revision: saved.revision, updatedAt: saved.updatedAt });
  if (saved.reason === 'conflict') {
    return Response.json({ error: 'This draft was saved from another window since you opened it', revision: saved.revision }, { status: 409 });
  }
  return jsonError(404, 'No such draft');
};

export const DELETE: APIRoute = async ({ locals, params }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  if (!(await deleteDraft(params.id ?? '', gate.user.id))) return jsonError(404, 'No such draft');
  return new Response(null, { status: 204 });
};
