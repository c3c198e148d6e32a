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

export function readSessionId(cookies: AstroCookies): string | null {
  return cookies.get(lucia.sessionCookieName)?.value ?? null;
}

export async function endSession(cookies: AstroCookies, sessionId: string | undefined): Promise<void> {
  if (sessionId) await lucia.invalidateSession(sessionId);
  clearSessionCookie(cookies);
}
