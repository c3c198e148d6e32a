// Reads what the local mail catcher caught (scripts/fakes/mail-catcher.mjs), for integration and e2e tests.

export interface CaughtMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

function catcherUrl(): string {
  const url = process.env.MAIL_CATCHER_URL;
  if (!url) throw new Error('MAIL_CATCHER_URL is not set: run the tests through scripts/with-env.mjs or npm test');
  return url;
}

/** Messages to one address, newest first. */
export async function mailTo(address: string): Promise<CaughtMessage[]> {
  const res = await fetch(`${catcherUrl()}/messages?to=${encodeURIComponent(address)}`);
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
  return (await res.json()) as CaughtMessage[];
}

/**
 * Waits until at least `count` messages to the address have arrived (some mail is sent after the answer,
 * on purpose), and returns them newest first. Gives up after a generous deadline with a clear error.
 */
export async function waitForMail(address: string, count = 1): Promise<CaughtMessage[]> {
  const deadline = Date.now() + 15_000;
  for (;;) {
    const messages = await mailTo(address);
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
