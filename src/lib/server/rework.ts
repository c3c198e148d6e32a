import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import { db } from './db';
import { procedures, procedureVersions, reworkItems } from '../../db/schema';
import type { Procedure, Stage } from '../procedure/schema';
import type { StepResult } from '../scoring/types';
import { missesOf, type MissKind } from '../rework/misses';
import { buildQuestion, type Question } from '../rework/questions';
import { fromStored, newCard, refreshAfterMiss, toStored } from '../rework/schedule';
import { variantFor } from '../rework/variant';
import { itemLabel, MISS_WORDS } from '../rework/labels';

// Rework items: the steps a learner missed, kept on a spaced schedule. Misses come in from scored
// attempts; the list is what GET /api/me/rework answers.

export interface MissedAttempt {
  userId: string;
  attemptId: string;
  procedureVersionId: string;
  document: Procedure;
  stage: Stage;
  results: StepResult[];
  /** When the attempt was stored: a miss is counted once per attempt. */
  at: Date;
}

/**
 * Queues every step the attempt missed: a new item, or a refresh of the learner's item for that step
 * (one more miss, back on the schedule soon). Runs after the attempt row is stored and outside its
 * insert: the attempt is the learner's record and must never be lost to a fault here, while the queue is
 * derived from attempts and can be rebuilt, so a failure is logged and the attempt still answers 201.
 * Running it twice for one attempt counts the miss once.
 */
export async function recordMisses(attempt: MissedAttempt): Promise<void> {
  try {
    const misses = missesOf(attempt.document, attempt.stage, attempt.results);
    if (misses.length > 0) await upsertMisses(attempt, misses);
  } catch (error) {
    console.error(`rework: misses of attempt ${attempt.attemptId} were not queued`, error);
  }
}

async function upsertMisses(attempt: MissedAttempt, misses: { itemKey: string; missKind: MissKind }[]): Promise<void> {
  const { userId, procedureVersionId, stage, at, attemptId } = attempt;
  await db.transaction(async (tx) => {
    const card = toStored(newCard(at));
    const inserted = await tx
      .insert(reworkItems)
      .values(
        misses.map((m) => ({
          userId, procedureVersionId, stage, itemKey: m.itemKey, missKind: m.missKind,
          due: at, card, missCount: 1, lastMissedAt: at, sourceAttemptId: attemptId,
        })),
      )
      .onConflictDoNothing({ target: [reworkItems.userId, reworkItems.procedureVersionId, reworkItems.stage, reworkItems.itemKey] })
      .returning({ itemKey: reworkItems.itemKey });
    const fresh = new Set(inserted.map((r) => r.itemKey));
    const known = misses.filter((m) => !fresh.has(m.itemKey));
    if (known.length === 0) return;

    // The learner already had these items: lock them, then refresh each one's schedule.
    const rows = await tx
      .select({ id: reworkItems.id, itemKey: reworkItems.itemKey, card: reworkItems.card, missCount: reworkItems.missCount, lastMissedAt: reworkItems.lastMissedAt })
      .from(reworkItems)
      .where(
        and(
          eq(reworkItems.userId, userId),
          eq(reworkItems.procedureVersionId, procedureVersionId),
          eq(reworkItems.stage, stage),
          inArray(reworkItems.itemKey, known.map((m) => m.itemKey)),
        ),
      )
      .for('update');
    for (const row of rows) {
      // Already counted for this attempt (or a later one): leave it.
      if (row.lastMissedAt.getTime() >= at.getTime()) continue;
      const refreshed = refreshAfterMiss(fromStored(row.card), at);
      const kind = known.find((m) => m.itemKey === row.itemKey)!.missKind;
      await tx
        .update(reworkItems)
        .set({ card: toStored(refreshed), due: refreshed.due, missCount: row.missCount + 1, lastMissedAt: at, sourceAttemptId: attemptId, missKind: kind })
        .where(eq(reworkItems.id, row.id));
    }
  });
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
  const [row] = await db
    .select({
      due: sql<number>`count(*) filter (where ${reworkItems.due} <= ${now})::int`,
      total: sql<number>`count(*)::int`,
    })
    .from(reworkItems)
    .where(eq(reworkItems.userId, userId));
  return { due: row?.due ?? 0, total: row?.total ?? 0 };
}
