import { pgTable, pgEnum, text, timestamp, integer, uuid, primaryKey, index, jsonb, boolean, unique, date } from 'drizzle-orm/pg-core';
import { sql } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import { STAGES, type Procedure } from '../lib/procedure/schema';
import type { StepResult } from '../lib/scoring/types';
import type { z } from 'zod';
import type { draftsSchema } from '../lib/schemas/drafts';

export const roleEnum = pgEnum('role', ['learner', 'instructor', 'admin']);
export const classRoleEnum = pgEnum('class_role', ['instructor', 'learner']);

export const schools = pgTable('schools', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull().unique(),
});

// Lucia needs a text primary key it does not generate itself; we use random UUIDs.
export const users = pgTable('users', {
  id: text('id').primaryKey(),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  role: roleEnum('role').notNull().default('learner'),
  passwordHash: text('password_hash').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const sessions = pgTable(
  'sessions',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);

/** Failed sign-ins counted per key ("account:<email>" or "address:<ip>") in a fixed window. */
export const signInThrottle = pgTable('sign_in_throttle', {
  key: text('key').primaryKey(),
  failures: integer('failures').notNull().default(0),
  windowStartedAt: timestamp('window_started_at', { withTimezone: true }).notNull().defaultNow(),
});

export const classes = pgTable('classes', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  joinCode: text('join_code').notNull().unique(),
  schoolId: uuid('school_id').references(() => schools.id, { onDelete: 'set null' }),
  createdBy: text('created_by')
    .notNull()
    .references(() => users.id),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

/** Who is in a class and as what; a class may have several instructors. */
export const classMembers = pgTable(
  'class_members',
  {
    classId: uuid('class_id')
      .notNull()
      .references(() => classes.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: classRoleEnum('role').notNull(),
    joinedAt: timestamp('joined_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.classId, t.userId] }), index('class_members_user_idx').on(t.userId)],
);

/** A procedure by its slug; its content lives in immutable versions. */
export const procedures = pgTable('procedures', {
  id: uuid('id').primaryKey().defaultRandom(),
  slug: text('slug').notNull().unique(),
  createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

/** One published version: the whole validated document and its SHA-256; a trigger refuses updates. */
export const procedureVersions = pgTable(
  'procedure_versions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    procedureId: uuid('procedure_id')
      .notNull()
      .references(() => procedures.id, { onDelete: 'restrict' }),
    version: integer('version').notNull(),
    title: text('title').notNull(),
    document: jsonb('document').$type<Procedure>().notNull(),
    checksum: text('checksum').notNull(),
    publishedAt: timestamp('published_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique('procedure_versions_procedure_version_uq').on(t.procedureId, t.version)],
);

/**
 * An instructor's procedure in the making. The document may be incomplete (it is checked in full only
 * when published); basedOn is the procedure a new version is being prepared for, null for a new one.
 * revision rises with every save, so a stale window cannot overwrite newer work.
 */
export const procedureDrafts = pgTable(
  'procedure_drafts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    basedOn: uuid('based_on').references(() => procedures.id, { onDelete: 'cascade' }),
    document: jsonb('document').$type<Record<string, unknown>>().notNull(),
    revision: integer('revision').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('procedure_drafts_owner_idx').on(t.ownerId, t.updatedAt)],
);

export const stageEnum = pgEnum('stage', STAGES);

/** One learner's scored submission of one stage; clientId makes a retried submit idempotent. */
export const attempts = pgTable(
  'attempts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    clientId: uuid('client_id').notNull(),
    procedureVersionId: uuid('procedure_version_id')
      .notNull()
      .references(() => procedureVersions.id, { onDelete: 'restrict' }),
    stage: stageEnum('stage').notNull(),
    /** The drill this attempt counts toward, when the learner started it from one. */
    drillId: uuid('drill_id').references((): AnyPgColumn => drills.id, { onDelete: 'restrict' }),
    answer: jsonb('answer').notNull(),
    score: integer('score').notNull(),
    maxScore: integer('max_score').notNull(),
    passed: boolean('passed').notNull(),
    results: jsonb('results').$type<StepResult[]>().notNull(),
    notes: jsonb('notes').$type<string[]>().notNull().default([]),
    /** Failed lines not yet in the rework queue: set on insert, cleared once they are queued. */
    reworkPending: boolean('rework_pending').notNull().default(false),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('attempts_user_client_uq').on(t.userId, t.clientId),
    index('attempts_user_created_idx').on(t.userId, t.createdAt),
    index('attempts_drill_user_idx').on(t.drillId, t.userId),
    // Almost always empty: only attempts whose queueing failed (or is under way) are in it.
    index('attempts_rework_pending_idx').on(t.userId, t.createdAt).where(sql`${t.reworkPending}`),
  ],
);

/** A learner's work in progress on one procedure version; the copy made last (savedAt) wins. */
export const attemptDrafts = pgTable(
  'attempt_drafts',
  {
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    procedureVersionId: uuid('procedure_version_id')
      .notNull()
      .references(() => procedureVersions.id, { onDelete: 'restrict' }),
    drafts: jsonb('drafts').$type<z.infer<typeof draftsSchema>>().notNull(),
    // When the browser made the copy (a future date is stored as the server's now); updatedAt is when it was stored.
    savedAt: timestamp('saved_at', { withTimezone: true, mode: 'date' }).notNull(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.procedureVersionId] })],
);

/**
 * Practice an instructor assigns to a class: one pinned procedure version, some of its stages,
 * a due date and a pass mark. Closing a drill keeps every attempt made on it.
 */
export const drills = pgTable(
  'drills',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    classId: uuid('class_id')
      .notNull()
      .references(() => classes.id, { onDelete: 'cascade' }),
    procedureVersionId: uuid('procedure_version_id')
      .notNull()
      .references(() => procedureVersions.id, { onDelete: 'restrict' }),
    stages: stageEnum('stages').array().notNull(),
    dueAt: timestamp('due_at', { withTimezone: true, mode: 'date' }).notNull(),
    passMarkPct: integer('pass_mark_pct').notNull(),
    /** Null: as many attempts as the learner likes. */
    attemptLimit: integer('attempt_limit'),
    /** When true, feedback shows the right answer only once the due date has passed. */
    answersAfterDue: boolean('answers_after_due').notNull().default(false),
    closedAt: timestamp('closed_at', { withTimezone: true, mode: 'date' }),
    createdBy: text('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('drills_class_idx').on(t.classId)],
);

/** One reminder per learner and drill: the reminder job skips pairs already here. */
export const drillReminders = pgTable(
  'drill_reminders',
  {
    drillId: uuid('drill_id')
      .notNull()
      .references(() => drills.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.drillId, t.userId] })],
);

/** Class invitations sent by e-mail, kept so the instructor sees who was asked and when. */
export const classInvitations = pgTable(
  'class_invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    classId: uuid('class_id')
      .notNull()
      .references(() => classes.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    name: text('name'),
    invitedBy: text('invited_by')
      .notNull()
      .references(() => users.id),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('class_invitations_class_idx').on(t.classId)],
);

/** Password reset: only a SHA-256 of the token is stored; a token works once, before it expires. */
export const passwordResetTokens = pgTable(
  'password_reset_tokens',
  {
    tokenHash: text('token_hash').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true, mode: 'date' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('password_reset_tokens_user_idx').on(t.userId)],
);

export const uploadPurposeEnum = pgEnum('upload_purpose', ['bench-photo', 'procedure-reference']);

/** A file in the object store under a random key; the bytes were checked to be what the type says. */
export const uploads = pgTable(
  'uploads',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    purpose: uploadPurposeEnum('purpose').notNull(),
    /** The procedure a bench photo shows, or a reference file belongs to. */
    procedureId: uuid('procedure_id').references(() => procedures.id, { onDelete: 'cascade' }),
    storageKey: text('storage_key').notNull().unique(),
    contentType: text('content_type').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    originalName: text('original_name').notNull(),
    /** A reference file's words for learners (what it shows); the file name stands in without one. */
    caption: text('caption'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('uploads_owner_procedure_idx').on(t.ownerId, t.procedureId)],
);

export const signOffOutcomeEnum = pgEnum('sign_off_outcome', ['pass', 'redo']);

/** The instructor's record of real bench work on a procedure: a learner may need several (redo, then pass). */
export const signOffs = pgTable(
  'sign_offs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    classId: uuid('class_id')
      .notNull()
      .references(() => classes.id, { onDelete: 'cascade' }),
    learnerId: text('learner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    procedureId: uuid('procedure_id')
      .notNull()
      .references(() => procedures.id, { onDelete: 'restrict' }),
    instructorId: text('instructor_id')
      .notNull()
      .references(() => users.id),
    benchDate: date('bench_date', { mode: 'string' }).notNull(),
    outcome: signOffOutcomeEnum('outcome').notNull(),
    notes: text('notes').notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('sign_offs_class_learner_idx').on(t.classId, t.learnerId)],
);

/** Photos the learner uploaded that the instructor attached to a sign-off. */
export const signOffPhotos = pgTable(
  'sign_off_photos',
  {
    signOffId: uuid('sign_off_id')
      .notNull()
      .references(() => signOffs.id, { onDelete: 'cascade' }),
    uploadId: uuid('upload_id')
      .notNull()
      .references(() => uploads.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.signOffId, t.uploadId] })],
);

export const missKindEnum = pgEnum('miss_kind', ['out-of-order', 'wrong-pin', 'broken-pattern', 'wrong-wrench-setting', 'failed-final-check']);

/**
 * A step a learner missed, to be met again on a spaced schedule. One row per learner, procedure
 * version, stage and result key; a new miss refreshes it. The scheduler's card state is kept whole.
 */
export const reworkItems = pgTable(
  'rework_items',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    procedureVersionId: uuid('procedure_version_id')
      .notNull()
      .references(() => procedureVersions.id, { onDelete: 'restrict' }),
    stage: stageEnum('stage').notNull(),
    /** The scorer's result key the miss was reported under (a step, hole, pass or check). */
    itemKey: text('item_key').notNull(),
    missKind: missKindEnum('miss_kind').notNull(),
    due: timestamp('due', { withTimezone: true, mode: 'date' }).notNull(),
    /** The spaced-review card (stability, difficulty, reps, lapses, state, last review). */
    card: jsonb('card').$type<Record<string, unknown>>().notNull(),
    missCount: integer('miss_count').notNull().default(1),
    lastMissedAt: timestamp('last_missed_at', { withTimezone: true, mode: 'date' }).notNull(),
    sourceAttemptId: uuid('source_attempt_id').references(() => attempts.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('rework_items_user_item_uq').on(t.userId, t.procedureVersionId, t.stage, t.itemKey),
    index('rework_items_user_due_idx').on(t.userId, t.due),
  ],
);

/** One answer to a rework question; clientId makes a retried submit idempotent, as with attempts. */
export const reworkAnswers = pgTable(
  'rework_answers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    itemId: uuid('item_id')
      .notNull()
      .references(() => reworkItems.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    clientId: uuid('client_id').notNull(),
    answer: jsonb('answer').notNull(),
    correct: boolean('correct').notNull(),
    /** The review rating given to the scheduler (1 again … 4 easy). */
    rating: integer('rating').notNull(),
    results: jsonb('results').$type<StepResult[]>().notNull(),
    dueBefore: timestamp('due_before', { withTimezone: true, mode: 'date' }).notNull(),
    dueAfter: timestamp('due_after', { withTimezone: true, mode: 'date' }).notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique('rework_answers_user_client_uq').on(t.userId, t.clientId), index('rework_answers_item_idx').on(t.itemId)],
);

export type UserRow = typeof users.$inferSelect;
export type ClassRow = typeof classes.$inferSelect;
export type DrillRow = typeof drills.$inferSelect;
export type ProcedureDraftRow = typeof procedureDrafts.$inferSelect;
