import type { APIRoute } from 'astro';
import { blankDocument, editDocument, newDraftSchema } from '../../../lib/editor/drafts';
import { db } from '../../../lib/server/db';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, readJson, validationError } from '../../../lib/server/http';
import { canEditProcedure, createDraft, draftView, findProcedure, listDrafts } from '../../../lib/server/procedure-drafts';
import { findVersion } from '../../../lib/server/procedure-store';

// Instructors' procedure drafts: only ever the caller's own.

export const GET: APIRoute = async ({ locals }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  return Response.json(await listDrafts(gate.user.id));
};

/** {} → a blank new procedure; {basedOn: slug} → the next version of a procedure you created (admins: any). */
export const POST: APIRoute = async ({ locals, request }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = newDraftSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  if (!parsed.data.basedOn) {
    const row = await createDraft(gate.user.id, blankDocument());
    return Response.json(draftView(row, null), { status: 201 });
  }
  const procedure = await findProcedure(parsed.data.basedOn);
  const latest = procedure && (await findVersion(db, procedure.slug));
  if (!procedure || !latest) return jsonError(404, 'No such procedure', { basedOn: ['No such procedure'] });
  if (!canEditProcedure(gate.user, procedure.createdBy)) {
    return jsonError(403, 'Only the instructor who created this procedure can publish new versions of it; clone it instead');
  }
  const row = await createDraft(gate.user.id, editDocument(latest.document), procedure.id);
  return Response.json(draftView(row, procedure.slug), { status: 201 });
};
