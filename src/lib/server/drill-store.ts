import { and, eq, inArray } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from '../../db/schema';
import type { DrillAttempt, DrillRules } from '../drills/progress';
import type { Stage } from '../procedure/schema';

// Drill reads that take their database as an argument, so the app and the `npm run remind` job share them.

export type Database = NodePgDatabase<typeof schema>;
const { attempts, classes, drills, procedures, procedureVersions } = schema;

/** The terms a drill was set with; every read of a drill needs them. */
export interface DrillTerms {
  stages: Stage[];
  dueAt: Date;
  passMarkPct: number;
  attemptLimit: number | null;
  answersAfterDue: boolean;
  closedAt: Date | null;
}

/** The columns of DrillTerms, for selects on `drills`. */
export const drillTermColumns = {
  stages: drills.stages,
  dueAt: drills.dueAt,
  passMarkPct: drills.passMarkPct,
  attemptLimit: drills.attemptLimit,
  answersAfterDue: drills.answersAfterDue,
  closedAt: drills.closedAt,
};

/** A drill with what every view of it needs: its class and its pinned procedure version. */
export interface DrillRecord extends DrillTerms {
  id: string;
  classId: string;
  className: string;
  procedureVersionId: string;
  slug: string;
  title: string;
  version: number;
  createdAt: Date;
  updatedAt: Date;
}

const drillColumns = {
  id: drills.id,
  classId: drills.classId,
  className: classes.name,
  procedureVersionId: drills.procedureVersionId,
  slug: procedures.slug,
  title: procedureVersions.title,
  version: procedureVersions.version,
  ...drillTermColumns,
  createdAt: drills.createdAt,
  updatedAt: drills.updatedAt,
};

/** Drills with their class and procedure; add a where clause. */
export function drillQuery(db: Database) {
  return db
    .select(drillColumns)
    .from(drills)
    .innerJoin(classes, eq(classes.id, drills.classId))
    .innerJoin(procedureVersions, eq(procedureVersions.id, drills.procedureVersionId))
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId));
}

export async function findDrill(db: Database, drillId: string): Promise<DrillRecord | null> {
  const [row] = await drillQuery(db).where(eq(drills.id, drillId));
  return row ?? null;
}

export function rulesOf(drill: Pick<DrillRecord, 'stages' | 'passMarkPct' | 'attemptLimit' | 'dueAt' | 'closedAt'>): DrillRules {
  return { stages: drill.stages, passMarkPct: drill.passMarkPct, attemptLimit: drill.attemptLimit, dueAt: drill.dueAt, closedAt: drill.closedAt };
}

/** Attempts made on the drills, grouped by drill and then by learner; optionally one learner's only. */
export async function drillAttempts(db: Database, drillIds: string[], userId?: string): Promise<Map<string, Map<string, DrillAttempt[]>>> {
  const grouped = new Map<string, Map<string, DrillAttempt[]>>();
  if (drillIds.length === 0) return grouped;
  const rows = await db
    .select({
      drillId: attempts.drillId,
      userId: attempts.userId,
      stage: attempts.stage,
      score: attempts.score,
      maxScore: attempts.maxScore,
      createdAt: attempts.createdAt,
    })
    .from(attempts)
    .where(userId ? and(inArray(attempts.drillId, drillIds), eq(attempts.userId, userId)) : inArray(attempts.drillId, drillIds));
  for (const { drillId, userId: learner, ...attempt } of rows) {
    const byLearner = grouped.get(drillId!) ?? new Map<string, DrillAttempt[]>();
    byLearner.set(learner, [...(byLearner.get(learner) ?? []), attempt]);
    grouped.set(drillId!, byLearner);
  }
  return grouped;
}
