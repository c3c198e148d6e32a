import type { APIRoute } from 'astro';
import { z } from 'zod';
import { attemptJson } from '../../../lib/server/attempt-row';
import { attemptForViewer } from '../../../lib/server/attempts';
import { answersHiddenFor } from '../../../lib/server/drill-attempts';
import { requireRole } from '../../../lib/server/guard';
import { jsonError } from '../../../lib/server/http';

/**
 * An attempt, for its learner, the learner's instructors and admins; anyone else gets 404. On a drill
 * that keeps its answers until the due date, the learner gets it without them until then.
 */
export const GET: APIRoute = async ({ locals, params }) => {
  const gate = requireRole(locals);
  if (!gate.ok) return gate.response;
  const id = z.string().uuid().safeParse(params.id);
  if (!id.success) return jsonError(404, 'No such attempt');
  const attempt = await attemptForViewer(gate.user, id.data);
  if (!attempt) return jsonError(404, 'No such attempt');
  return Response.json(attemptJson(attempt, { answersHidden: await answersHiddenFor(gate.user, attempt, new Date()) }));
};
