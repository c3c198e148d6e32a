import { and, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { classes, procedures, procedureVersions, signOffPhotos, signOffs, uploads, users } from '../../db/schema';
import type { SignOffOutcome, SignOffRequest } from '../schemas/sign-offs';
import type { SignOffJson } from '../uploads/views';
import { isClassLearner } from './classes';
import { db } from './db';
import { findVersion } from './procedure-store';
import { benchPhotosOf } from './uploads';

export interface SignOffPhoto {
  id: string;
  originalName: string;
  contentType: string;
}

/** One bench sign-off as pages and the API show it. */
export interface SignOffView {
  id: string;
  classId: string;
  className: string;
  learnerId: string;
  learnerName: string;
  procedureId: string;
  /** The procedure's slug. */
  procedure: string;
  /** The title of the procedure's latest version. */
  procedureTitle: string;
  instructorId: string;
  instructorName: string;
  /** YYYY-MM-DD, the day of the bench work. */
  benchDate: string;
  outcome: SignOffOutcome;
  notes: string;
  photos: SignOffPhoto[];
  createdAt: Date;
}

/** The JSON the API answers (no instructor id: the name is what people read). */
export function signOffJson(s: SignOffView): SignOffJson {
  return {
    id: s.id,
    classId: s.classId,
    className: s.className,
    learnerId: s.learnerId,
    learnerName: s.learnerName,
    procedure: s.procedure,
    procedureTitle: s.procedureTitle,
    instructorName: s.instructorName,
    benchDate: s.benchDate,
    outcome: s.outcome,
    notes: s.notes,
    photos: s.photos,
    createdAt: s.createdAt.toISOString(),
  };
}

const learner = alias(users, 'learner');
const instructor = alias(users, 'instructor');

const latestTitle = sql<string>`(select ${procedureVersions.title} from ${procedureVersions} where ${procedureVersions.procedureId} = ${signOffs.procedureId} order by ${procedureVersions.version} desc limit 1)`;

const columns = {
  id: signOffs.id,
  classId: signOffs.classId,
  className: classes.name,
  learnerId: signOffs.learnerId,
  learnerName: learner.name,
  procedureId: signOffs.procedureId,
  procedure: procedures.slug,
  procedureTitle: latestTitle,
  instructorId: signOffs.instructorId,
  instructorName: instructor.name,
  benchDate: signOffs.benchDate,
  outcome: signOffs.outcome,
  notes: signOffs.notes,
  createdAt: signOffs.createdAt,
};

function baseQuery() {
  return db
    .select(columns)
    .from(signOffs)
    .innerJoin(classes, eq(classes.id, signOffs.classId))
    .innerJoin(learner, eq(learner.id, signOffs.learnerId))
    .innerJoin(instructor, eq(instructor.id, signOffs.instructorId))
    .innerJoin(procedures, eq(procedures.id, signOffs.procedureId));
}

type Row = Awaited<ReturnType<ReturnType<typeof baseQuery>['execute']>>[number];

async function withPhotos(rows: Row[]): Promise<SignOffView[]> {
  if (rows.length === 0) return [];
  const photos = await db
    .select({ signOffId: signOffPhotos.signOffId, id: uploads.id, originalName: uploads.originalName, contentType: uploads.contentType })
    .from(signOffPhotos)
    .innerJoin(uploads, eq(uploads.id, signOffPhotos.uploadId))
    .where(inArray(signOffPhotos.signOffId, rows.map((r) => r.id)))
    .orderBy(uploads.createdAt, uploads.id);
  return rows.map((r) => ({
    ...r,
    photos: photos.filter((p) => p.signOffId === r.id).map(({ signOffId: _s, ...photo }) => photo),
  }));
}

async function list(where: SQL | undefined): Promise<SignOffView[]> {
  const rows = await baseQuery().where(where).orderBy(desc(signOffs.benchDate), desc(signOffs.createdAt), desc(signOffs.id));
  return withPhotos(rows);
}

/** A class's sign-offs, newest bench date first; of one learner and/or one procedure when given. */
export function listClassSignOffs(classId: string, filter: { learnerId?: string; procedureId?: string } = {}): Promise<SignOffView[]> {
  return list(
    and(
      eq(signOffs.classId, classId),
      filter.learnerId ? eq(signOffs.learnerId, filter.learnerId) : undefined,
      filter.procedureId ? eq(signOffs.procedureId, filter.procedureId) : undefined,
    ),
  );
}

/** Every sign-off recorded for a learner, in any class, newest bench date first. */
export function listLearnerSignOffs(learnerId: string): Promise<SignOffView[]> {
  return list(eq(signOffs.learnerId, learnerId));
}

/**
 * The latest sign-off per learner and procedure in a class (latest bench date, then latest recorded):
 * what class results show. At most one entry per (learnerId, procedureId).
 */
export async function latestSignOffsForClass(
  classId: string,
  filter: { learnerId?: string; procedureId?: string } = {},
): Promise<SignOffView[]> {
  const all = await listClassSignOffs(classId, filter);
  const seen = new Set<string>();
  // `all` is already newest first, so the first of each pair is the latest.
  return all.filter((s) => {
    const key = `${s.learnerId}\u0000${s.procedureId}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

export async function signOffById(id: string): Promise<SignOffView | null> {
  const [found] = await list(eq(signOffs.id, id));
  return found ?? null;
}

export type CreateResult = { ok: true; signOff: SignOffView } | { ok: false; error: string; fields: Record<string, string[]> };

function refused(field: string, message: string): CreateResult {
  return { ok: false, error: message, fields: { [field]: [message] } };
}

/**
 * Records a sign-off: the learner must be a learner of the class, the procedure must exist, and every
 * photo must be that learner's bench photo of that procedure. Photos are locked while they are attached,
 * so a deletion at the same moment cannot leave a sign-off pointing at nothing.
 */
export async function createSignOff(classId: string, instructorId: string, input: SignOffRequest): Promise<CreateResult> {
  if (!(await isClassLearner(classId, input.learnerId))) return refused('learnerId', 'This person is not a learner in this class');
  const procedure = await findVersion(db, input.procedure);
  if (!procedure) return refused('procedure', `No procedure "${input.procedure}"`);

  const created = await db.transaction(async (tx) => {
    const found = await benchPhotosOf(tx, input.learnerId, procedure.procedureId, input.photoIds);
    const stranger = input.photoIds.find((id) => !found.has(id));
    if (stranger) return { missing: stranger };
    const [row] = await tx
      .insert(signOffs)
      .values({
        classId,
        learnerId: input.learnerId,
        procedureId: procedure.procedureId,
        instructorId,
        benchDate: input.benchDate,
        outcome: input.outcome,
        notes: input.notes,
      })
      .returning({ id: signOffs.id });
    if (input.photoIds.length) {
      await tx.insert(signOffPhotos).values(input.photoIds.map((uploadId) => ({ signOffId: row!.id, uploadId })));
    }
    return { id: row!.id };
  });
  if ('missing' in created) {
    return refused('photoIds', `Photo ${created.missing} is not one of this learner's bench photos of this procedure`);
  }
  return { ok: true, signOff: (await signOffById(created.id))! };
}
