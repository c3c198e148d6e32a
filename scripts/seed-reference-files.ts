// The demo's reference file: a spec card (PDF) attached to the sump procedure by the school admin, who may
// edit the demo procedures. Written once; a seed run that finds a reference file on the sump adds nothing.
import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from '../src/db/schema';
import { createObjectStore, storeSettingsFromEnv } from '../src/lib/server/object-store';
import { demoSpecCard } from './demo-pdf';

type Database = NodePgDatabase<typeof schema>;
const { procedures, uploads } = schema;

export const DEMO_SPEC_CARD_NAME = 'wren-160-sump-spec-card.pdf';
export const DEMO_SPEC_CARD_CAPTION = 'Sump cover spec card: bolt torque and tightening order';

export async function seedReferenceFiles(db: Database, ownerId: string): Promise<string> {
  const [sump] = await db.select({ id: procedures.id }).from(procedures).where(eq(procedures.slug, 'wren-160-sump'));
  if (!sump) throw new Error('the demo sump procedure is missing');
  const existing = await db
    .select({ id: uploads.id })
    .from(uploads)
    .where(and(eq(uploads.procedureId, sump.id), eq(uploads.purpose, 'procedure-reference')))
    .limit(1);
  if (existing.length) return 'demo reference file already there';

  const store = createObjectStore(storeSettingsFromEnv(process.env));
  const pdf = demoSpecCard();
  // The same key prefix the app gives reference files (src/lib/server/uploads.ts).
  const storageKey = `procedure-files/${randomUUID()}`;
  await store.put(storageKey, pdf, 'application/pdf');
  await db.insert(uploads).values({
    ownerId,
    purpose: 'procedure-reference',
    procedureId: sump.id,
    storageKey,
    contentType: 'application/pdf',
    sizeBytes: pdf.byteLength,
    originalName: DEMO_SPEC_CARD_NAME,
    caption: DEMO_SPEC_CARD_CAPTION,
  });
  return `demo reference file ${DEMO_SPEC_CARD_NAME} attached to wren-160-sump`;
}
