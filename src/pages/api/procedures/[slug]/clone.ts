import type { APIRoute } from 'astro';
import { cloneDocument } from '../../../../lib/editor/drafts';
import { db } from '../../../../lib/server/db';
import { requireRole } from '../../../../lib/server/guard';
import { jsonError } from '../../../../lib/server/http';
import { createDraft, draftView } from '../../../../lib/server/procedure-drafts';
import { findVersion } from '../../../../lib/server/procedure-store';

/** A new draft copied from the latest version: "… (copy)", published later as a procedure of its own. */
export const POST: APIRoute = async ({ locals, params }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const stored = await findVersion(db, params.slug ?? '');
  if (!stored) return jsonError(404, 'No such procedure');
  const row = await createDraft(gate.user.id, cloneDocument(stored.document));
  return Response.json(draftView(row, null), { status: 201 });
};
