import { and, eq } from 'drizzle-orm';
import { z } from 'zod';
import { classes, classMembers } from '../../db/schema';
import type { SessionUser } from '../roles';
import { db } from './db';

export type TaughtClass = { ok: true; cls: { id: string; name: string } } | { ok: false; status: 403 | 404; error: string };

const uuid = z.string().uuid();

/**
 * A class the viewer may run: admins any, instructors only those they teach (403 for another class,
 * 404 for none at all). Ids that are not UUIDs are simply not classes.
 */
export async function classTaughtBy(viewer: SessionUser, rawId: string | undefined): Promise<TaughtClass> {
  const id = uuid.safeParse(rawId);
  if (!id.success) return { ok: false, status: 404, error: 'No such class' };
  const [cls] = await db.select({ id: classes.id, name: classes.name }).from(classes).where(eq(classes.id, id.data));
  if (!cls) return { ok: false, status: 404, error: 'No such class' };
  if (viewer.role === 'admin') return { ok: true, cls };
  if (viewer.role !== 'instructor') return { ok: false, status: 403, error: 'Your role cannot do this' };
  const [member] = await db
    .select({ userId: classMembers.userId })
    .from(classMembers)
    .where(and(eq(classMembers.classId, cls.id), eq(classMembers.userId, viewer.id), eq(classMembers.role, 'instructor')));
  return member ? { ok: true, cls } : { ok: false, status: 403, error: 'You do not teach this class' };
}

export async function isClassLearner(classId: string, userId: string): Promise<boolean> {
  const [row] = await db
    .select({ userId: classMembers.userId })
    .from(classMembers)
    .where(and(eq(classMembers.classId, classId), eq(classMembers.userId, userId), eq(classMembers.role, 'learner')));
  return Boolean(row);
}
