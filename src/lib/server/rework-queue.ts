import { and, eq, inArray } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from '../../db/schema';
import type { Procedure, Stage } from '../procedure/schema';
import type { StepResult } from '../scoring/types';
import { missesOf, type MissKind } from '../rework/misses';
import { fromStored, newCard, refreshAfterMiss, toStored } from '../rework/schedule';

// The rework queue's writer, on any database handle: the app passes its own (rework.ts), the demo seed
// its script's, so the demo's misses are queued by the same code as a learner's.

const { reworkItems } = schema;
type Database = NodePgDatabase<typeof schema>;

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
export async function queueMisses(database: Database, attempt: MissedAttempt): Promise<void> {
  const misses = missesOf(attempt.document, attempt.stage, attempt.results);
  if (misses.length > 0) await upsertMisses(database, attempt, misses);
}

async function upsertMisses(database: Database, attempt: MissedAttempt, misses: { itemKey: string; missKind: MissKind }[]): Promise<void> {
  const { userId, procedureVersionId, stage, at, attemptId } = attempt;
  await database.transaction(async (tx) => {
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
