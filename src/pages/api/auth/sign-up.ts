import type { APIRoute } from 'astro';
import { signUpWithCodeSchema } from '../../../lib/schemas/auth';
import { jsonError, readJson, validationError } from '../../../lib/server/http';
import { signUpWithCode } from '../../../lib/server/invited-sign-up';
import { startSession } from '../../../lib/server/session-cookie';

/** POST {name, email, password, joinCode?}: a learner account; with a join code it also joins that class. */
export const POST: APIRoute = async ({ request, cookies }) => {
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = signUpWithCodeSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const result = await signUpWithCode(parsed.data);
  if (!result.ok && result.reason === 'unknown-code') {
    return jsonError(404, 'No class has this join code', { joinCode: ['Unknown join code'] });
  }
  if (!result.ok) return jsonError(409, 'An account with this e-mail already exists', { email: ['Already registered'] });
  await startSession(cookies, result.user.id);
  // `joined` only when a code was sent, so the answer to a plain sign-up stays as documented.
  return Response.json(parsed.data.joinCode ? { ...result.user, joined: result.joined } : result.user, { status: 201 });
};
