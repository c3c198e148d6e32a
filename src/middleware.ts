import { defineMiddleware, sequence } from 'astro:middleware';
import { lucia } from './lib/server/auth';
import { jsonError } from './lib/server/http';
import { NUL_MESSAGE } from './lib/text/nul';
import { clearSessionCookie, readSessionId, refreshSessionCookie } from './lib/server/session-cookie';

// A NUL character in the address would reach the database in a route's parameter or query (PostgreSQL
// text cannot hold it): refused here for every page and endpoint, before anything looks at it.
const refuseNulInAddress = defineMiddleware((context, next) => {
  const { pathname, search } = context.url;
  if (!/%00/.test(pathname + search)) return next();
  if (pathname.startsWith('/api/')) return jsonError(400, `The address is not valid: ${NUL_MESSAGE}`);
  return new Response(`Bad request: the address contains a NUL character.\n`, { status: 400, headers: { 'content-type': 'text/plain; charset=utf-8' } });
});

// Always sets locals.user and locals.session, null included; pages and endpoints authorize themselves.
const session = defineMiddleware(async (context, next) => {
  const sessionId = readSessionId(context.cookies);
  if (!sessionId) {
    context.locals.user = null;
    context.locals.session = null;
    return next();
  }
  const { session, user } = await lucia.validateSession(sessionId);
  if (session?.fresh) refreshSessionCookie(context.cookies, session.id);
  if (!session) clearSessionCookie(context.cookies);
  context.locals.session = session;
  context.locals.user = user ? { id: user.id, name: user.name, email: user.email, role: user.role } : null;
  return next();
});

// API answers are per user; never let a shared cache keep them.
const noStoreForApi = defineMiddleware(async (context, next) => {
  const response = await next();
  if (context.url.pathname.startsWith('/api/') && !response.headers.has('cache-control')) {
    try {
      response.headers.set('cache-control', 'no-store');
    } catch {
      // Some responses (redirects) have immutable headers; they carry no user data.
    }
  }
  return response;
});

export const onRequest = sequence(refuseNulInAddress, session, noStoreForApi);
