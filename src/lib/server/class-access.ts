import { eq } from 'drizzle-orm';
import { db } from './db';
import { classes } from '../../db/schema';
import { isClassInstructor } from './classes';
import { requireRole } from './guard';
import { jsonError } from './http';
import type { SessionUser } from '../roles';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export interface StaffClass {
  id: string;
  name: string;
  joinCode: string;
}

type Access = { ok: true; user: SessionUser; cls: StaffClass } | { ok: false; response: Response };

/**
 * For class endpoints that only the class's instructors and admins use: 401 signed out, 403 for learners
 * and for instructors of other classes, 404 when the id names no class (an id that is not a UUID included).
 */
export async function classForStaff(locals: App.Locals, classId: string | undefined): Promise<Access> {
  const gate = requireRole(locals, 'instructor', 'admin');
  if (!gate.ok) return gate;
  if (!classId || !UUID.test(classId)) return { ok: false, response: jsonError(404, 'No such class') };
  const [cls] = await db.select({ id: classes.id, name: classes.name, joinCode: classes.joinCode }).from(classes).where(eq(classes.id, classId));
  if (!cls) return { ok: false, response: jsonError(404, 'No such class') };
  if (gate.user.role !== 'admin' && !(await isClassInstructor(cls.id, gate.user.id))) {
    return { ok: false, response: jsonError(403, 'You do not teach this class') };
  }
  return { ok: true, user: gate.user, cls };
}
