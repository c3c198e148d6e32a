import type { APIRoute } from 'astro';
import { endSession } from '../../../lib/server/session-cookie';

// Signing out twice is not an error: the answer is the same empty 204.
export const POST: APIRoute = async ({ locals, cookies }) => {
  await endSession(cookies, locals.session?.id);
  return new Response(null, { status: 204 });
};
