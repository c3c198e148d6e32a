import type { APIRoute } from 'astro';
import { benchPhotoQuerySchema } from '../../../../lib/schemas/sign-offs';
import { classTaughtBy } from '../../../../lib/server/class-access';
import { isClassLearner } from '../../../../lib/server/classes';
import { requireRole } from '../../../../lib/server/guard';
import { jsonError, validationError } from '../../../../lib/server/http';
import { procedureFilter } from '../../../../lib/server/procedure-filter';
import { listBenchPhotos, uploadJson } from '../../../../lib/server/uploads';

/** A learner's bench photos of one procedure, for the class's instructors to pick for a sign-off. */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const taught = await classTaughtBy(gate.user, params.id);
  if (!taught.ok) return jsonError(taught.status, taught.error);
  const parsed = benchPhotoQuerySchema.safeParse({
    learner: url.searchParams.get('learner') ?? undefined,
    procedure: url.searchParams.get('procedure') ?? undefined,
  });
  if (!parsed.success) return validationError(parsed.error);
  if (!(await isClassLearner(taught.cls.id, parsed.data.learner))) {
    return jsonError(400, 'This person is not a learner in this class', { learner: ['Not a learner in this class'] });
  }
  const procedure = await procedureFilter(parsed.data.procedure);
  if (!procedure.ok) return procedure.response;
  const photos = await listBenchPhotos(parsed.data.learner, procedure.procedureId);
  return Response.json(photos.map(uploadJson));
};
