import { randomInt } from 'node:crypto';
import { and, asc, eq, sql } from 'drizzle-orm';
import { db } from './db';
import { hasClassRole, teachesLearner as sharesClass } from './class-members';
import { classes, classMembers, schools, users } from '../../db/schema';
import { JOIN_CODE_ALPHABET, JOIN_CODE_LENGTH } from '../schemas/classes';

export function newJoinCode(): string {
  let code = '';
  for (let i = 0; i < JOIN_CODE_LENGTH; i++) code += JOIN_CODE_ALPHABET[randomInt(JOIN_CODE_ALPHABET.length)];
  return code;
}

const learnerCount = sql<number>`(select count(*)::int from ${classMembers} where ${classMembers.classId} = ${classes.id} and ${classMembers.role} = 'learner')`;

export interface ClassSummary {
  id: string;
  name: string;
  joinCode: string;
  school: string | null;
  learners: number;
}

/** Creates the class with its creator as instructor; retries the rare join-code collision. */
export async function createClass(name: string, instructorId: string): Promise<{ id: string; name: string; joinCode: string }> {
  for (let attempt = 0; attempt < 5; attempt++) {
    const created = await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(classes)
        .values({ name, joinCode: newJoinCode(), createdBy: instructorId })
        .onConflictDoNothing({ target: classes.joinCode })
        .returning({ id: classes.id, name: classes.name, joinCode: classes.joinCode });
      if (!row) return null;
      await tx.insert(classMembers).values({ classId: row.id, userId: instructorId, role: 'instructor' });
      return row;
    });
    if (created) return created;
  }
  throw new Error('Could not find a free join code after 5 tries');
}

export type JoinResult = { ok: true; classId: string; name: string } | { ok: false; reason: 'unknown-code' };

/** Joining twice is harmless: the learner stays a member once. */
export async function joinClass(joinCode: string, learnerId: string): Promise<JoinResult> {
  const [cls] = await db.select({ id: classes.id, name: classes.name }).from(classes).where(eq(classes.joinCode, joinCode));
  if (!cls) return { ok: false, reason: 'unknown-code' };
  await db.insert(classMembers).values({ classId: cls.id, userId: learnerId, role: 'learner' }).onConflictDoNothing();
  return { ok: true, classId: cls.id, name: cls.name };
}

/** Classes a user belongs to in the given class role, with their learner counts. */
export async function classesOf(userId: string, role: 'instructor' | 'learner'): Promise<ClassSummary[]> {
  const rows = await db
    .select({
      id: classes.id,
      name: classes.name,
      joinCode: classes.joinCode,
      school: schools.name,
      learners: learnerCount,
    })
    .from(classMembers)
    .innerJoin(classes, eq(classes.id, classMembers.classId))
    .leftJoin(schools, eq(schools.id, classes.schoolId))
    .where(and(eq(classMembers.userId, userId), eq(classMembers.role, role)))
    .orderBy(asc(classes.name));
  return rows;
}

/** All classes, for admins. */
export async function allClasses(): Promise<ClassSummary[]> {
  const rows = await db
    .select({
      id: classes.id,
      name: classes.name,
      joinCode: classes.joinCode,
      school: schools.name,
      learners: learnerCount,
    })
    .from(classes)
    .leftJoin(schools, eq(schools.id, classes.schoolId))
    .orderBy(asc(classes.name));
  return rows;
}

/** The class with its members, or null; callers check that the viewer may see it. */
export async function classWithMembers(classId: string) {
  const [cls] = await db
    .select({ id: classes.id, name: classes.name, joinCode: classes.joinCode, school: schools.name })
    .from(classes)
    .leftJoin(schools, eq(schools.id, classes.schoolId))
    .where(eq(classes.id, classId));
  if (!cls) return null;
  const members = await db
    .select({ id: users.id, name: users.name, email: users.email, role: classMembers.role, joinedAt: classMembers.joinedAt })
    .from(classMembers)
    .innerJoin(users, eq(users.id, classMembers.userId))
    .where(eq(classMembers.classId, classId))
    .orderBy(asc(classMembers.role), asc(users.name));
  return { ...cls, members };
}

/** The class's name and join code, or null; callers check that the viewer may see it. */
export async function findClass(classId: string): Promise<{ id: string; name: string; joinCode: string } | null> {
  const [cls] = await db.select({ id: classes.id, name: classes.name, joinCode: classes.joinCode }).from(classes).where(eq(classes.id, classId));
  return cls ?? null;
}

export function isClassInstructor(classId: string, userId: string): Promise<boolean> {
  return hasClassRole(db, classId, userId, 'instructor');
}

export function isClassLearner(classId: string, userId: string): Promise<boolean> {
  return hasClassRole(db, classId, userId, 'learner');
}

/** True when the instructor teaches a class the learner is a learner in (attempts, uploads, progress). */
export function teachesLearner(instructorId: string, learnerId: string): Promise<boolean> {
  return sharesClass(db, instructorId, learnerId);
}
