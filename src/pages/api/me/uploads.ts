import type { APIRoute } from 'astro';
import { uploadListQuerySchema } from '../../../lib/schemas/uploads';
import { requireRole } from '../../../lib/server/guard';
import { procedureFilter } from '../../../lib/server/procedure-filter';
import { validationError } from '../../../lib/server/http';
import { listBenchPhotos, uploadJson } from '../../../lib/server/uploads';

/** The signed-in learner's bench photos, newest first; ?procedure=slug narrows them to one procedure. */
export const GET: APIRoute = async ({ locals, url }) => {
  const gate = requireRole(locals, 'learner');
  if (!gate.ok) return gate.response;
  const parsed = uploadListQuerySchema.safeParse({ procedure: url.searchParams.get('procedure') ?? undefined });
  if (!parsed.success) return validationError(parsed.error);
  const procedure = await procedureFilter(parsed.data.procedure);
  if (!procedure.ok) return procedure.response;
  const { procedureId } = procedure;
  const photos = await listBenchPhotos(gate.user.id, procedureId);
  return Response.json(photos.map(uploadJson));
};
