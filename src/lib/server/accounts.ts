import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { db } from './db';
import { users } from '../../db/schema';
import { hashPassword, verifyPassword } from './password';
import { clearAccountFailures, recordSignInFailure, signInBlockedFor } from './throttle';
import type { SignInInput, SignUpInput } from '../schemas/auth';
import type { SessionUser } from '../roles';

// Account rules shared by the JSON API and the HTML forms.

const publicColumns = { id: users.id, name: users.name, email: users.email, role: users.role };

export type SignUpResult = { ok: true; user: SessionUser } | { ok: false; reason: 'email-taken' };

export async function signUp(input: SignUpInput): Promise<SignUpResult> {
  const passwordHash = await hashPassword(input.password);
  const [user] = await db
    .insert(users)
    .values({ id: randomUUID(), name: input.name, email: input.email, passwordHash, role: 'learner' })
    .onConflictDoNothing({ target: users.email })
    .returning(publicColumns);
  return user ? { ok: true, user } : { ok: false, reason: 'email-taken' };
}

export type SignInResult =
  | { ok: true; user: SessionUser }
  | { ok: false; reason: 'bad-credentials' }
  | { ok: false; reason: 'rate-limited'; retryAfterSeconds: number };

// Verifying against a real hash for unknown e-mails keeps both answers equally slow.
let decoyHash: Promise<string> | null = null;

export async function signIn(input: SignInInput, address: string): Promise<SignInResult> {
  const wait = await signInBlockedFor(input.email, address);
  if (wait > 0) return { ok: false, reason: 'rate-limited', retryAfterSeconds: wait };

  const [row] = await db
    .select({ ...publicColumns, passwordHash: users.passwordHash })
    .from(users)
    .where(eq(users.email, input.email));
  decoyHash ??= hashPassword('not-a-real-password-anyone-uses');
  const valid = await verifyPassword(row?.passwordHash ?? (await decoyHash), input.password);
  if (!row || !valid) {
    await recordSignInFailure(input.email, address);
    return { ok: false, reason: 'bad-credentials' };
  }
  await clearAccountFailures(input.email);
  const { passwordHash: _omit, ...user } = row;
  return { ok: true, user };
}

export const SIGN_IN_FAILED_MESSAGE = 'E-mail or password is wrong';

export function rateLimitedMessage(seconds: number): string {
  const minutes = Math.max(1, Math.ceil(seconds / 60));
  return `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`;
}
