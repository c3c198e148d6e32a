import { randomUUID } from 'node:crypto';
import { and, count, desc, eq, inArray, sql } from 'drizzle-orm';
import { fileTypeFromBuffer } from 'file-type';
import { procedures, signOffPhotos, uploads } from '../../db/schema';
import type { SessionUser } from '../roles';
import { detectedType, type DetectedType } from '../uploads/check';
import type { BenchPhotoJson } from '../uploads/views';
import { teachesLearner } from './attempts';
import { db } from './db';
import { storage } from './storage';

export interface UploadView {
  id: string;
  ownerId: string;
  originalName: string;
  contentType: string;
  sizeBytes: number;
  createdAt: Date;
  /** The procedure's slug (bench photos always have one). */
  procedure: string | null;
  /** True once an instructor attached it to a sign-off; it can no longer be deleted. */
  attached: boolean;
}

/** What the JSON API shows of an upload (the storage key never leaves the server). */
export function uploadJson(u: UploadView): BenchPhotoJson {
  return {
    id: u.id,
    originalName: u.originalName,
    contentType: u.contentType,
    sizeBytes: u.sizeBytes,
    createdAt: u.createdAt.toISOString(),
    procedure: u.procedure,
    attached: u.attached,
  };
}

const attached = sql<boolean>`exists (select 1 from ${signOffPhotos} where ${signOffPhotos.uploadId} = ${uploads.id})`;

const viewColumns = {
  id: uploads.id,
  ownerId: uploads.ownerId,
  originalName: uploads.originalName,
  contentType: uploads.contentType,
  sizeBytes: uploads.sizeBytes,
  createdAt: uploads.createdAt,
  procedure: procedures.slug,
  attached,
};

/** The file's real type from its bytes: file-type's magic numbers first, then a look for text. */
export async function detectType(bytes: Uint8Array): Promise<DetectedType | null> {
  return detectedType(await fileTypeFromBuffer(bytes), bytes);
}

/**
 * Stores checked bytes under a random key (never the learner's file name) and records them.
 * The object is written first; should the row fail, the object is removed again.
 */
export async function saveBenchPhoto(
  ownerId: string,
  procedure: { id: string; slug: string },
  bytes: Uint8Array,
  contentType: string,
  originalName: string,
): Promise<UploadView> {
  const storageKey = `bench-photos/${randomUUID()}`;
  await storage.put(storageKey, bytes, contentType);
  try {
    const [row] = await db
      .insert(uploads)
      .values({ ownerId, purpose: 'bench-photo', procedureId: procedure.id, storageKey, contentType, sizeBytes: bytes.byteLength, originalName })
      .returning({ id: uploads.id, createdAt: uploads.createdAt });
    return { id: row!.id, ownerId, originalName, contentType, sizeBytes: bytes.byteLength, createdAt: row!.createdAt, procedure: procedure.slug, attached: false };
  } catch (err) {
    await storage.remove(storageKey).catch(() => undefined);
    throw err;
  }
}

/** How many bench photos a learner keeps of one procedure (each learner has a cap per procedure). */
export async function countBenchPhotos(ownerId: string, procedureId: string): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(uploads)
    .where(and(eq(uploads.ownerId, ownerId), eq(uploads.purpose, 'bench-photo'), eq(uploads.procedureId, procedureId)));
  return row?.n ?? 0;
}

/** A learner's bench photos, newest first; of one procedure when procedureId is given. */
export async function listBenchPhotos(ownerId: string, procedureId?: string): Promise<UploadView[]> {
  return db
    .select(viewColumns)
    .from(uploads)
    .leftJoin(procedures, eq(procedures.id, uploads.procedureId))
    .where(
      and(
        eq(uploads.ownerId, ownerId),
        eq(uploads.purpose, 'bench-photo'),
        procedureId ? eq(uploads.procedureId, procedureId) : undefined,
      ),
    )
    .orderBy(desc(uploads.createdAt), desc(uploads.id));
}

/**
 * An upload its viewer may see: the owner's own, any for an admin, or one whose owner is a learner
 * in a class the viewer teaches. Anyone else gets null, answered as 404 so ids reveal nothing.
 */
export async function uploadForViewer(viewer: SessionUser, id: string): Promise<(UploadView & { storageKey: string }) | null> {
  const [row] = await db
    .select({ ...viewColumns, storageKey: uploads.storageKey })
    .from(uploads)
    .leftJoin(procedures, eq(procedures.id, uploads.procedureId))
    .where(eq(uploads.id, id));
  if (!row) return null;
  if (row.ownerId === viewer.id || viewer.role === 'admin') return row;
  if (viewer.role !== 'instructor') return null;
  return (await teachesLearner(viewer.id, row.ownerId)) ? row : null;
}

/** The stored bytes of an upload (null when the object has gone missing from the store). */
export function readUpload(storageKey: string) {
  return storage.get(storageKey);
}

export type DeleteResult = 'deleted' | 'not-found' | 'attached';

/**
 * Deletes the owner's upload unless a sign-off uses it. The row is locked first, so a sign-off being
 * recorded at the same moment either sees the photo gone or keeps it (never a half-attached photo).
 */
export async function deleteOwnUpload(ownerId: string, id: string): Promise<DeleteResult> {
  const outcome = await db.transaction(async (tx) => {
    const [row] = await tx
      .select({ storageKey: uploads.storageKey })
      .from(uploads)
      .where(and(eq(uploads.id, id), eq(uploads.ownerId, ownerId)))
      .for('update');
    if (!row) return 'not-found' as const;
    const [inUse] = await tx.select({ one: sql`1` }).from(signOffPhotos).where(eq(signOffPhotos.uploadId, id)).limit(1);
    if (inUse) return 'attached' as const;
    await tx.delete(uploads).where(eq(uploads.id, id));
    return { storageKey: row.storageKey };
  });
  if (typeof outcome === 'string') return outcome;
  // The row is gone, so nothing points at the object any more; a leftover object is only wasted space.
  await storage.remove(outcome.storageKey).catch((err) => console.error('could not remove an upload object', err));
  return 'deleted';
}

/** Of the given upload ids, those that are the learner's bench photos of the procedure (locked against deletion). */
export async function benchPhotosOf(
  tx: Parameters<Parameters<typeof db.transaction>[0]>[0],
  ownerId: string,
  procedureId: string,
  ids: string[],
): Promise<Set<string>> {
  if (ids.length === 0) return new Set();
  const rows = await tx
    .select({ id: uploads.id })
    .from(uploads)
    .where(
      and(
        eq(uploads.ownerId, ownerId),
        eq(uploads.purpose, 'bench-photo'),
        eq(uploads.procedureId, procedureId),
        inArray(uploads.id, ids),
      ),
    )
    .for('key share');
  return new Set(rows.map((r) => r.id));
}
