import { defineMiddleware, sequence } from 'astro:middleware';
import { lucia } from './lib/server/auth';
import { clearSessionCookie, readSessionId, refreshSessionCookie } from './lib/server/session-cookie';

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

export const onRequest = sequence(session, noStoreForApi);
