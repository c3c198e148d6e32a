import { createHash, randomBytes } from 'node:crypto';
import { and, eq, gt, isNull, ne, sql } from 'drizzle-orm';
import { db } from './db';
import { passwordResetTokens, users } from '../../db/schema';
import { lucia } from './auth';
import { deliverEach } from './mail-delivery';
import { hashPassword } from './password';
import { clearAccountFailures, countUse } from './throttle';
import { passwordResetMail, resetLink } from '../mail/account-messages';
import { INVALID_RESET_LINK } from '../schemas/password-reset';

export const RESET_LIMITS = {
  lifetimeMinutes: 60,
  windowMinutes: 60,
  /** Mails one address can be sent per window: enough for a lost mail or two, too few to flood an inbox. */
  perAccount: 3,
  /** Requests one client address may make per window, whatever the e-mail. */
  perAddress: 20,
} as const;

/** The one answer to every well-formed request, so it never tells whether an account exists. */
export const RESET_REQUESTED_MESSAGE =
  'If an account uses this address, a link to set a new password is on its way. The link works once, for 1 hour.';

export const RESET_FAILURE_MESSAGES = {
  invalid: INVALID_RESET_LINK,
  used: 'This reset link has already been used. Ask for a new one if you still need it.',
  expired: 'This reset link has expired: links work for 1 hour. Ask for a new one.',
} as const;
export type ResetFailure = keyof typeof RESET_FAILURE_MESSAGES;

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

/**
 * Starts a reset: a single-use token (only its SHA-256 is stored) mailed as a link; any older link of the
 * account stops working. Known and unknown addresses run the same statements and the answer never waits
 * for the mail relay, so neither the answer nor its timing tells whether the address has an account.
 * Over the limits nothing is sent, silently, for the same reason.
 */
export async function requestPasswordReset(email: string, clientAddress: string, origin: string): Promise<void> {
  const [forAccount, forAddress] = await Promise.all([
    countUse(`reset-account:${email}`, RESET_LIMITS.windowMinutes),
    countUse(`reset-address:${clientAddress}`, RESET_LIMITS.windowMinutes),
  ]);
  const allowed = forAccount <= RESET_LIMITS.perAccount && forAddress <= RESET_LIMITS.perAddress;
  const [user] = await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.email, email));
  const token = randomBytes(32).toString('base64url');
  const target = allowed && user ? user : null;

  await db.transaction(async (tx) => {
    // With no account (or over the limit) this matches nothing: the same work, no effect.
    await tx.delete(passwordResetTokens).where(and(eq(passwordResetTokens.userId, target?.id ?? ''), isNull(passwordResetTokens.usedAt)));
    if (target) {
      await tx.insert(passwordResetTokens).values({
        tokenHash: hashToken(token),
        userId: target.id,
        expiresAt: sql`now() + make_interval(mins => ${RESET_LIMITS.lifetimeMinutes})`,
      });
    }
  });

  if (target) {
    const mail = passwordResetMail({ name: target.name, resetUrl: resetLink(origin, token), expiresInMinutes: RESET_LIMITS.lifetimeMinutes });
    // Not awaited (see above); deliverEach logs a failure and never throws.
    void deliverEach([{ to: email, ...mail }]);
  }
}

/** Whether a token from a link still works, so the page can say so before asking for a password. */
export async function checkResetToken(token: string): Promise<ResetFailure | null> {
  const [row] = await db
    .select({ usedAt: passwordResetTokens.usedAt, expired: sql<boolean>`${passwordResetTokens.expiresAt} <= now()` })
    .from(passwordResetTokens)
    .where(eq(passwordResetTokens.tokenHash, hashToken(token)));
  if (!row) return 'invalid';
  if (row.usedAt) return 'used';
  if (row.expired) return 'expired';
  return null;
}

export type ResetResult = { ok: true } | { ok: false; reason: ResetFailure };

/**
 * Sets the new password with a token that is unused and unexpired, and spends it; every other link of the
 * account dies with it and every session of the account is signed out.
 */
export async function resetPassword(token: string, password: string): Promise<ResetResult> {
  // Checked before hashing, so a flood of made-up tokens costs no argon2 time.
  const problem = await checkResetToken(token);
  if (problem) return { ok: false, reason: problem };
  const passwordHash = await hashPassword(password);
  const tokenHash = hashToken(token);

  const account = await db.transaction(async (tx) => {
    // The conditional update is the single use: of two requests racing with one token, one wins.
    const [claimed] = await tx
      .update(passwordResetTokens)
      .set({ usedAt: sql`now()` })
      .where(and(eq(passwordResetTokens.tokenHash, tokenHash), isNull(passwordResetTokens.usedAt), gt(passwordResetTokens.expiresAt, sql`now()`)))
      .returning({ userId: passwordResetTokens.userId });
    if (!claimed) return null;
    const [user] = await tx.update(users).set({ passwordHash }).where(eq(users.id, claimed.userId)).returning({ id: users.id, email: users.email });
    await tx
      .delete(passwordResetTokens)
      .where(and(eq(passwordResetTokens.userId, claimed.userId), ne(passwordResetTokens.tokenHash, tokenHash), isNull(passwordResetTokens.usedAt)));
    return user ?? null;
  });
  if (!account) return { ok: false, reason: 'used' };

  await lucia.invalidateUserSessions(account.id);
  // A locked-out owner who just proved they read the mailbox may sign in straight away.
  await clearAccountFailures(account.email);
  return { ok: true };
}
