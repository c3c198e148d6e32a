import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import { db } from './db';
import { attempts, classes, drills, procedures, procedureVersions, signOffs, users } from '../../db/schema';
import { mayRunClass, staffClass, type StaffRefusal } from './class-access';
import { learnersOf } from './class-members';
import { attemptForViewer } from './attempts';
import type { AttemptView } from './attempt-row';
import { jsonError } from './http';
import { buildClassResults, type ClassResults } from '../results/class-results';
import type { GroupSplit } from '../results/item-analysis';
import type { SessionUser } from '../roles';
import type { Procedure, Stage } from '../procedure/schema';

// Queries behind the class results (JSON, CSV and page) and the attempt review; the rules live in
// lib/results, this file only gathers rows.

export type ResultsAccess = { ok: true; classId: string; className: string } | { ok: false; status: 400 | 403 | 404 };

const REFUSALS: Record<StaffRefusal, 400 | 403 | 404> = { 'malformed-id': 400, 'no-class': 404, 'not-staff': 403, 'not-taught': 403 };

/** Who may see a class's results: its instructors and admins. A malformed id is 400, an unknown one 404. */
export async function resultsAccess(user: SessionUser, rawId: string | undefined): Promise<ResultsAccess> {
  const access = await staffClass(user, rawId);
  if (!access.ok) return { ok: false, status: REFUSALS[access.why] };
  return { ok: true, classId: access.cls.id, className: access.cls.name };
}

const ACCESS_ERRORS = {
  400: 'The class id is not a valid id',
  403: 'Only the instructors of this class can see its results',
  404: 'No such class',
} as const;

export const resultsAccessError = (status: 400 | 403 | 404) => jsonError(status, ACCESS_ERRORS[status]);

/** Everything the results need for one class, read in six queries. */
export async function classResults(classId: string, groups: GroupSplit, now = new Date()): Promise<ClassResults | null> {
  const [cls] = await db.select({ id: classes.id, name: classes.name }).from(classes).where(eq(classes.id, classId));
  if (!cls) return null;

  const learners = await learnersOf(db, classId);

  const drillRows = await db
    .select({
      id: drills.id,
      procedureId: procedures.id,
      slug: procedures.slug,
      title: procedureVersions.title,
      version: procedureVersions.version,
      document: procedureVersions.document,
      stages: drills.stages,
      dueAt: drills.dueAt,
      passMarkPct: drills.passMarkPct,
      attemptLimit: drills.attemptLimit,
      closedAt: drills.closedAt,
    })
    .from(drills)
    .innerJoin(procedureVersions, eq(procedureVersions.id, drills.procedureVersionId))
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .where(eq(drills.classId, classId))
    .orderBy(asc(drills.dueAt), asc(drills.createdAt), asc(drills.id));

  const learnerIds = learners.map((l) => l.id);
  const drillIds = drillRows.map((d) => d.id);
  const attemptRows =
    learnerIds.length && drillIds.length
      ? await db
          .select({
            id: attempts.id,
            userId: attempts.userId,
            drillId: attempts.drillId,
            stage: attempts.stage,
            score: attempts.score,
            maxScore: attempts.maxScore,
            results: attempts.results,
            createdAt: attempts.createdAt,
          })
          .from(attempts)
          .where(and(inArray(attempts.drillId, drillIds), inArray(attempts.userId, learnerIds)))
      : [];

  const signOffRows = await db
    .select({
      learnerId: signOffs.learnerId,
      procedureId: signOffs.procedureId,
      benchDate: signOffs.benchDate,
      outcome: signOffs.outcome,
      notes: signOffs.notes,
      createdAt: signOffs.createdAt,
    })
    .from(signOffs)
    .where(eq(signOffs.classId, classId));

  const procedureIds = [...new Set([...drillRows.map((d) => d.procedureId), ...signOffRows.map((s) => s.procedureId)])];
  const titles = procedureIds.length
    ? await db
        .select({ id: procedures.id, slug: procedures.slug, title: procedureVersions.title })
        .from(procedureVersions)
        .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
        .where(inArray(procedures.id, procedureIds))
        .orderBy(asc(procedures.id), desc(procedureVersions.version))
    : [];
  // Rows come newest version first per procedure: the first one seen is the current title.
  const latest = new Map<string, { id: string; slug: string; title: string }>();
  for (const row of titles) if (!latest.has(row.id)) latest.set(row.id, row);

  return buildClassResults({
    classInfo: cls,
    learners,
    drills: drillRows,
    attempts: attemptRows.map((a) => ({ ...a, drillId: a.drillId! })),
    signOffs: signOffRows,
    procedures: [...latest.values()],
    now,
    groups,
  });
}

export interface ReviewedAttempt extends Pick<AttemptView, 'id' | 'score' | 'maxScore' | 'passed' | 'results' | 'notes' | 'answer' | 'createdAt'> {
  learner: { id: string; name: string };
  procedure: { slug: string; version: number; title: string; document: Procedure };
  stage: Stage;
  /** The drill the attempt counted toward, with its class, when the viewer may see that class's results. */
  drill: { id: string; classId: string; className: string } | null;
  /** The learner's attempts on the same stage (of the same drill, or of no drill), oldest first. */
  siblings: { id: string; createdAt: Date; score: number; maxScore: number }[];
}

/**
 * An attempt for the review page: only what attemptForViewer lets the viewer see (the learner's
 * instructors and admins here), with the learner's name, the procedure document and the attempt's siblings.
 */
export async function attemptForReview(viewer: SessionUser, attemptId: string): Promise<ReviewedAttempt | null> {
  const visible = await attemptForViewer(viewer, attemptId);
  if (!visible) return null;
  const [row] = await db
    .select({
      learnerName: users.name,
      drillId: attempts.drillId,
      procedureVersionId: attempts.procedureVersionId,
      title: procedureVersions.title,
      document: procedureVersions.document,
      classId: drills.classId,
      className: classes.name,
    })
    .from(attempts)
    .innerJoin(users, eq(users.id, attempts.userId))
    .innerJoin(procedureVersions, eq(procedureVersions.id, attempts.procedureVersionId))
    .leftJoin(drills, eq(drills.id, attempts.drillId))
    .leftJoin(classes, eq(classes.id, drills.classId))
    .where(eq(attempts.id, attemptId));
  if (!row) return null;

  const sameDrill = row.drillId ? eq(attempts.drillId, row.drillId) : eq(attempts.procedureVersionId, row.procedureVersionId);
  const siblings = await db
    .select({ id: attempts.id, createdAt: attempts.createdAt, score: attempts.score, maxScore: attempts.maxScore, drillId: attempts.drillId })
    .from(attempts)
    .where(and(eq(attempts.userId, visible.learnerId), eq(attempts.stage, visible.stage as Stage), sameDrill))
    .orderBy(asc(attempts.createdAt), asc(attempts.id));

  let drill: ReviewedAttempt['drill'] = null;
  if (row.drillId && row.classId && row.className) {
    const mayLink = await mayRunClass(viewer, row.classId);
    if (mayLink) drill = { id: row.drillId, classId: row.classId, className: row.className };
  }

  return {
    id: visible.id,
    learner: { id: visible.learnerId, name: row.learnerName },
    procedure: { slug: visible.procedure, version: visible.version, title: row.title, document: row.document },
    stage: visible.stage as Stage,
    score: visible.score,
    maxScore: visible.maxScore,
    passed: visible.passed,
    results: visible.results,
    notes: visible.notes,
    answer: visible.answer,
    createdAt: visible.createdAt,
    drill,
    siblings: siblings.filter((s) => (row.drillId ? true : s.drillId === null)).map(({ drillId: _, ...s }) => s),
  };
}
