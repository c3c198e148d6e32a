import type { APIRoute } from 'astro';
import { signInSchema } from '../../../lib/schemas/auth';
import { rateLimitedMessage, signIn, SIGN_IN_FAILED_MESSAGE } from '../../../lib/server/accounts';
import { clientAddress } from '../../../lib/server/client-address';
import { jsonError, readJson, validationError } from '../../../lib/server/http';
import { startSession } from '../../../lib/server/session-cookie';

export const POST: APIRoute = async (context) => {
  const body = await readJson(context.request);
  if (!body.ok) return body.response;
  const parsed = signInSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const address = clientAddress(context.request, () => context.clientAddress);
  const result = await signIn(parsed.data, address);
  if (!result.ok && result.reason === 'rate-limited') {
    return Response.json(
      { error: rateLimitedMessage(result.retryAfterSeconds) },
      { status: 429, headers: { 'retry-after': String(result.retryAfterSeconds) } },
    );
  }
  if (!result.ok) return jsonError(401, SIGN_IN_FAILED_MESSAGE);
  await startSession(context.cookies, result.user.id);
  return Response.json(result.user, { status: 200 });
};
