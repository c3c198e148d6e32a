import type { APIRoute } from 'astro';
import { endSession } from '../lib/server/session-cookie';

// The top bar's sign-out form posts here; the JSON twin is /api/auth/sign-out.
export const POST: APIRoute = async ({ locals, cookies, redirect }) => {
  await endSession(cookies, locals.session?.id);
  return redirect('/', 303);
};
