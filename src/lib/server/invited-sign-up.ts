import { eq } from 'drizzle-orm';
import { db } from './db';
import { classes } from '../../db/schema';
import { signUp } from './accounts';
import { joinClass } from './classes';
import type { SignUpInput } from '../schemas/auth';
import type { SessionUser } from '../roles';

export async function classByJoinCode(joinCode: string): Promise<{ id: string; name: string } | null> {
  const [cls] = await db.select({ id: classes.id, name: classes.name }).from(classes).where(eq(classes.joinCode, joinCode));
  return cls ?? null;
}

export type InvitedSignUpResult =
  | { ok: true; user: SessionUser; joined: { classId: string; name: string } | null }
  | { ok: false; reason: 'email-taken' | 'unknown-code' };

/**
 * Sign-up that may carry a class's join code (from an invitation link): the code is checked first, so a
 * wrong code creates no account, and the new learner is in the class when the page after sign-up loads.
 */
export async function signUpWithCode(input: SignUpInput & { joinCode?: string | undefined }): Promise<InvitedSignUpResult> {
  if (input.joinCode && !(await classByJoinCode(input.joinCode))) return { ok: false, reason: 'unknown-code' };
  const created = await signUp(input);
  if (!created.ok) return created;
  if (!input.joinCode) return { ok: true, user: created.user, joined: null };
  const joined = await joinClass(input.joinCode, created.user.id);
  return { ok: true, user: created.user, joined: joined.ok ? { classId: joined.classId, name: joined.name } : null };
}
