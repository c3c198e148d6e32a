import type { APIRoute } from 'astro';
import { joinClassSchema } from '../../../lib/schemas/classes';
import { joinClass } from '../../../lib/server/classes';
import { requireRole } from '../../../lib/server/guard';
import { jsonError, readJson, validationError } from '../../../lib/server/http';

export const POST: APIRoute = async ({ locals, request }) => {
  const gate = requireRole(locals, 'learner');
  if (!gate.ok) return gate.response;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = joinClassSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const result = await joinClass(parsed.data.joinCode, gate.user.id);
  if (!result.ok) return jsonError(404, 'No class has this join code', { joinCode: ['Unknown join code'] });
  return Response.json({ classId: result.classId, name: result.name }, { status: 200 });
};
