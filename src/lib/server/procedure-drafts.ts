import { and, desc, eq, inArray, like } from 'drizzle-orm';
import { z } from 'zod';
import * as schema from '../../db/schema';
import type { SessionUser } from '../roles';
import type { Issue } from '../procedure/validate';
import { keySchema } from '../procedure/schema';
import { validateDraft } from '../editor/drafts';
import { slugify, uniqueSlug } from '../editor/slug';
import { db } from './db';
import { publishProcedure, type StoredVersion } from './procedure-store';

// Instructors' procedure drafts and the procedures they own. A draft is private to its owner; a
// procedure may be edited (a new version published) only by the instructor who created it, or an admin.

const { procedureDrafts, procedures, procedureVersions } = schema;

export type DraftRow = schema.ProcedureDraftRow;

export interface DraftSummary {
  id: string;
  title: string;
  /** Slug of the procedure this draft is the next version of; null for a new procedure. */
  basedOn: string | null;
  revision: number;
  updatedAt: Date;
}

const uuid = z.string().uuid();

/** True when the user may publish new versions of a procedure created by `createdBy`. */
export function canEditProcedure(user: SessionUser, createdBy: string | null): boolean {
  return user.role === 'admin' || (user.role === 'instructor' && createdBy === user.id);
}

const titleOf = (document: Record<string, unknown>) => (typeof document.title === 'string' ? document.title : '');

export async function listDrafts(ownerId: string): Promise<DraftSummary[]> {
  const rows = await db
    .select({
      id: procedureDrafts.id,
      document: procedureDrafts.document,
      basedOn: procedures.slug,
      revision: procedureDrafts.revision,
      updatedAt: procedureDrafts.updatedAt,
    })
    .from(procedureDrafts)
    .leftJoin(procedures, eq(procedures.id, procedureDrafts.basedOn))
    .where(eq(procedureDrafts.ownerId, ownerId))
    .orderBy(desc(procedureDrafts.updatedAt));
  return rows.map(({ document, ...rest }) => ({ ...rest, title: titleOf(document) }));
}

export function draftView(row: DraftRow, basedOnSlug: string | null) {
  return {
    id: row.id,
    title: titleOf(row.document),
    basedOn: basedOnSlug,
    revision: row.revision,
    updatedAt: row.updatedAt,
    document: row.document,
  };
}
export type DraftView = ReturnType<typeof draftView>;

export async function createDraft(ownerId: string, document: Record<string, unknown>, basedOn: string | null = null): Promise<DraftRow> {
  const [row] = await db.insert(procedureDrafts).values({ ownerId, document, basedOn }).returning();
  return row!;
}

/** The user's own draft with the slug it is based on; null for a malformed id or anyone else's draft. */
export async function findOwnDraft(id: string, ownerId: string): Promise<{ row: DraftRow; basedOn: string | null } | null> {
  if (!uuid.safeParse(id).success) return null;
  const [found] = await db
    .select({ row: procedureDrafts, basedOn: procedures.slug })
    .from(procedureDrafts)
    .leftJoin(procedures, eq(procedures.id, procedureDrafts.basedOn))
    .where(and(eq(procedureDrafts.id, id), eq(procedureDrafts.ownerId, ownerId)));
  return found ?? null;
}

export type SaveResult = { ok: true; revision: number; updatedAt: Date } | { ok: false; reason: 'not-found' | 'conflict'; revision?: number };

/** Stores the document if the caller saw the latest revision; otherwise says which revision is stored. */
export async function saveDraft(id: string, ownerId: string, document: Record<string, unknown>, revision: number): Promise<SaveResult> {
  if (!uuid.safeParse(id).success) return { ok: false, reason: 'not-found' };
  const [row] = await db
    .update(procedureDrafts)
    .set({ document, revision: revision + 1, updatedAt: new Date() })
    .where(and(eq(procedureDrafts.id, id), eq(procedureDrafts.ownerId, ownerId), eq(procedureDrafts.revision, revision)))
    .returning({ revision: procedureDrafts.revision, updatedAt: procedureDrafts.updatedAt });
  if (row) return { ok: true, ...row };
  const current = await findOwnDraft(id, ownerId);
  return current ? { ok: false, reason: 'conflict', revision: current.row.revision } : { ok: false, reason: 'not-found' };
}

export async function deleteDraft(id: string, ownerId: string): Promise<boolean> {
  if (!uuid.safeParse(id).success) return false;
  const rows = await db
    .delete(procedureDrafts)
    .where(and(eq(procedureDrafts.id, id), eq(procedureDrafts.ownerId, ownerId)))
    .returning({ id: procedureDrafts.id });
  return rows.length > 0;
}

export async function findProcedure(slug: string) {
  const [row] = await db.select().from(procedures).where(eq(procedures.slug, slug));
  return row ?? null;
}

export type PublishDraftResult =
  | { ok: true; version: StoredVersion; created: boolean }
  | { ok: false; reason: 'invalid'; issues: Issue[] }
  | { ok: false; reason: 'forbidden' | 'gone' };

/**
 * Publishes a draft as a new immutable version and removes the draft. A draft based on a procedure
 * becomes its next version (owner or admin only, checked under a row lock); any other draft becomes a new
 * procedure under a free slug made from its own slug or its title.
 */
export async function publishDraft(draft: DraftRow, user: SessionUser): Promise<PublishDraftResult> {
  return db.transaction(async (tx) => {
    let slug: string;
    let base = '';
    if (draft.basedOn) {
      const [proc] = await tx.select().from(procedures).where(eq(procedures.id, draft.basedOn)).for('update');
      if (!proc) return { ok: false, reason: 'gone' } as const;
      if (!canEditProcedure(user, proc.createdBy)) return { ok: false, reason: 'forbidden' } as const;
      slug = proc.slug;
    } else {
      const own = keySchema.safeParse(draft.document.slug);
      base = own.success ? own.data : slugify(titleOf(draft.document)) || 'procedure';
      slug = base;
    }

    const checked = validateDraft(draft.document, slug);
    if (!checked.ok) return { ok: false, reason: 'invalid', issues: checked.issues } as const;

    if (!draft.basedOn) {
      const taken = new Set((await tx.select({ slug: procedures.slug }).from(procedures).where(like(procedures.slug, `${base}%`))).map((t) => t.slug));
      // Reserve the slug for this user; a publisher who took it meanwhile makes the insert do nothing, so try the next.
      for (;;) {
        slug = uniqueSlug(base, (s) => taken.has(s));
        const reserved = await tx
          .insert(procedures)
          .values({ slug, createdBy: user.id })
          .onConflictDoNothing({ target: procedures.slug })
          .returning({ id: procedures.id });
        if (reserved.length > 0) break;
        taken.add(slug);
      }
    }
    const result = await publishProcedure(tx, { ...checked.procedure, slug }, user.id);
    if (!result.ok) return { ok: false, reason: 'invalid', issues: result.issues } as const;
    await tx.delete(procedureDrafts).where(eq(procedureDrafts.id, draft.id));
    return result;
  });
}

export interface OwnedProcedure {
  slug: string;
  title: string;
  version: number;
  publishedAt: Date;
  createdBy: string | null;
}

/** Procedures at their latest version: those the user created, or all of them for an admin. */
export async function listOwnedProcedures(user: SessionUser): Promise<OwnedProcedure[]> {
  const owned = user.role === 'admin'
    ? await db.select({ id: procedures.id }).from(procedures)
    : await db.select({ id: procedures.id }).from(procedures).where(eq(procedures.createdBy, user.id));
  if (owned.length === 0) return [];
  return db
    .selectDistinctOn([procedures.slug], {
      slug: procedures.slug,
      title: procedureVersions.title,
      version: procedureVersions.version,
      publishedAt: procedureVersions.publishedAt,
      createdBy: procedures.createdBy,
    })
    .from(procedureVersions)
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .where(inArray(procedures.id, owned.map((o) => o.id)))
    .orderBy(procedures.slug, desc(procedureVersions.version));
}
