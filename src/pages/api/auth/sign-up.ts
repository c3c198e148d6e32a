import type { APIRoute } from 'astro';
import { signUpSchema } from '../../../lib/schemas/auth';
import { signUp } from '../../../lib/server/accounts';
import { jsonError, readJson, validationError } from '../../../lib/server/http';
import { startSession } from '../../../lib/server/session-cookie';

export const POST: APIRoute = async ({ request, cookies }) => {
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = signUpSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const result = await signUp(parsed.data);
  if (!result.ok) return jsonError(409, 'An account with this e-mail already exists', { email: ['Already registered'] });
  await startSession(cookies, result.user.id);
  return Response.json(result.user, { status: 201 });
};
