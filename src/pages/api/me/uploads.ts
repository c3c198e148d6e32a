import type { APIRoute } from 'astro';
import { uploadListQuerySchema } from '../../../lib/schemas/uploads';
import { db } from '../../../lib/server/db';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, validationError } from '../../../lib/server/http';
import { findVersion } from '../../../lib/server/procedure-store';
import { listBenchPhotos, uploadJson } from '../../../lib/server/uploads';

/** The signed-in learner's bench photos, newest first; ?procedure=slug narrows them to one procedure. */
export const GET: APIRoute = async ({ locals, url }) => {
  const gate = requireRole(locals, 'learner');
  if (!gate.ok) return gate.response;
  const parsed = uploadListQuerySchema.safeParse({ procedure: url.searchParams.get('procedure') ?? undefined });
  if (!parsed.success) return validationError(parsed.error);
  let procedureId: string | undefined;
  if (parsed.data.procedure) {
    const procedure = await findVersion(db, parsed.data.procedure);
    if (!procedure) return jsonError(400, `No procedure "${parsed.data.procedure}"`, { procedure: ['No such procedure'] });
    procedureId = procedure.procedureId;
  }
  const photos = await listBenchPhotos(gate.user.id, procedureId);
  return Response.json(photos.map(uploadJson));
};
