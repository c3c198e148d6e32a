import { and, desc, eq } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from '../../db/schema';
import type { Procedure } from '../procedure/schema';
import { procedureChecksum, validateProcedure, type Issue } from '../procedure/validate';

// Procedure storage that takes its database as an argument, so the app and the seed script share it.

type Database = NodePgDatabase<typeof schema>;
type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];
const { procedures, procedureVersions } = schema;

export interface StoredVersion {
  id: string;
  procedureId: string;
  slug: string;
  version: number;
  document: Procedure;
  checksum: string;
}

const versionColumns = {
  id: procedureVersions.id,
  procedureId: procedureVersions.procedureId,
  slug: procedures.slug,
  version: procedureVersions.version,
  document: procedureVersions.document,
  checksum: procedureVersions.checksum,
};

export type PublishResult =
  | { ok: true; version: StoredVersion; created: boolean }
  | { ok: false; issues: Issue[] };

/**
 * Validates a document and stores it as the procedure's next version, unless it equals the latest
 * version already stored (then nothing is written). Versions are never changed once written.
 * Takes a transaction too, so a caller can check ownership and publish in one.
 */
export async function publishProcedure(
  db: Database | Transaction,
  input: unknown,
  createdBy: string | null = null,
): Promise<PublishResult> {
  const checked = validateProcedure(input);
  if (!checked.ok) return checked;
  const doc = checked.procedure;

  return db.transaction(async (tx) => {
    await tx.insert(procedures).values({ slug: doc.slug, createdBy }).onConflictDoNothing({ target: procedures.slug });
    // Lock the procedure row so two publishers cannot take the same version number.
    const [proc] = await tx.select({ id: procedures.id }).from(procedures).where(eq(procedures.slug, doc.slug)).for('update');
    const latest = await latestOf(tx, proc!.id);
    if (latest && latest.checksum === procedureChecksum({ ...doc, version: latest.version })) {
      return { ok: true, version: latest, created: false } as const;
    }
    const version = (latest?.version ?? 0) + 1;
    const document: Procedure = { ...doc, version };
    const [row] = await tx
      .insert(procedureVersions)
      .values({ procedureId: proc!.id, version, title: document.title, document, checksum: procedureChecksum(document) })
      .returning({ id: procedureVersions.id });
    return {
      ok: true,
      created: true,
      version: { id: row!.id, procedureId: proc!.id, slug: doc.slug, version, document, checksum: procedureChecksum(document) },
    } as const;
  });
}

async function latestOf(db: Database | Transaction, procedureId: string): Promise<StoredVersion | null> {
  const [row] = await db
    .select(versionColumns)
    .from(procedureVersions)
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .where(eq(procedureVersions.procedureId, procedureId))
    .orderBy(desc(procedureVersions.version))
    .limit(1);
  return row ?? null;
}

/** The latest version of a procedure, or a given version number of it. */
export async function findVersion(db: Database, slug: string, version?: number): Promise<StoredVersion | null> {
  const [row] = await db
    .select(versionColumns)
    .from(procedureVersions)
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .where(version === undefined ? eq(procedures.slug, slug) : and(eq(procedures.slug, slug), eq(procedureVersions.version, version)))
    .orderBy(desc(procedureVersions.version))
    .limit(1);
  return row ?? null;
}

/** Every procedure at its latest version, for the catalogue. */
export async function listLatestVersions(db: Database): Promise<StoredVersion[]> {
  const rows = await db
    .selectDistinctOn([procedures.slug], versionColumns)
    .from(procedureVersions)
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .orderBy(procedures.slug, desc(procedureVersions.version));
  return rows;
}
