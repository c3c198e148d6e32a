import { asc, eq, inArray, sql } from 'drizzle-orm';
import { db } from './db';
import { procedures, procedureVersions, reworkItems } from '../../db/schema';
import type { Procedure, Stage } from '../procedure/schema';
import type { MissKind } from '../rework/misses';
import { buildQuestion, type Question } from '../rework/questions';
import { fromStored } from '../rework/schedule';
import { variantFor } from '../rework/variant';
import { itemLabel, MISS_WORDS } from '../rework/labels';
import { queueLeftoverMisses, queueMisses, type MissedAttempt } from './rework-queue';

// Rework items: the steps a learner missed, kept on a spaced schedule. Misses come in from scored
// attempts; the list is what GET /api/me/rework answers.

export type { MissedAttempt } from './rework-queue';

/**
 * Queues the attempt's misses (see queueMisses); a fault is logged and the attempt still answers 201.
 * The attempt stays marked pending, so the learner's next look at their rework queues it (catchUpMisses).
 */
export async function recordMisses(attempt: MissedAttempt): Promise<void> {
  try {
    await queueMisses(db, attempt);
  } catch (error) {
    console.error(`rework: misses of attempt ${attempt.attemptId} were not queued; they will be on the learner's next visit`, error);
  }
}

/** Before the learner's items are read: queue what a fault left pending. A failure here only logs; the page shows what is stored. */
export async function catchUpMisses(userId: string): Promise<void> {
  try {
    await queueLeftoverMisses(db, userId);
  } catch (error) {
    console.error(`rework: left-over misses of learner ${userId} could not be queued`, error);
  }
}

export interface ReworkItemView {
  id: string;
  procedure: { slug: string; title: string; version: number };
  stage: Stage;
  itemKey: string;
  missKind: MissKind;
  due: Date;
  missCount: number;
  lastMissedAt: Date;
  /** Answers given so far (reviews of the schedule, refreshes after a miss included). */
  reviews: number;
  /** What was missed, in words (a step's text, a hole, a pass …). */
  label: string;
  missWords: string;
  /** The question to ask now; only items already due carry one. */
  question: Question | null;
}

/** The learner's items, soonest first: due now (with their questions) and coming later. */
export async function reworkFor(userId: string, now: Date): Promise<{ due: ReworkItemView[]; upcoming: ReworkItemView[] }> {
  await catchUpMisses(userId);
  const rows = await db
    .select({
      id: reworkItems.id,
      slug: procedures.slug,
      title: procedureVersions.title,
      version: procedureVersions.version,
      versionId: procedureVersions.id,
      stage: reworkItems.stage,
      itemKey: reworkItems.itemKey,
      missKind: reworkItems.missKind,
      due: reworkItems.due,
      card: reworkItems.card,
      missCount: reworkItems.missCount,
      lastMissedAt: reworkItems.lastMissedAt,
    })
    .from(reworkItems)
    .innerJoin(procedureVersions, eq(procedureVersions.id, reworkItems.procedureVersionId))
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .where(eq(reworkItems.userId, userId))
    .orderBy(asc(reworkItems.due), asc(reworkItems.createdAt), asc(reworkItems.stage), asc(reworkItems.itemKey));

  // Each version's document once, however many items point at it.
  const needed = [...new Set(rows.map((r) => r.versionId))];
  const documents = new Map<string, Procedure>();
  if (needed.length > 0) {
    const docs = await db
      .select({ id: procedureVersions.id, document: procedureVersions.document })
      .from(procedureVersions)
      .where(inArray(procedureVersions.id, needed));
    for (const d of docs) documents.set(d.id, d.document);
  }

  const due: ReworkItemView[] = [];
  const upcoming: ReworkItemView[] = [];
  for (const row of rows) {
    const reviews = fromStored(row.card).reps;
    const isDue = row.due.getTime() <= now.getTime();
    const document = documents.get(row.versionId)!;
    const view: ReworkItemView = {
      id: row.id,
      procedure: { slug: row.slug, title: row.title, version: row.version },
      stage: row.stage,
      itemKey: row.itemKey,
      missKind: row.missKind,
      due: row.due,
      missCount: row.missCount,
      lastMissedAt: row.lastMissedAt,
      reviews,
      label: itemLabel(document, row.stage, row.itemKey),
      missWords: MISS_WORDS[row.missKind],
      question: isDue ? buildQuestion(document, row.stage, row.itemKey, variantFor(row.id, reviews)) : null,
    };
    (isDue ? due : upcoming).push(view);
  }
  return { due, upcoming };
}

/** How many of the learner's items are due now and how many in all (the /learn card). */
export async function reworkCounts(userId: string, now: Date): Promise<{ due: number; total: number }> {
  await catchUpMisses(userId);
  const [row] = await db
    .select({
      due: sql<number>`count(*) filter (where ${reworkItems.due} <= ${now})::int`,
      total: sql<number>`count(*)::int`,
    })
    .from(reworkItems)
    .where(eq(reworkItems.userId, userId));
  return { due: row?.due ?? 0, total: row?.total ?? 0 };
}
