import { z } from 'zod';
import type { SessionUser } from '../roles';
import { findClass, isClassInstructor, isClassLearner, teachesLearner } from './classes';
import { requireRole } from './guard';
import { jsonError } from './http';

// Who may do what with a class, built on the membership queries in class-members.ts (through classes.ts): admins run any class,
// instructors only those they teach, learners see their own. Every route asks here; each keeps its own
// status codes for a refusal (most answer 403 for another instructor's class and 404 for no class at all).

export interface StaffClass {
  id: string;
  name: string;
  joinCode: string;
}

/** True when the viewer may run the (existing) class: an admin, or one of its instructors. */
export async function mayRunClass(viewer: SessionUser, classId: string): Promise<boolean> {
  if (viewer.role === 'admin') return true;
  return viewer.role === 'instructor' && (await isClassInstructor(classId, viewer.id));
}

/** True when the viewer may see this learner's work: an admin, or an instructor of a class the learner is in. */
export async function mayViewLearner(viewer: SessionUser, learnerId: string): Promise<boolean> {
  if (viewer.role === 'admin') return true;
  return viewer.role === 'instructor' && (await teachesLearner(viewer.id, learnerId));
}

/** Why staff access to a class was refused; each route turns it into its own status. */
export type StaffRefusal = 'malformed-id' | 'no-class' | 'not-staff' | 'not-taught';

const uuid = z.string().uuid();

/** The class if the viewer may run it, else why not. */
export async function staffClass(viewer: SessionUser, rawId: string | undefined): Promise<{ ok: true; cls: StaffClass } | { ok: false; why: StaffRefusal }> {
  const id = uuid.safeParse(rawId);
  if (!id.success) return { ok: false, why: 'malformed-id' };
  const cls = await findClass(id.data);
  if (!cls) return { ok: false, why: 'no-class' };
  if (viewer.role !== 'admin' && viewer.role !== 'instructor') return { ok: false, why: 'not-staff' };
  return (await mayRunClass(viewer, cls.id)) ? { ok: true, cls } : { ok: false, why: 'not-taught' };
}

export type TaughtClass = { ok: true; cls: StaffClass } | { ok: false; status: 403 | 404; error: string };

const TAUGHT_REFUSALS: Record<StaffRefusal, { status: 403 | 404; error: string }> = {
  // Ids that are not UUIDs are simply not classes.
  'malformed-id': { status: 404, error: 'No such class' },
  'no-class': { status: 404, error: 'No such class' },
  'not-staff': { status: 403, error: 'Your role cannot do this' },
  'not-taught': { status: 403, error: 'You do not teach this class' },
};

/** The class if the viewer may run it; 404 for no class (or an id that is not one), 403 for anyone else's. */
export async function classTaughtBy(viewer: SessionUser, rawId: string | undefined): Promise<TaughtClass> {
  const access = await staffClass(viewer, rawId);
  return access.ok ? access : { ok: false, ...TAUGHT_REFUSALS[access.why] };
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

export type ClassAccess = 'manage' | 'learner' | null;

/**
 * How the user stands in a class: 'manage' for its instructors and admins, 'learner' for a learner in
 * it, null for anyone else or a class that does not exist.
 */
export async function classAccess(classId: string, user: SessionUser): Promise<ClassAccess> {
  if (user.role === 'admin') return (await findClass(classId)) ? 'manage' : null;
  if (user.role === 'instructor') return (await isClassInstructor(classId, user.id)) ? 'manage' : null;
  return (await isClassLearner(classId, user.id)) ? 'learner' : null;
}
