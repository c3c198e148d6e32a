import type { APIRoute } from 'astro';
import { passwordResetConfirmSchema } from '../../../../lib/schemas/password-reset';
import { jsonError, readJson, validationError } from '../../../../lib/server/http';
import { RESET_FAILURE_MESSAGES, resetPassword } from '../../../../lib/server/password-reset';

/** POST {token, password} → 204; the token is spent and every session of the account ends. */
export const POST: APIRoute = async ({ request }) => {
  const body = await readJson(request, 4 * 1024);
  if (!body.ok) return body.response;
  const parsed = passwordResetConfirmSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  const result = await resetPassword(parsed.data.token, parsed.data.password);
  if (!result.ok) {
    const message = RESET_FAILURE_MESSAGES[result.reason];
    return jsonError(400, message, { token: [message] });
  }
  return new Response(null, { status: 204 });
};
