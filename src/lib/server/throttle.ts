import { eq, inArray, sql } from 'drizzle-orm';
import { db } from './db';
import { signInThrottle } from '../../db/schema';

// Counters live in PostgreSQL so that several app processes enforce one limit.
export const SIGN_IN_LIMITS = {
  windowMinutes: 15,
  perAccount: 5,
  perAddress: 30,
} as const;

const accountKey = (email: string) => `account:${email}`;
const addressKey = (address: string) => `address:${address}`;

/** Seconds until the caller may try again, or 0 when neither counter is over its limit. */
export async function signInBlockedFor(email: string, address: string): Promise<number> {
  const rows = await db
    .select({
      key: signInThrottle.key,
      failures: signInThrottle.failures,
      secondsLeft: sql<number>`greatest(0, extract(epoch from (${signInThrottle.windowStartedAt} + make_interval(mins => ${SIGN_IN_LIMITS.windowMinutes}) - now())))::int`,
    })
    .from(signInThrottle)
    .where(inArray(signInThrottle.key, [accountKey(email), addressKey(address)]));
  let wait = 0;
  for (const row of rows) {
    const limit = row.key.startsWith('account:') ? SIGN_IN_LIMITS.perAccount : SIGN_IN_LIMITS.perAddress;
    if (row.failures >= limit && row.secondsLeft > 0) wait = Math.max(wait, row.secondsLeft);
  }
  return wait;
}

/** Counts one failure against both keys; a window that has run out starts again at 1. */
export async function recordSignInFailure(email: string, address: string): Promise<void> {
  for (const key of [accountKey(email), addressKey(address)]) await countUse(key, SIGN_IN_LIMITS.windowMinutes);
}

/** A successful sign-in clears the account's counter (the address keeps its own). */
export async function clearAccountFailures(email: string): Promise<void> {
  await db.delete(signInThrottle).where(eq(signInThrottle.key, accountKey(email)));
}

/**
 * Counts one use of `key` in a fixed window and answers the count, this use included; a window that has
 * run out starts again at 1. Sign-in failures and other limits (password reset requests) share the
 * table, so several app processes keep one count.
 */
export async function countUse(key: string, windowMinutes: number): Promise<number> {
  const expired = sql`${signInThrottle.windowStartedAt} + make_interval(mins => ${windowMinutes}) <= now()`;
  const [row] = await db
    .insert(signInThrottle)
    .values({ key, failures: 1 })
    .onConflictDoUpdate({
      target: signInThrottle.key,
      set: {
        failures: sql`case when ${expired} then 1 else ${signInThrottle.failures} + 1 end`,
        windowStartedAt: sql`case when ${expired} then now() else ${signInThrottle.windowStartedAt} end`,
      },
    })
    .returning({ count: signInThrottle.failures });
  return row!.count;
}
