import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import { and, eq, inArray } from 'drizzle-orm';
import * as schema from '../../src/db/schema';
import type { Stage } from '../../src/lib/procedure/schema';

// Data the results tests need but no API of this branch makes: a drill in a class, attempts counted
// toward it, bench sign-offs. Written straight to the test database.

const { attempts, drills, procedures, procedureVersions, signOffs } = schema;

export function fixtureDb() {
  const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
  const db = drizzle(pool, { schema });

  return {
    close: () => pool.end(),

    async procedureVersion(slug: string, version = 1) {
      const [row] = await db
        .select({ id: procedureVersions.id, procedureId: procedures.id })
        .from(procedureVersions)
        .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
        .where(and(eq(procedures.slug, slug), eq(procedureVersions.version, version)));
      if (!row) throw new Error(`no procedure ${slug} v${version}`);
      return row;
    },

    async insertDrill(values: {
      classId: string;
      slug: string;
      stages: Stage[];
      createdBy: string;
      dueAt?: Date;
      passMarkPct?: number;
      attemptLimit?: number | null;
    }) {
      const version = await this.procedureVersion(values.slug);
      const [row] = await db
        .insert(drills)
        .values({
          classId: values.classId,
          procedureVersionId: version.id,
          stages: values.stages,
          dueAt: values.dueAt ?? new Date(Date.now() + 7 * 86_400_000),
          passMarkPct: values.passMarkPct ?? 80,
          attemptLimit: values.attemptLimit ?? null,
          createdBy: values.createdBy,
        })
        .returning({ id: drills.id });
      return { drillId: row!.id, procedureId: version.procedureId };
    },

    /** Counts attempts made through POST /api/attempts toward a drill. */
    async linkAttempts(drillId: string, attemptIds: string[]) {
      if (attemptIds.length) await db.update(attempts).set({ drillId }).where(inArray(attempts.id, attemptIds));
    },

    async insertSignOff(values: typeof signOffs.$inferInsert) {
      await db.insert(signOffs).values(values);
    },
  };
}
