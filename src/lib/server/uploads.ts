import { randomUUID } from 'node:crypto';
import { and, asc, count, desc, eq, inArray, sql } from 'drizzle-orm';
import { fileTypeFromBuffer } from 'file-type';
import { procedures, signOffPhotos, uploads } from '../../db/schema';
import type { SessionUser } from '../roles';
import type { UploadPurpose } from '../schemas/uploads';
import {
  BENCH_PHOTO_RULE, checkUpload, detectedType, MAX_BENCH_PHOTOS_PER_PROCEDURE, MAX_REFERENCE_FILES_PER_PROCEDURE,
  PROCEDURE_REFERENCE_RULE, type DetectedType, type UploadRule,
} from '../uploads/check';
import type { BenchPhotoJson, ReferenceFileJson } from '../uploads/views';
import { teachesLearner } from './attempts';
import { db } from './db';
import { storage } from './storage';

type Transaction = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** What one purpose accepts, where its objects are kept, and how many of them a procedure may have. */
export interface UploadKind {
  rule: UploadRule;
  /** Storage keys are `<keyPrefix>/<random uuid>`: never a name the uploader chose. */
  keyPrefix: string;
  max: number;
  /** Counted per uploader and procedure (each learner's own photos), or per procedure whoever uploaded. */
  perOwner: boolean;
  full: string;
}

export const UPLOAD_KINDS: Record<UploadPurpose, UploadKind> = {
  'bench-photo': {
    rule: BENCH_PHOTO_RULE,
    keyPrefix: 'bench-photos',
    max: MAX_BENCH_PHOTOS_PER_PROCEDURE,
    perOwner: true,
    full: `You already keep ${MAX_BENCH_PHOTOS_PER_PROCEDURE} photos of this procedure; delete one that is not on a sign-off first`,
  },
  'procedure-reference': {
    rule: PROCEDURE_REFERENCE_RULE,
    keyPrefix: 'procedure-files',
    max: MAX_REFERENCE_FILES_PER_PROCEDURE,
    perOwner: false,
    full: `This procedure already has ${MAX_REFERENCE_FILES_PER_PROCEDURE} reference files; delete one first`,
  },
};

export interface UploadView {
  id: string;
  ownerId: string;
  originalName: string;
  contentType: string;
  sizeBytes: number;
  createdAt: Date;
  /** Reference files only; null without one. */
  caption: string | null;
  /** The procedure's slug (bench photos always have one). */
  procedure: string | null;
  /** True once an instructor attached it to a sign-off; it can no longer be deleted. */
  attached: boolean;
}

/** What the server alone needs to decide who may read or delete an upload. */
export interface StoredUpload extends UploadView {
  storageKey: string;
  purpose: UploadPurpose;
  /** Who created the upload's procedure: with admins, the people who may manage its reference files. */
  procedureCreatedBy: string | null;
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

/** A reference file as listed to anyone signed in. */
export function referenceFileJson(u: UploadView): ReferenceFileJson {
  return {
    id: u.id,
    procedure: u.procedure ?? '',
    originalName: u.originalName,
    caption: u.caption,
    contentType: u.contentType,
    sizeBytes: u.sizeBytes,
    createdAt: u.createdAt.toISOString(),
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
  caption: uploads.caption,
  procedure: procedures.slug,
  attached,
};

/** The file's real type from its bytes: file-type's magic numbers first, then a look for text. */
export async function detectType(bytes: Uint8Array): Promise<DetectedType | null> {
  return detectedType(await fileTypeFromBuffer(bytes), bytes);
}

export type SaveOutcome =
  | { ok: true; upload: UploadView }
  | { ok: false; reason: 'empty' | 'too-large' | 'wrong-type' | 'full'; message: string };

/**
 * The one way a file is kept, whatever its purpose: its real type is read from its bytes and judged by the
 * purpose's rule, then it is stored under a random key with the purpose's prefix (never the uploader's file
 * name) and recorded. The object is written first; if the row cannot be written, or the cap was reached
 * meanwhile, the object is removed again.
 */
export async function saveUpload(input: {
  purpose: UploadPurpose;
  ownerId: string;
  procedure: { id: string; slug: string };
  bytes: Uint8Array;
  /** The name the browser sent, already cleaned for display. */
  originalName: string;
  caption?: string | null;
}): Promise<SaveOutcome> {
  const { purpose, ownerId, procedure, bytes, originalName } = input;
  const caption = input.caption ?? null;
  const kind = UPLOAD_KINDS[purpose];
  const checked = checkUpload({ detected: await detectType(bytes), name: originalName, size: bytes.byteLength }, kind.rule);
  if (!checked.ok) return checked;

  const storageKey = `${kind.keyPrefix}/${randomUUID()}`;
  await storage.put(storageKey, bytes, checked.contentType);
  const forget = () => storage.remove(storageKey).catch(() => undefined);
  let row: { id: string; createdAt: Date } | null;
  try {
    row = await db.transaction(async (tx) => {
      // Uploads to one procedure take turns here, so two at once cannot both take the last place under the cap.
      await tx.select({ id: procedures.id }).from(procedures).where(eq(procedures.id, procedure.id)).for('no key update');
      if ((await countUploads(purpose, procedure.id, ownerId, tx)) >= kind.max) return null;
      const [inserted] = await tx
        .insert(uploads)
        .values({ ownerId, purpose, procedureId: procedure.id, storageKey, contentType: checked.contentType, sizeBytes: bytes.byteLength, originalName, caption })
        .returning({ id: uploads.id, createdAt: uploads.createdAt });
      return inserted!;
    });
  } catch (err) {
    await forget();
    throw err;
  }
  if (!row) {
    await forget();
    return { ok: false, reason: 'full', message: kind.full };
  }
  return {
    ok: true,
    upload: { id: row.id, ownerId, originalName, caption, contentType: checked.contentType, sizeBytes: bytes.byteLength, createdAt: row.createdAt, procedure: procedure.slug, attached: false },
  };
}

/** How many uploads of a purpose a procedure has: per uploader for bench photos, in all for reference files. */
export async function countUploads(purpose: UploadPurpose, procedureId: string, ownerId: string, tx: Transaction | typeof db = db): Promise<number> {
  const [row] = await tx
    .select({ n: count() })
    .from(uploads)
    .where(
      and(
        eq(uploads.purpose, purpose),
        eq(uploads.procedureId, procedureId),
        UPLOAD_KINDS[purpose].perOwner ? eq(uploads.ownerId, ownerId) : undefined,
      ),
    );
  return row?.n ?? 0;
}

/** A procedure's reference files in the order they were attached. */
export async function listReferenceFiles(procedureId: string): Promise<UploadView[]> {
  return db
    .select(viewColumns)
    .from(uploads)
    .leftJoin(procedures, eq(procedures.id, uploads.procedureId))
    .where(and(eq(uploads.purpose, 'procedure-reference'), eq(uploads.procedureId, procedureId)))
    .orderBy(asc(uploads.createdAt), asc(uploads.id));
}

/** How many reference files each of the given procedures has, by slug (procedures without any are absent). */
export async function referenceFileCounts(slugs: string[]): Promise<Map<string, number>> {
  if (slugs.length === 0) return new Map();
  const rows = await db
    .select({ slug: procedures.slug, n: count() })
    .from(uploads)
    .innerJoin(procedures, eq(procedures.id, uploads.procedureId))
    .where(and(eq(uploads.purpose, 'procedure-reference'), inArray(procedures.slug, slugs)))
    .groupBy(procedures.slug);
  return new Map(rows.map((r) => [r.slug, r.n]));
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
 * An upload its viewer may see. A procedure's reference files: anyone signed in (every signed-in user may
 * open every procedure). Bench photos: the owner's own, any for an admin, or one whose owner is a learner
 * in a class the viewer teaches. Anyone else gets null, answered as 404 so ids reveal nothing.
 */
export async function uploadForViewer(viewer: SessionUser, id: string): Promise<StoredUpload | null> {
  const [row] = await db
    .select({ ...viewColumns, storageKey: uploads.storageKey, purpose: uploads.purpose, procedureCreatedBy: procedures.createdBy })
    .from(uploads)
    .leftJoin(procedures, eq(procedures.id, uploads.procedureId))
    .where(eq(uploads.id, id));
  if (!row) return null;
  if (row.purpose === 'procedure-reference') return row;
  if (row.ownerId === viewer.id || viewer.role === 'admin') return row;
  if (viewer.role !== 'instructor') return null;
  return (await teachesLearner(viewer.id, row.ownerId)) ? row : null;
}

/** The stored bytes of an upload (null when the object has gone missing from the store). */
export function readUpload(storageKey: string) {
  return storage.get(storageKey);
}

export type DeleteResult = 'deleted' | 'not-found' | 'attached';

/** Sets a reference file's caption (null: none); the file as listed after, or null when it is gone. */
export async function setCaption(id: string, caption: string | null): Promise<UploadView | null> {
  const [updated] = await db
    .update(uploads)
    .set({ caption })
    .where(and(eq(uploads.id, id), eq(uploads.purpose, 'procedure-reference')))
    .returning({ id: uploads.id });
  if (!updated) return null;
  const [row] = await db.select(viewColumns).from(uploads).leftJoin(procedures, eq(procedures.id, uploads.procedureId)).where(eq(uploads.id, id));
  return row ?? null;
}

/**
 * Deletes an upload unless a sign-off uses it; with `ownerId`, only that person's. The caller has decided
 * who may (the owner of a bench photo; whoever may edit the procedure of a reference file). The row is
 * locked first, so a sign-off being recorded at the same moment either sees the photo gone or keeps it
 * (never a half-attached photo).
 */
export async function deleteUpload(id: string, ownerId?: string): Promise<DeleteResult> {
  const outcome = await db.transaction(async (tx) => {
    const [row] = await tx
      .select({ storageKey: uploads.storageKey })
      .from(uploads)
      .where(and(eq(uploads.id, id), ownerId === undefined ? undefined : eq(uploads.ownerId, ownerId)))
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
  tx: Transaction,
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
