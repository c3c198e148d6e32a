import { and, eq } from 'drizzle-orm';
import { db, type Db } from './db';
import { attempts, drills, procedures, procedureVersions } from '../../db/schema';
import { answersHidden } from '../drills/answers';
import type { DrillAttempt, DrillProgress } from '../drills/progress';
import type { SessionUser } from '../roles';
import { membership } from './class-members';
import { drillTermColumns, findDrill, type DrillTerms } from './drill-store';
import type { StoredVersion } from './procedure-store';

// The database side of attempts made on a drill: the locks that keep the attempt limit, the learner's
// earlier attempts, and whether the viewer of an attempt may see its answers yet.

export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** A drill as an attempt on it needs it, with the pinned version to score against. */
export interface LockedDrill extends DrillTerms {
  id: string;
  slug: string;
  version: number;
  pinned: StoredVersion;
}

/** What the endpoint tells the learner about the drill along with the attempt. */
export interface DrillOutcome {
  id: string;
  answersAfterDue: boolean;
  dueAt: Date;
  progress: DrillProgress;
}

/**
 * The drill, if the user is a learner in its class, else null (answered as 404: drill ids leak nothing).
 * Locks: the drill row FOR SHARE, so it cannot be closed or edited halfway through a submit, and the
 * learner's membership row FOR UPDATE, so two submits by one learner run one after the other and the
 * second one counts the first before the attempt limit is checked. Other learners are not held up.
 */
export async function lockDrillForLearner(tx: Tx, drillId: string, userId: string): Promise<LockedDrill | null> {
  const [drill] = await tx
    .select({
      id: drills.id,
      classId: drills.classId,
      ...drillTermColumns,
      versionId: procedureVersions.id,
      procedureId: procedureVersions.procedureId,
      slug: procedures.slug,
      version: procedureVersions.version,
      document: procedureVersions.document,
      checksum: procedureVersions.checksum,
    })
    .from(drills)
    .innerJoin(procedureVersions, eq(procedureVersions.id, drills.procedureVersionId))
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .where(eq(drills.id, drillId))
    .for('share', { of: drills });
  if (!drill) return null;
  const [member] = await membership(tx, drill.classId, userId, 'learner').for('update');
  if (!member) return null;
  const { versionId, procedureId, document, checksum, classId: _class, ...rules } = drill;
  return { ...rules, pinned: { id: versionId, procedureId, slug: drill.slug, version: drill.version, document, checksum } };
}

/** The learner's attempts on the drill so far. */
export async function attemptsOnDrill(tx: Tx, drillId: string, userId: string): Promise<DrillAttempt[]> {
  return tx
    .select({ stage: attempts.stage, score: attempts.score, maxScore: attempts.maxScore, createdAt: attempts.createdAt })
    .from(attempts)
    .where(and(eq(attempts.drillId, drillId), eq(attempts.userId, userId)));
}

/**
 * Whether an attempt is shown to this viewer without its answers: only to the learner who made it, on
 * a drill that keeps answers until its due date, before that date. Instructors and admins see everything.
 */
export async function answersHiddenFor(viewer: SessionUser, attempt: { learnerId: string; drillId: string | null }, now: Date): Promise<boolean> {
  if (attempt.drillId === null || attempt.learnerId !== viewer.id) return false;
  const drill = await findDrill(db, attempt.drillId);
  return drill !== null && answersHidden(drill, now);
}
