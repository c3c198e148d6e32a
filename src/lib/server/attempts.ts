import { and, eq } from 'drizzle-orm';
import { db, type Db } from './db';
import { attempts, procedures, procedureVersions } from '../../db/schema';
import { mayViewLearner } from './class-access';
import { attemptRow, createdAttempt, type AttemptView } from './attempt-row';
import { attemptsOnDrill, lockDrillForLearner, type DrillOutcome, type Tx } from './drill-attempts';
import { rulesOf } from './drill-store';
import { findVersion, type StoredVersion } from './procedure-store';
import { recordMisses } from './rework';
import { drillRefusal, type DrillRefusal } from '../drills/attempt-rules';
import { drillProgress, type DrillAttempt } from '../drills/progress';
import { scoreAttempt } from '../scoring';
import type { StageScore } from '../scoring/types';
import type { Issue } from '../procedure/validate';
import type { AttemptRequest } from '../schemas/attempts';
import type { SessionUser } from '../roles';

const viewColumns = {
  id: attempts.id,
  learnerId: attempts.userId,
  procedure: procedures.slug,
  version: procedureVersions.version,
  stage: attempts.stage,
  drillId: attempts.drillId,
  score: attempts.score,
  maxScore: attempts.maxScore,
  passed: attempts.passed,
  results: attempts.results,
  notes: attempts.notes,
  answer: attempts.answer,
  createdAt: attempts.createdAt,
  clientId: attempts.clientId,
};

function attemptQuery(exec: Db | Tx = db) {
  return exec
    .select(viewColumns)
    .from(attempts)
    .innerJoin(procedureVersions, eq(procedureVersions.id, attempts.procedureVersionId))
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId));
}

export type RecordResult =
  | { kind: 'created'; attempt: AttemptView; drill: DrillOutcome | null; version: StoredVersion }
  | { kind: 'replayed'; attempt: AttemptView; drill: DrillOutcome | null }
  | { kind: 'unknown-procedure' }
  | { kind: 'invalid'; issues: Issue[] }
  | { kind: 'client-id-reused' }
  | { kind: 'drill-not-found' }
  | { kind: 'drill-refused'; refusal: DrillRefusal };

type Stored = Extract<RecordResult, { kind: 'created' | 'replayed' | 'client-id-reused' }>;

/**
 * Scores the answer on the server against the stored version and keeps it. A clientId the learner
 * already used returns the stored attempt (a retried submit), never a second row. The insert goes
 * first and the stored row is read only on a conflict: the common case costs two queries.
 */
export async function recordAttempt(user: SessionUser, input: AttemptRequest): Promise<RecordResult> {
  const drillId = input.drillId;
  const result = drillId ? await db.transaction((tx) => recordOnDrill(tx, user, input, drillId)) : await recordPractice(user, input);
  if (result.kind === 'created') {
    // After the commit, so the queue's rows can refer to the stored attempt; a fault there is logged and never loses it.
    const { attempt, version } = result;
    await recordMisses({ userId: user.id, attemptId: attempt.id, procedureVersionId: version.id, document: version.document, stage: input.stage, results: attempt.results, at: attempt.createdAt });
  }
  return result;
}

async function recordPractice(user: SessionUser, input: AttemptRequest): Promise<RecordResult> {
  const stored = await findVersion(db, input.procedure, input.version);
  if (!stored) return { kind: 'unknown-procedure' };
  const scored = scoreAttempt(stored.document, input.stage, input.answer);
  if (!scored.ok) return { kind: 'invalid', issues: scored.issues };
  return storeAttempt(db, user, input, stored, scored.score);
}

async function storeAttempt(exec: Db | Tx, user: SessionUser, input: AttemptRequest, stored: StoredVersion, score: StageScore): Promise<Stored> {
  const row = attemptRow(user.id, input, stored.id, score);
  const [inserted] = await exec
    .insert(attempts)
    .values(row)
    .onConflictDoNothing({ target: [attempts.userId, attempts.clientId] })
    .returning({ id: attempts.id, createdAt: attempts.createdAt });
  if (inserted) return { kind: 'created', attempt: createdAttempt(user.id, input, stored, score, inserted), drill: null, version: stored };
  // This clientId was used before (a retry, or a race with one): answer with the stored row.
  const previous = await findByClientId(exec, user.id, input.clientId);
  if (!previous) throw new Error('attempt conflict without a stored row');
  return sameSubmission(previous, input) ? { kind: 'replayed', attempt: previous, drill: null } : { kind: 'client-id-reused' };
}

/**
 * An attempt on a drill, in one transaction: the learner must be in the drill's class, a retried submit
 * gets its stored attempt back (even once the drill is closed or the limit reached), and otherwise the
 * drill must be open, ask for this stage of its pinned version and have attempts left on it. The locks
 * taken by lockDrillForLearner make the count and the insert one step for this learner.
 */
async function recordOnDrill(tx: Tx, user: SessionUser, input: AttemptRequest, drillId: string): Promise<RecordResult> {
  const drill = await lockDrillForLearner(tx, drillId, user.id);
  if (!drill) return { kind: 'drill-not-found' };
  const now = new Date();
  const earlier = await attemptsOnDrill(tx, drillId, user.id);
  const outcome = (made: DrillAttempt[]): DrillOutcome => ({
    id: drill.id,
    answersAfterDue: drill.answersAfterDue,
    dueAt: drill.dueAt,
    progress: drillProgress(rulesOf(drill), made, now),
  });

  const previous = await findByClientId(tx, user.id, input.clientId);
  if (previous) return sameSubmission(previous, input) ? { kind: 'replayed', attempt: previous, drill: outcome(earlier) } : { kind: 'client-id-reused' };

  const refusal = drillRefusal(drill, input, earlier.filter((a) => a.stage === input.stage).length, now);
  if (refusal) return { kind: 'drill-refused', refusal };
  const scored = scoreAttempt(drill.pinned.document, input.stage, input.answer);
  if (!scored.ok) return { kind: 'invalid', issues: scored.issues };
  const stored = await storeAttempt(tx, user, input, drill.pinned, scored.score);
  if (stored.kind !== 'created') return stored.kind === 'replayed' ? { ...stored, drill: outcome(earlier) } : stored;
  const made = { stage: input.stage, score: stored.attempt.score, maxScore: stored.attempt.maxScore, createdAt: stored.attempt.createdAt };
  return { ...stored, drill: outcome([...earlier, made]) };
}

async function findByClientId(exec: Db | Tx, userId: string, clientId: string) {
  const [row] = await attemptQuery(exec).where(and(eq(attempts.userId, userId), eq(attempts.clientId, clientId)));
  return row ?? null;
}

function sameSubmission(previous: AttemptView, input: AttemptRequest): boolean {
  return (
    previous.procedure === input.procedure &&
    previous.stage === input.stage &&
    (input.version ?? previous.version) === previous.version &&
    previous.drillId === (input.drillId ?? null)
  );
}

/**
 * An attempt as its viewer may see it: the learner's own, any for an admin, or one by a learner
 * in a class the viewer teaches. Anyone else gets null (answered as 404, so ids leak nothing).
 */
export async function attemptForViewer(viewer: SessionUser, attemptId: string): Promise<AttemptView | null> {
  const [row] = await attemptQuery().where(eq(attempts.id, attemptId));
  if (!row) return null;
  return row.learnerId === viewer.id || (await mayViewLearner(viewer, row.learnerId)) ? row : null;
}

// Uploads ask the same question of a photo's owner.
export { teachesLearner } from './classes';
