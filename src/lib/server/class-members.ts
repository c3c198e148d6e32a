import { and, asc, eq } from 'drizzle-orm';
import type { NodePgQueryResultHKT } from 'drizzle-orm/node-postgres';
import type { PgDatabase } from 'drizzle-orm/pg-core';
import * as schema from '../../db/schema';

// Class membership: the one rule behind every "does this user teach that class / learn in it" check.
// Each query takes its database or transaction as an argument, so the `npm run remind` job (no astro:env)
// and locking transactions use the same rule as the app's routes.

export type Queryable = PgDatabase<NodePgQueryResultHKT, typeof schema>;
export type ClassRole = 'instructor' | 'learner';

const { classMembers, users } = schema;

/** The user's membership row in the class in that role, as a query: await it, or lock it with `.for('update')`. */
export function membership(q: Queryable, classId: string, userId: string, role: ClassRole) {
  return q
    .select({ userId: classMembers.userId })
    .from(classMembers)
    .where(and(eq(classMembers.classId, classId), eq(classMembers.userId, userId), eq(classMembers.role, role)));
}

export async function hasClassRole(q: Queryable, classId: string, userId: string, role: ClassRole): Promise<boolean> {
  const [row] = await membership(q, classId, userId, role);
  return Boolean(row);
}

/** The ids of the classes the user is in, in that role, as a subquery (`inArray(col, classIdsOf(…))`). */
export function classIdsOf(q: Queryable, userId: string, role: ClassRole) {
  return q
    .select({ classId: classMembers.classId })
    .from(classMembers)
    .where(and(eq(classMembers.userId, userId), eq(classMembers.role, role)));
}

/** True when the instructor teaches a class the learner is a learner in. */
export async function teachesLearner(q: Queryable, instructorId: string, learnerId: string): Promise<boolean> {
  const [shared] = await classIdsOf(q, learnerId, 'learner').intersect(classIdsOf(q, instructorId, 'instructor'));
  return Boolean(shared);
}

export interface Learner {
  id: string;
  name: string;
  email: string;
}

/** The learners (not the instructors) of a class, by name. */
export async function learnersOf(q: Queryable, classId: string): Promise<Learner[]> {
  return q
    .select({ id: users.id, name: users.name, email: users.email })
    .from(classMembers)
    .innerJoin(users, eq(users.id, classMembers.userId))
    .where(and(eq(classMembers.classId, classId), eq(classMembers.role, 'learner')))
    .orderBy(asc(users.name), asc(users.email));
}
