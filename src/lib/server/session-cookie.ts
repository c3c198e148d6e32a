import type { AstroCookies } from 'astro';
import { lucia } from './auth';

// The one place that writes the session cookie: httpOnly, path '/', sameSite 'lax', secure in production.

export async function startSession(cookies: AstroCookies, userId: string): Promise<void> {
  const session = await lucia.createSession(userId, {});
  const cookie = lucia.createSessionCookie(session.id);
  cookies.set(cookie.name, cookie.value, cookie.attributes);
}

export function refreshSessionCookie(cookies: AstroCookies, sessionId: string): void {
  const cookie = lucia.createSessionCookie(sessionId);
  cookies.set(cookie.name, cookie.value, cookie.attributes);
}

export function clearSessionCookie(cookies: AstroCookies): void {
  const cookie = lucia.createBlankSessionCookie();
  cookies.set(cookie.name, cookie.value, cookie.attributes);
}

// Session ids are lowercase base32 (lucia's generateIdFromEntropySize); anything else names no session and
// never reaches the database (a NUL in it would make the lookup fail).
const SESSION_ID = /^[a-z0-9]{1,128}$/;

export function readSessionId(cookies: AstroCookies): string | null {
  const value = cookies.get(lucia.sessionCookieName)?.value;
  return value && SESSION_ID.test(value) ? value : null;
}

export async function endSession(cookies: AstroCookies, sessionId: string | undefined): Promise<void> {
  if (sessionId) await lucia.invalidateSession(sessionId);
  clearSessionCookie(cookies);
}
