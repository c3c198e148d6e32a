import { MAIL_CATCHER_URL } from 'astro:env/server';
import { isCaughtMessage, type CaughtMessage } from '../mail/caught-message';

export type CaughtMail =
  | { kind: 'relay' }
  | { kind: 'unreachable'; reason: string }
  | { kind: 'caught'; messages: CaughtMessage[] };

/**
 * What the local mail catcher holds, newest first. Only a development or test setup sets MAIL_CATCHER_URL;
 * a real deployment sends through its relay and keeps no copy (`relay`).
 */
export async function caughtMail(to?: string): Promise<CaughtMail> {
  if (!MAIL_CATCHER_URL) return { kind: 'relay' };
  const url = new URL('/messages', MAIL_CATCHER_URL);
  if (to) url.searchParams.set('to', to);
  try {
    const res = await fetch(url, { signal: AbortSignal.timeout(5000) });
    if (!res.ok) return { kind: 'unreachable', reason: `it answered ${res.status}` };
    const body: unknown = await res.json();
    if (!Array.isArray(body)) return { kind: 'unreachable', reason: 'its answer was not a list' };
    return { kind: 'caught', messages: body.filter(isCaughtMessage) };
  } catch (err) {
    return { kind: 'unreachable', reason: err instanceof Error ? err.message : 'no answer' };
  }
}
