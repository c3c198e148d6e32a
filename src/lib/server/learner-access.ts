import { eq } from 'drizzle-orm';
import { db } from './db';
import { users } from '../../db/schema';
import type { SessionUser } from '../roles';
import { mayViewLearner } from './class-access';

// Who may look at one learner's progress: admins, and instructors of a class the learner is in.

export interface LearnerRef {
  id: string;
  name: string;
}

/**
 * The learner when the viewer may see them, else null (answered as 404 so ids leak nothing). Learners
 * look at their own progress through /api/me/progress, not here.
 */
export async function learnerForViewer(viewer: SessionUser, learnerId: string): Promise<LearnerRef | null> {
  const [learner] = await db.select({ id: users.id, name: users.name, role: users.role }).from(users).where(eq(users.id, learnerId));
  if (!learner || learner.role !== 'learner') return null;
  return (await mayViewLearner(viewer, learner.id)) ? { id: learner.id, name: learner.name } : null;
}
