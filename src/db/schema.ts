import { pgTable, pgEnum, text, timestamp, integer, uuid, primaryKey, index, jsonb, boolean, unique } from 'drizzle-orm/pg-core';
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
    answer: jsonb('answer').notNull(),
    score: integer('score').notNull(),
    maxScore: integer('max_score').notNull(),
    passed: boolean('passed').notNull(),
    results: jsonb('results').$type<StepResult[]>().notNull(),
    notes: jsonb('notes').$type<string[]>().notNull().default([]),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique('attempts_user_client_uq').on(t.userId, t.clientId), index('attempts_user_created_idx').on(t.userId, t.createdAt)],
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

export type UserRow = typeof users.$inferSelect;
export type ClassRow = typeof classes.$inferSelect;
