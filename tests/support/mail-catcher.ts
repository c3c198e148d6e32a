// Reads what the local mail catcher caught (scripts/fakes/mail-catcher.mjs), for integration and e2e tests.
import { isCaughtMessage, type CaughtMessage } from '../../src/lib/mail/caught-message';

function catcherUrl(): string {
  const url = process.env.MAIL_CATCHER_URL;
  if (!url) throw new Error('MAIL_CATCHER_URL is not set: run the tests through scripts/with-env.mjs or npm test');
  return url;
}

/**
 * A test that runs a job with spawnSync blocks this process past the catcher's keep-alive timeout (5 s), so
 * the pooled connection may be closed under the next request: that one failure is asked again once, on a
 * new connection.
 */
async function getRetryingOnce(url: string): Promise<Response> {
  try {
    return await fetch(url);
  } catch {
    return fetch(url);
  }
}

/** Messages to one address, newest first. */
export async function mailTo(address: string): Promise<CaughtMessage[]> {
  const res = await getRetryingOnce(`${catcherUrl()}/messages?to=${encodeURIComponent(address)}`);
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
  const body: unknown = await res.json();
  if (!Array.isArray(body) || !body.every(isCaughtMessage)) throw new Error(`mail catcher answered something other than a list of messages: ${JSON.stringify(body)}`);
  return body;
}

/**
 * Waits for mail the app sends after answering (a drill notice goes out once the drill is stored): until at
 * least `expected` messages to the address have arrived, or, given a test, until one of them passes it.
 * Returns those messages newest first; gives up after a generous deadline with a clear error.
 */
export async function waitForMail(address: string, expected: number | ((m: CaughtMessage) => boolean) = 1): Promise<CaughtMessage[]> {
  const count = typeof expected === 'number' ? expected : 1;
  const wanted = typeof expected === 'number' ? () => true : expected;
  const deadline = Date.now() + 15_000;
  for (;;) {
    const messages = (await mailTo(address)).filter(wanted);
    if (messages.length >= count) return messages;
    if (Date.now() > deadline) throw new Error(`expected ${count} message(s) to ${address}, caught ${messages.length}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The first link in a message's text whose path is `path`. */
export function linkIn(message: CaughtMessage, path: string): URL {
  for (const match of message.text.matchAll(/https?:\/\/\S+/g)) {
    const url = new URL(match[0]);
    if (url.pathname === path) return url;
  }
  throw new Error(`no ${path} link in “${message.subject}”:\n${message.text}`);
}
