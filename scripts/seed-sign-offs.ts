// The demo's bench sign-offs: one learner's sump work, first sent back for a redo, then passed with a
// photo of the finished sump. Written once; a seed run that finds sign-offs for that learner adds nothing.
import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from '../src/db/schema';
import { createObjectStore, storeSettingsFromEnv } from '../src/lib/server/object-store';
import { demoBenchPhoto } from './demo-photo';

type Database = NodePgDatabase<typeof schema>;
const { procedures, signOffs, signOffPhotos, uploads } = schema;

export const DEMO_SIGN_OFF_LEARNER = 'learner2@larkspur.example';

export async function seedSignOffs(db: Database, ids: { classId: string; learnerId: string; instructorId: string }): Promise<string> {
  const existing = await db
    .select({ id: signOffs.id })
    .from(signOffs)
    .where(and(eq(signOffs.classId, ids.classId), eq(signOffs.learnerId, ids.learnerId)))
    .limit(1);
  if (existing.length) return 'demo sign-offs already there';

  const [sump] = await db.select({ id: procedures.id }).from(procedures).where(eq(procedures.slug, 'wren-160-sump'));
  if (!sump) throw new Error('the demo sump procedure is missing');

  const store = createObjectStore(storeSettingsFromEnv(process.env));
  const photo = demoBenchPhoto();
  const storageKey = `bench-photos/${randomUUID()}`;
  await store.put(storageKey, photo, 'image/png');

  await db.transaction(async (tx) => {
    const [upload] = await tx
      .insert(uploads)
      .values({
        ownerId: ids.learnerId,
        purpose: 'bench-photo',
        procedureId: sump.id,
        storageKey,
        contentType: 'image/png',
        sizeBytes: photo.byteLength,
        originalName: 'sump-from-below.png',
      })
      .returning({ id: uploads.id });
    const common = { classId: ids.classId, learnerId: ids.learnerId, procedureId: sump.id, instructorId: ids.instructorId };
    await tx.insert(signOffs).values({
      ...common,
      benchDate: '2026-09-15',
      outcome: 'redo',
      notes: 'Flange bolts were run down in a circle. Redo with the cross pattern, two passes.',
    });
    const [pass] = await tx
      .insert(signOffs)
      .values({
        ...common,
        benchDate: '2026-09-22',
        outcome: 'pass',
        notes: 'Cross pattern in two passes, 8 of 8 bolts, crankshaft turns two revolutions freely.',
      })
      .returning({ id: signOffs.id });
    await tx.insert(signOffPhotos).values({ signOffId: pass!.id, uploadId: upload!.id });
  });
  return 'two demo sign-offs recorded';
}
