import type { AstroGlobal } from 'astro';
import type { Role, SessionUser } from '../roles';
import { jsonError } from './http';

// One helper for endpoints, one for pages: authorization happens where the data is served.

type Guarded = { ok: true; user: SessionUser } | { ok: false; response: Response };

/** For API routes: 401 when signed out, 403 when the role is not allowed. */
export function requireRole(locals: App.Locals, ...roles: Role[]): Guarded {
  const user = locals.user;
  if (!user) return { ok: false, response: jsonError(401, 'Sign in first') };
  if (roles.length && !roles.includes(user.role)) {
    return { ok: false, response: jsonError(403, 'Your role cannot do this') };
  }
  return { ok: true, user };
}

/**
 * For pages: the signed-in user, or the Response to return instead
 * (a redirect to /sign-in that comes back afterwards, or the 403 page).
 */
export async function guardPage(astro: AstroGlobal, ...roles: Role[]): Promise<SessionUser | Response> {
  const user = astro.locals.user;
  if (!user) return astro.redirect(`/sign-in?next=${encodeURIComponent(astro.url.pathname + astro.url.search)}`);
  if (roles.length && !roles.includes(user.role)) return astro.rewrite('/forbidden');
  return user;
}
