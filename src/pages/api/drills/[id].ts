import type { APIRoute } from 'astro';
import { z } from 'zod';
import { updateDrillSchema } from '../../../lib/schemas/drills';
import { classDrillJson } from '../../../lib/server/drill-json';
import { updateDrill, withClassCounts } from '../../../lib/server/drills';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, readJson, validationError } from '../../../lib/server/http';

/** Edit, close (`closed: true`; every attempt is kept) or reopen a drill: its class's instructors and admins. */
export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate.response;
  const id = z.string().uuid().safeParse(params.id);
  if (!id.success) return jsonError(404, 'No such drill among yours');
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = updateDrillSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const now = new Date();
  const result = await updateDrill(id.data, gate.user, parsed.data, now);
  if (!result.ok) return 'notFound' in result ? jsonError(404, 'No such drill among yours') : jsonError(400, result.error, result.fields);
  return Response.json(classDrillJson(await withClassCounts(result.drill, now)));
};
