import { and, eq, inArray } from 'drizzle-orm';
import { db } from './db';
import { drills, procedureVersions } from '../../db/schema';
import { drillProgress, type DrillProgress } from '../drills/progress';
import { STAGE_LABELS } from '../../components/trainer/labels';
import type { Stage } from '../procedure/schema';
import type { SessionUser } from '../roles';
import { dueAtChangeError, type CreateDrillInput, type UpdateDrillInput } from '../schemas/drills';
import { drillAttempts, drillQuery, findDrill, rulesOf, type DrillRecord } from './drill-store';
import { emptyCounts, type StatusCounts } from './drill-json';
import { classAccess } from './class-access';
import { classIdsOf, learnersOf } from './class-members';
import { isClassLearner } from './classes';
import { findVersion } from './procedure-store';

// Drills: an instructor assigns one procedure version to a class; learners see how they stand on it.

export type FieldProblem = { ok: false; error: string; fields: Record<string, string[]> };
const problem = (field: string, error: string): FieldProblem => ({ ok: false, error, fields: { [field]: [error] } });

function missingStages(asked: readonly Stage[], offered: readonly Stage[], slug: string): string | null {
  const missing = asked.filter((s) => !offered.includes(s));
  if (missing.length === 0) return null;
  return `${slug} has no ${missing.map((s) => STAGE_LABELS[s]).join(' or ')} stage; it offers ${offered.map((s) => STAGE_LABELS[s]).join(', ')}`;
}

/** Pins the procedure version (the latest published one unless a version is given) and stores the drill. */
export async function createDrill(classId: string, createdBy: string, input: CreateDrillInput): Promise<{ ok: true; drill: DrillRecord } | FieldProblem> {
  const version = await findVersion(db, input.procedure, input.version);
  if (!version) {
    return input.version === undefined
      ? problem('procedure', `No published procedure "${input.procedure}"`)
      : problem('version', `${input.procedure} has no version ${input.version}`);
  }
  const stagesProblem = missingStages(input.stages, version.document.stages, version.slug);
  if (stagesProblem) return problem('stages', stagesProblem);
  const [row] = await db
    .insert(drills)
    .values({
      classId,
      procedureVersionId: version.id,
      stages: input.stages,
      dueAt: input.dueAt,
      passMarkPct: input.passMarkPct,
      attemptLimit: input.attemptLimit,
      answersAfterDue: input.answersAfterDue,
      createdBy,
    })
    .returning({ id: drills.id });
  return { ok: true, drill: (await findDrill(db, row!.id))! };
}

export type UpdateResult = { ok: true; drill: DrillRecord } | FieldProblem | { ok: false; notFound: true };

/** Edits, closes (attempts stay) or reopens a drill; only its class's instructors and admins may. */
export async function updateDrill(drillId: string, user: SessionUser, change: UpdateDrillInput, now: Date): Promise<UpdateResult> {
  const drill = await findDrill(db, drillId);
  if (!drill || (await classAccess(drill.classId, user)) !== 'manage') return { ok: false, notFound: true };
  if (change.stages) {
    const [pinned] = await db.select({ document: procedureVersions.document }).from(procedureVersions).where(eq(procedureVersions.id, drill.procedureVersionId));
    const stagesProblem = missingStages(change.stages, pinned!.document.stages, drill.slug);
    if (stagesProblem) return problem('stages', stagesProblem);
  }
  const dueProblem = dueAtChangeError(change.dueAt, drill.dueAt, now);
  if (dueProblem) return problem('dueAt', dueProblem);

  const { closed, ...fields } = change;
  // Closing twice keeps the first closing time.
  const closedAt = closed === undefined ? undefined : closed ? (drill.closedAt ?? now) : null;
  await db
    .update(drills)
    .set({ ...fields, ...(closedAt !== undefined ? { closedAt } : {}), updatedAt: now })
    .where(eq(drills.id, drillId));
  return { ok: true, drill: (await findDrill(db, drillId))! };
}

/** Open drills first, soonest due first; closed ones after them. */
function byDue(a: DrillRecord, b: DrillRecord): number {
  if ((a.closedAt === null) !== (b.closedAt === null)) return a.closedAt === null ? -1 : 1;
  return a.dueAt.getTime() - b.dueAt.getTime();
}

export interface ClassDrill extends DrillRecord {
  learners: number;
  counts: StatusCounts;
}

/** A class's drills with how many of its learners stand where on each, for its instructors. */
export async function drillsOfClass(classId: string, now: Date): Promise<ClassDrill[]> {
  return countStatuses(classId, (await drillQuery(db).where(eq(drills.classId, classId))).sort(byDue), now);
}

/** One drill with its class's counts (after a create or an edit). */
export async function withClassCounts(drill: DrillRecord, now: Date): Promise<ClassDrill> {
  const [counted] = await countStatuses(drill.classId, [drill], now);
  return counted!;
}

async function countStatuses(classId: string, list: DrillRecord[], now: Date): Promise<ClassDrill[]> {
  const learners = await learnersOf(db, classId);
  const attempts = await drillAttempts(db, list.map((d) => d.id));
  return list.map((drill) => {
    const counts = emptyCounts();
    for (const learner of learners) {
      const made = attempts.get(drill.id)?.get(learner.id) ?? [];
      counts[drillProgress(rulesOf(drill), made, now).status] += 1;
    }
    return { ...drill, learners: learners.length, counts };
  });
}

export interface LearnerDrill extends DrillRecord {
  progress: DrillProgress;
}

/** A learner's drills with their standing on each: every class they are in, or one class. */
export async function drillsOfLearner(userId: string, now: Date, classId?: string): Promise<LearnerDrill[]> {
  const inClasses = inArray(drills.classId, classIdsOf(db, userId, 'learner'));
  const list = (await drillQuery(db).where(classId ? and(inClasses, eq(drills.classId, classId)) : inClasses)).sort(byDue);
  const attempts = await drillAttempts(db, list.map((d) => d.id), userId);
  return list.map((drill) => ({ ...drill, progress: drillProgress(rulesOf(drill), attempts.get(drill.id)?.get(userId) ?? [], now) }));
}

/** One drill with the learner's standing, when the learner is in its class; null otherwise. */
export async function drillForLearner(drillId: string, userId: string, now: Date): Promise<LearnerDrill | null> {
  const drill = await findDrill(db, drillId);
  if (!drill || !(await isClassLearner(drill.classId, userId))) return null;
  const attempts = await drillAttempts(db, [drill.id], userId);
  return { ...drill, progress: drillProgress(rulesOf(drill), attempts.get(drill.id)?.get(userId) ?? [], now) };
}
