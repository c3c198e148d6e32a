import { and, eq } from 'drizzle-orm';
import { z } from 'zod';
import { classes, classMembers } from '../../db/schema';
import type { SessionUser } from '../roles';
import { db } from './db';
import { requireRole } from './guard';
import { jsonError } from './http';

// Who may run a class: admins any, instructors only those they teach. One place for the rule, so every
// class route answers 403 for another instructor's class and 404 for no class at all.

export interface StaffClass {
  id: string;
  name: string;
  joinCode: string;
}

export type TaughtClass = { ok: true; cls: StaffClass } | { ok: false; status: 403 | 404; error: string };

const uuid = z.string().uuid();

/** The class if the viewer may run it; ids that are not UUIDs are simply not classes (404). */
export async function classTaughtBy(viewer: SessionUser, rawId: string | undefined): Promise<TaughtClass> {
  const id = uuid.safeParse(rawId);
  if (!id.success) return { ok: false, status: 404, error: 'No such class' };
  const [cls] = await db.select({ id: classes.id, name: classes.name, joinCode: classes.joinCode }).from(classes).where(eq(classes.id, id.data));
  if (!cls) return { ok: false, status: 404, error: 'No such class' };
  if (viewer.role === 'admin') return { ok: true, cls };
  if (viewer.role !== 'instructor') return { ok: false, status: 403, error: 'Your role cannot do this' };
  const [member] = await db
    .select({ userId: classMembers.userId })
    .from(classMembers)
    .where(and(eq(classMembers.classId, cls.id), eq(classMembers.userId, viewer.id), eq(classMembers.role, 'instructor')));
  return member ? { ok: true, cls } : { ok: false, status: 403, error: 'You do not teach this class' };
}

type Access = { ok: true; user: SessionUser; cls: StaffClass } | { ok: false; response: Response };

/** For endpoints only staff use: 401 signed out and 403 for learners come first, then classTaughtBy. */
export async function classForStaff(locals: App.Locals, classId: string | undefined): Promise<Access> {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate;
  const taught = await classTaughtBy(gate.user, classId);
  if (!taught.ok) return { ok: false, response: jsonError(taught.status, taught.error) };
  return { ok: true, user: gate.user, cls: taught.cls };
}

export async function isClassLearner(classId: string, userId: string): Promise<boolean> {
  const [row] = await db
    .select({ userId: classMembers.userId })
    .from(classMembers)
    .where(and(eq(classMembers.classId, classId), eq(classMembers.userId, userId), eq(classMembers.role, 'learner')));
  return Boolean(row);
}
