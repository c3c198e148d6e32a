import { and, eq, sql } from 'drizzle-orm';
import { db } from './db';
import { attemptDrafts } from '../../db/schema';
import type { z } from 'zod';
import type { saveDraftSchema } from '../schemas/drafts';

// A learner's work in progress, one row per learner and procedure version. Only the session user's
// id ever reaches these functions, so a learner can read and write no one's drafts but their own.

export type SaveDraft = z.infer<typeof saveDraftSchema>;
export type Drafts = SaveDraft['drafts'];

export interface StoredDraft {
  drafts: Drafts;
  savedAt: Date;
}

export async function readDraft(userId: string, procedureVersionId: string): Promise<StoredDraft | null> {
  const [row] = await db
    .select({ drafts: attemptDrafts.drafts, savedAt: attemptDrafts.savedAt })
    .from(attemptDrafts)
    .where(and(eq(attemptDrafts.userId, userId), eq(attemptDrafts.procedureVersionId, procedureVersionId)));
  return row ?? null;
}

export type SaveDraftResult = { kind: 'stored' } | { kind: 'stale'; savedAt: Date };

/**
 * Keeps the copy unless the server already holds a newer one (last write wins by savedAt; an equal
 * savedAt is a retry and is stored again). One upsert decides it, so concurrent saves cannot interleave.
 */
export async function saveDraft(userId: string, procedureVersionId: string, input: SaveDraft): Promise<SaveDraftResult> {
  // A copy dated in the future counts as made now: one fast clock must not lock out the learner's other devices.
  const savedAt = sql`least(${new Date(input.savedAt).toISOString()}::timestamptz, now())`;
  const [stored] = await db
    .insert(attemptDrafts)
    .values({ userId, procedureVersionId, drafts: input.drafts, savedAt })
    .onConflictDoUpdate({
      target: [attemptDrafts.userId, attemptDrafts.procedureVersionId],
      set: { drafts: sql`excluded.drafts`, savedAt: sql`excluded.saved_at`, updatedAt: sql`now()` },
      setWhere: sql`${attemptDrafts.savedAt} <= excluded.saved_at`,
    })
    .returning({ savedAt: attemptDrafts.savedAt });
  if (stored) return { kind: 'stored' };
  const newer = await readDraft(userId, procedureVersionId);
  if (!newer) throw new Error('draft conflict without a stored row');
  return { kind: 'stale', savedAt: newer.savedAt };
}
