import { and, eq } from 'drizzle-orm';
import { db } from './db';
import { attempts, classMembers, procedures, procedureVersions } from '../../db/schema';
import { attemptRow, createdAttempt, type AttemptView } from './attempt-row';
import { findVersion } from './procedure-store';
import { recordMisses } from './rework';
import { scoreAttempt } from '../scoring';
import type { Issue } from '../procedure/validate';
import type { AttemptRequest } from '../schemas/attempts';
import type { SessionUser } from '../roles';

const viewColumns = {
  id: attempts.id,
  learnerId: attempts.userId,
  procedure: procedures.slug,
  version: procedureVersions.version,
  stage: attempts.stage,
  score: attempts.score,
  maxScore: attempts.maxScore,
  passed: attempts.passed,
  results: attempts.results,
  notes: attempts.notes,
  answer: attempts.answer,
  createdAt: attempts.createdAt,
  clientId: attempts.clientId,
};

function attemptQuery() {
  return db
    .select(viewColumns)
    .from(attempts)
    .innerJoin(procedureVersions, eq(procedureVersions.id, attempts.procedureVersionId))
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId));
}

export type RecordResult =
  | { kind: 'created' | 'replayed'; attempt: AttemptView }
  | { kind: 'unknown-procedure' }
  | { kind: 'invalid'; issues: Issue[] }
  | { kind: 'client-id-reused' };

/**
 * Scores the answer on the server against the stored version and keeps it. A clientId the learner
 * already used returns the stored attempt (a retried submit), never a second row. The insert goes
 * first and the stored row is read only on a conflict: the common case costs two queries.
 */
export async function recordAttempt(user: SessionUser, input: AttemptRequest): Promise<RecordResult> {
  const stored = await findVersion(db, input.procedure, input.version);
  if (!stored) return { kind: 'unknown-procedure' };
  const scored = scoreAttempt(stored.document, input.stage, input.answer);
  if (!scored.ok) return { kind: 'invalid', issues: scored.issues };

  const row = attemptRow(user.id, input, stored.id, scored.score);
  const [inserted] = await db
    .insert(attempts)
    .values(row)
    .onConflictDoNothing({ target: [attempts.userId, attempts.clientId] })
    .returning({ id: attempts.id, createdAt: attempts.createdAt });
  if (inserted) {
    // Missed steps go to the learner's rework queue; a fault there is logged and never loses the attempt.
    await recordMisses({ userId: user.id, attemptId: inserted.id, procedureVersionId: stored.id, document: stored.document, stage: input.stage, results: scored.score.results, at: inserted.createdAt });
    return { kind: 'created', attempt: createdAttempt(user.id, input, stored, scored.score, inserted) };
  }
  // This clientId was used before (a retry, or a race with one): answer with the stored row.
  const previous = await findByClientId(user.id, input.clientId);
  if (!previous) throw new Error('attempt conflict without a stored row');
  return sameSubmission(previous, input) ? { kind: 'replayed', attempt: previous } : { kind: 'client-id-reused' };
}

async function findByClientId(userId: string, clientId: string) {
  const [row] = await attemptQuery().where(and(eq(attempts.userId, userId), eq(attempts.clientId, clientId)));
  return row ?? null;
}

function sameSubmission(previous: AttemptView, input: AttemptRequest): boolean {
  return previous.procedure === input.procedure && previous.stage === input.stage && (input.version ?? previous.version) === previous.version;
}

/**
 * An attempt as its viewer may see it: the learner's own, any for an admin, or one by a learner
 * in a class the viewer teaches. Anyone else gets null (answered as 404, so ids leak nothing).
 */
export async function attemptForViewer(viewer: SessionUser, attemptId: string): Promise<AttemptView | null> {
  const [row] = await attemptQuery().where(eq(attempts.id, attemptId));
  if (!row) return null;
  if (row.learnerId === viewer.id || viewer.role === 'admin') return row;
  if (viewer.role !== 'instructor') return null;
  return (await teachesLearner(viewer.id, row.learnerId)) ? row : null;
}

async function teachesLearner(instructorId: string, learnerId: string): Promise<boolean> {
  const teacher = db
    .select({ classId: classMembers.classId })
    .from(classMembers)
    .where(and(eq(classMembers.userId, instructorId), eq(classMembers.role, 'instructor')));
  const [shared] = await db
    .select({ classId: classMembers.classId })
    .from(classMembers)
    .where(and(eq(classMembers.userId, learnerId), eq(classMembers.role, 'learner')))
    .intersect(teacher);
  return Boolean(shared);
}
