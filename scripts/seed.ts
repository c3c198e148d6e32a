// Seeds the invented demo school. Safe to run again: existing rows are kept as they are.
import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import { and, eq } from 'drizzle-orm';
import * as schema from '../src/db/schema';
import { hashPassword } from '../src/lib/server/password';
import { findVersion, publishProcedure } from '../src/lib/server/procedure-store';
import { DEMO_PROCEDURES } from '../models/procedures';
import { DEMO_CLASS, DEMO_PASSWORD, DEMO_PEOPLE, DEMO_SCHOOL } from './demo-people';
import { DEMO_SIGN_OFF_LEARNER, seedSignOffs } from './seed-sign-offs';
import { seedReferenceFiles } from './seed-reference-files';
import { DEMO_DRILLS, demoDueAt } from './demo-drills';
import { DEMO_ATTEMPT_PLAN, demoClientId, slipAnswer } from './demo-attempts';
import { correctAnswer } from '../src/lib/procedure/reference-answers';
import { scoreAttempt } from '../src/lib/scoring';
import { attemptRow } from '../src/lib/server/attempt-row';
import { queueMisses } from '../src/lib/server/rework-queue';

if (process.env.NODE_ENV === 'production') {
  console.error('Refusing to seed demo accounts with NODE_ENV=production.');
  process.exit(1);
}
if (!process.env.DATABASE_URL) {
  console.error('DATABASE_URL is not set; run through `npm start` or `npm test`.');
  process.exit(1);
}

const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL });
const db = drizzle(pool, { schema });
const { schools, users, classes, classMembers, drills, procedures, procedureVersions, attempts } = schema;

async function main() {
  await db.insert(schools).values({ name: DEMO_SCHOOL }).onConflictDoNothing();
  const [school] = await db.select().from(schools).where(eq(schools.name, DEMO_SCHOOL));

  // One hash for the shared demo password keeps re-seeding quick.
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db
    .insert(users)
    .values(DEMO_PEOPLE.map((p) => ({ id: randomUUID(), name: p.name, email: p.email, role: p.role, passwordHash })))
    .onConflictDoNothing({ target: users.email });
  const people = await db.select({ id: users.id, email: users.email }).from(users);
  const idOf = (email: string) => {
    const found = people.find((p) => p.email === email);
    if (!found) throw new Error(`demo user ${email} missing`);
    return found.id;
  };

  await db
    .insert(classes)
    .values({ name: DEMO_CLASS.name, joinCode: DEMO_CLASS.joinCode, schoolId: school!.id, createdBy: idOf(DEMO_CLASS.instructors[0]!) })
    .onConflictDoNothing({ target: classes.joinCode });
  const [cls] = await db.select().from(classes).where(eq(classes.joinCode, DEMO_CLASS.joinCode));
  await db
    .insert(classMembers)
    .values([
      ...DEMO_CLASS.instructors.map((email) => ({ classId: cls!.id, userId: idOf(email), role: 'instructor' as const })),
      ...DEMO_CLASS.learners.map((email) => ({ classId: cls!.id, userId: idOf(email), role: 'learner' as const })),
    ])
    .onConflictDoNothing();

  console.log(`  ${DEMO_PEOPLE.length} demo people, class "${DEMO_CLASS.name}" (join code ${DEMO_CLASS.joinCode})`);

  // A changed demo file becomes a new version; an unchanged one writes nothing.
  for (const doc of DEMO_PROCEDURES) {
    const published = await publishProcedure(db, doc);
    if (!published.ok) {
      throw new Error(`demo procedure ${doc.slug} is invalid:\n${published.issues.map((i) => `  ${i.path}: ${i.message}`).join('\n')}`);
    }
    const { version, created } = published;
    console.log(`  procedure ${version.slug} v${version.version}${created ? ' published' : ' unchanged'}`);
  }

  const signedOff = await seedSignOffs(db, {
    classId: cls!.id,
    learnerId: idOf(DEMO_SIGN_OFF_LEARNER),
    instructorId: idOf(DEMO_CLASS.instructors[0]!),
  });
  console.log(`  ${signedOff}`);
  const admin = DEMO_PEOPLE.find((p) => p.role === 'admin')!;
  console.log(`  ${await seedReferenceFiles(db, idOf(admin.email))}`);
  await seedDrills(cls!.id, idOf(DEMO_CLASS.instructors[0]!));
  await seedAttempts(cls!.id, idOf);
}

/** The class's work on the sump drill (scripts/demo-attempts.ts), spread over the last few days. */
async function seedAttempts(classId: string, idOf: (email: string) => string) {
  const [drill] = await db
    .select({ id: drills.id, versionId: procedureVersions.id, document: procedureVersions.document })
    .from(drills)
    .innerJoin(procedureVersions, eq(procedureVersions.id, drills.procedureVersionId))
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .where(and(eq(drills.classId, classId), eq(procedures.slug, 'wren-160-sump')));
  if (!drill) return;
  const now = Date.now();
  let added = 0;
  for (const [email, plan] of Object.entries(DEMO_ATTEMPT_PLAN)) {
    for (const [i, [stage, kind]] of plan.entries()) {
      const answer = kind === 'right' ? correctAnswer(drill.document, stage) : slipAnswer(drill.document, stage);
      const scored = scoreAttempt(drill.document, stage, answer);
      if (!scored.ok) throw new Error(`demo attempt ${email} ${stage}: ${scored.issues[0]?.message}`);
      const input = { procedure: 'wren-160-sump', stage, answer: answer as object, clientId: demoClientId(email, i), drillId: drill.id };
      const createdAt = new Date(now - (3 * 24 - i * 2) * 60 * 60 * 1000);
      const inserted = await db
        .insert(attempts)
        .values({ ...attemptRow(idOf(email), input, drill.versionId, scored.score), createdAt })
        .onConflictDoNothing({ target: [attempts.userId, attempts.clientId] })
        .returning({ id: attempts.id });
      added += inserted.length;
      // Their misses wait in Rework, queued by the same code as a learner's own.
      for (const { id } of inserted) {
        await queueMisses(db, { userId: idOf(email), attemptId: id, procedureVersionId: drill.versionId, document: drill.document, stage, results: scored.score.results, at: createdAt });
      }
    }
  }
  console.log(`  ${added ? `${added} demo attempts on the sump drill` : 'demo attempts already there'}`);
}

/** Each demo drill once per class: a procedure that already has a drill there (any version) is left alone. */
async function seedDrills(classId: string, instructorId: string) {
  const now = new Date();
  for (const demo of DEMO_DRILLS) {
    const existing = await db
      .select({ id: drills.id })
      .from(drills)
      .innerJoin(procedureVersions, eq(procedureVersions.id, drills.procedureVersionId))
      .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
      .where(and(eq(drills.classId, classId), eq(procedures.slug, demo.procedure)));
    if (existing.length > 0) continue;
    const version = await findVersion(db, demo.procedure);
    if (!version) throw new Error(`demo drill: no procedure ${demo.procedure}`);
    const dueAt = demoDueAt(demo.dueInDays, now);
    await db.insert(drills).values({
      classId,
      procedureVersionId: version.id,
      stages: demo.stages,
      dueAt,
      passMarkPct: demo.passMarkPct,
      attemptLimit: demo.attemptLimit,
      answersAfterDue: demo.answersAfterDue,
      createdBy: instructorId,
    });
    console.log(`  drill ${demo.procedure} for "${DEMO_CLASS.name}", due ${dueAt.toISOString()}`);
  }
}

main()
  .catch((err) => {
    console.error(err);
    process.exitCode = 1;
  })
  .finally(() => pool.end());
