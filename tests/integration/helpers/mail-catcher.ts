// Reads what the app sent from the local mail catcher (setup starts it; MAIL_CATCHER_URL says where).

export interface CaughtMail {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

export async function mailTo(address: string): Promise<CaughtMail[]> {
  const base = process.env.MAIL_CATCHER_URL;
  if (!base) throw new Error('MAIL_CATCHER_URL is not set: run the tests through scripts/with-env.mjs or `npm test`');
  const res = await fetch(`${base}/messages?to=${encodeURIComponent(address)}`);
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
  return (await res.json()) as CaughtMail[];
}

/**
 * Waits for mail the app sends after answering (a drill notice goes out once the drill is stored), asking
 * the catcher again every 100 ms up to `tries` times; the caller then checks what arrived.
 */
export async function waitForMail(address: string, match: (m: CaughtMail) => boolean, tries = 100): Promise<CaughtMail[]> {
  for (let i = 0; i < tries; i++) {
    const found = (await mailTo(address)).filter(match);
    if (found.length > 0) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  return [];
}
