import type { APIRoute } from 'astro';
import { roleChangeSchema } from '../../../../lib/schemas/auth';
import { requireRole } from '../../../../lib/server/guard';
import { jsonError, readJson, validationError } from '../../../../lib/server/http';
import { changeRole } from '../../../../lib/server/people';

/** PATCH {role}: admins change a person's role. */
export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const gate = requireRole(locals, 'admin');
  if (!gate.ok) return gate.response;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = roleChangeSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const result = await changeRole(params.id ?? '', parsed.data.role);
  if (!result.ok && result.reason === 'not-found') return jsonError(404, 'No such user');
  if (!result.ok) return jsonError(409, 'The last admin cannot give up the admin role');
  return Response.json(result.user);
};
