import { mailer } from './mail';
import type { OutgoingMail } from './mailer';

// A few at a time: a class's worth of mail goes out quickly without opening hundreds of connections.
const AT_ONCE = 4;

/**
 * Sends each message on its own and answers, in the same order, whether the relay took it. A failure is
 * logged and reported for that address only; it never throws, because the records it follows are saved.
 */
export async function deliverEach(mails: OutgoingMail[]): Promise<boolean[]> {
  const sent = new Array<boolean>(mails.length).fill(false);
  let next = 0;
  async function worker() {
    while (next < mails.length) {
      const i = next++;
      try {
        await mailer.send(mails[i]!);
        sent[i] = true;
      } catch (err) {
        console.error(`mail to ${mails[i]!.to} failed:`, err instanceof Error ? err.message : err);
      }
    }
  }
  await Promise.all(Array.from({ length: Math.min(AT_ONCE, mails.length) }, worker));
  return sent;
}
