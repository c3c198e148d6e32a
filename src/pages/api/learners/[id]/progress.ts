import type { APIRoute } from 'astro';
import { timeZoneSchema } from '../../../../lib/schemas/rework';
import { requireRole } from '../../../../lib/server/guard';
import { jsonError } from '../../../../lib/server/http';
import { learnerForViewer } from '../../../../lib/server/learner-access';
import { progressOf } from '../../../../lib/server/progress';

/** One learner's progress, for an instructor of one of their classes or an admin; anyone else gets 404. */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const tz = timeZoneSchema.safeParse(url.searchParams.get('tz') ?? undefined);
  if (!tz.success) return jsonError(400, tz.error.issues[0]!.message, { tz: tz.error.issues.map((i) => i.message) });
  const learner = await learnerForViewer(gate.user, params.id ?? '');
  if (!learner) return jsonError(404, 'No such learner in your classes');
  return Response.json({ learner, ...(await progressOf(learner.id, tz.data)) });
};
