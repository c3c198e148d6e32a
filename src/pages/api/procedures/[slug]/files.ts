import type { APIRoute } from 'astro';
import { requireRole } from '../../../../lib/server/guard';
import { jsonError } from '../../../../lib/server/http';
import { findProcedure } from '../../../../lib/server/procedure-drafts';
import { listReferenceFiles, referenceFileJson } from '../../../../lib/server/uploads';

/** A procedure's reference files (spec sheets, photos), in the order attached; for anyone signed in, as the procedure is. */
export const GET: APIRoute = async ({ locals, params }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const procedure = await findProcedure(params.slug ?? '');
  if (!procedure) return jsonError(404, 'No such procedure');
  const files = await listReferenceFiles(procedure.id);
  return Response.json(files.map(referenceFileJson));
};
