import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from '../../db/schema';
import type { Procedure, Stage } from '../procedure/schema';
import type { StepResult } from '../scoring/types';
import { hasFailedLines, missesOf, type Miss } from '../rework/misses';
import { fromStored, newCard, refreshAfterMiss, toStored } from '../rework/schedule';

// The rework queue's writer, on any database handle: the app passes its own (rework.ts), the demo seed
// its script's, so the demo's misses are queued by the same code as a learner's.

const { attempts, procedureVersions, reworkItems } = schema;
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
 * derived from attempts: a failure is logged, the attempt still answers 201 and stays marked pending until
 * queueLeftoverMisses queues it. Running it twice for one attempt counts the miss once.
 */
export async function queueMisses(database: Database, attempt: MissedAttempt): Promise<void> {
  let pending = missesOf(attempt.document, attempt.stage, attempt.results);
  for (let round = 0; pending.length > 0; round++) {
    if (round === MAX_ROUNDS) throw new Error(`rework items of attempt ${attempt.attemptId} kept changing under it: ${pending.map((m) => m.itemKey).join(', ')}`);
    pending = await queueRound(database, attempt, pending);
  }
  // Only an attempt stored with failed lines was marked (attemptRow); the others cost no statement here.
  if (hasFailedLines(attempt.results)) {
    await database.update(attempts).set({ reworkPending: false }).where(and(eq(attempts.id, attempt.attemptId), eq(attempts.reworkPending, true)));
  }
}

/**
 * Queues the misses of the learner's attempts still marked pending, oldest first: those whose queueing
 * failed after they were stored (a database fault) or is still under way (queueing twice counts once).
 * Called when the learner's rework is read, so no miss stays lost. At most `limit` attempts a call.
 */
export async function queueLeftoverMisses(database: Database, userId: string, limit = 50): Promise<number> {
  const left = await database
    .select({ id: attempts.id, versionId: attempts.procedureVersionId, document: procedureVersions.document, stage: attempts.stage, results: attempts.results, at: attempts.createdAt })
    .from(attempts)
    .innerJoin(procedureVersions, eq(procedureVersions.id, attempts.procedureVersionId))
    .where(and(eq(attempts.userId, userId), eq(attempts.reworkPending, true)))
    .orderBy(asc(attempts.createdAt))
    .limit(limit);
  for (const row of left) {
    await queueMisses(database, { userId, attemptId: row.id, procedureVersionId: row.versionId, document: row.document, stage: row.stage, results: row.results, at: row.at });
  }
  return left.length;
}

// Each round either lands a miss or sees another writer change its item; only that learner's own
// parallel submits or answers do, so a handful of rounds is plenty.
const MAX_ROUNDS = 8;

/**
 * One optimistic pass, without a transaction or row locks (which made a learner's parallel submits
 * queue up behind each other): read the learner's items for these steps, insert the missing ones and
 * refresh the others only where card and miss count are still as read. Returns the misses another
 * writer got in between, to try again.
 */
async function queueRound(database: Database, attempt: MissedAttempt, misses: Miss[]): Promise<Miss[]> {
  const { userId, procedureVersionId, stage, at, attemptId } = attempt;
  const existing = await database
    .select({ id: reworkItems.id, itemKey: reworkItems.itemKey, card: reworkItems.card, missCount: reworkItems.missCount, lastMissedAt: reworkItems.lastMissedAt })
    .from(reworkItems)
    .where(
      and(
        eq(reworkItems.userId, userId),
        eq(reworkItems.procedureVersionId, procedureVersionId),
        eq(reworkItems.stage, stage),
        inArray(reworkItems.itemKey, misses.map((m) => m.itemKey)),
      ),
    );
  const byKey = new Map(existing.map((row) => [row.itemKey, row] as const));
  const fresh = misses.filter((m) => !byKey.has(m.itemKey));
  // Already counted for this attempt (or a later one): leave it.
  const stale = misses.filter((m) => {
    const row = byKey.get(m.itemKey);
    return row !== undefined && row.lastMissedAt.getTime() < at.getTime();
  });

  const lost: Miss[] = [];
  if (fresh.length > 0) {
    const card = toStored(newCard(at));
    const inserted = await database
      .insert(reworkItems)
      .values(fresh.map((m) => ({ userId, procedureVersionId, stage, itemKey: m.itemKey, missKind: m.missKind, due: at, card, missCount: 1, lastMissedAt: at, sourceAttemptId: attemptId })))
      .onConflictDoNothing({ target: [reworkItems.userId, reworkItems.procedureVersionId, reworkItems.stage, reworkItems.itemKey] })
      .returning({ itemKey: reworkItems.itemKey });
    const landed = new Set(inserted.map((r) => r.itemKey));
    lost.push(...fresh.filter((m) => !landed.has(m.itemKey)));
  }
  if (stale.length > 0) {
    const changes = stale.map((m) => {
      const row = byKey.get(m.itemKey)!;
      const refreshed = refreshAfterMiss(fromStored(row.card), at);
      return { id: row.id, card: toStored(refreshed), due: refreshed.due.toISOString(), kind: m.missKind, old_card: row.card, old_count: row.missCount };
    });
    // One statement for every refresh; a row whose card or count moved since it was read is left alone.
    const updated = await database.execute<{ id: string }>(sql`
      update ${reworkItems} as r
      set card = v.card, due = v.due, miss_count = r.miss_count + 1, last_missed_at = ${at}, source_attempt_id = ${attemptId}, miss_kind = v.kind::miss_kind
      from jsonb_to_recordset(${JSON.stringify(changes)}::jsonb) as v(id uuid, card jsonb, due timestamptz, kind text, old_card jsonb, old_count integer)
      where r.id = v.id and r.card = v.old_card and r.miss_count = v.old_count
      returning r.id`);
    const landed = new Set(updated.rows.map((r) => r.id));
    lost.push(...stale.filter((m) => !landed.has(byKey.get(m.itemKey)!.id)));
  }
  return lost;
}
