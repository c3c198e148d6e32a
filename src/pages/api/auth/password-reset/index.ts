import type { APIRoute } from 'astro';
import { passwordResetRequestSchema } from '../../../../lib/schemas/password-reset';
import { linkOrigin } from '../../../../lib/server/app-url';
import { clientAddress } from '../../../../lib/server/client-address';
import { readJson, validationError } from '../../../../lib/server/http';
import { requestPasswordReset, RESET_REQUESTED_MESSAGE } from '../../../../lib/server/password-reset';

/** POST {email} → 202 with the same body whether or not the address has an account; malformed → 400. */
export const POST: APIRoute = async ({ request, url, clientAddress: socketAddress }) => {
  const body = await readJson(request, 4 * 1024);
  if (!body.ok) return body.response;
  const parsed = passwordResetRequestSchema.safeParse(body.body);
  if (!parsed.success) return validationError(parsed.error);

  await requestPasswordReset(parsed.data.email, clientAddress(request, () => socketAddress), linkOrigin(url));
  return Response.json({ message: RESET_REQUESTED_MESSAGE }, { status: 202 });
};
