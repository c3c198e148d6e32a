import { z } from 'zod';
import type { Procedure } from '../procedure/schema';
import { validateProcedure, type ValidationResult } from '../procedure/validate';
import { slugify } from './slug';

// What a procedure draft is before and after the editor: any JSON object while it is being built
// (checked loosely when saved), the full procedure document when it is published.

/** Saved drafts: an object of at most this many bytes as JSON; everything else is checked at publish. */
export const DRAFT_MAX_BYTES = 256 * 1024;

export const draftSaveSchema = z.object({
  document: z.record(z.string(), z.unknown()),
  /** The revision the editor loaded or last saved; a different stored revision means another window saved since. */
  revision: z.number().int().min(1),
});
export type DraftSave = z.infer<typeof draftSaveSchema>;

export const newDraftSchema = z.object({
  /** Slug of a procedure of yours: the draft becomes its next version. Without it, a new procedure. */
  basedOn: z.string().min(1).max(64).optional(),
});

/** A new, empty procedure: the standard first stage and the engine of the part library. */
export function blankDocument(): Record<string, unknown> {
  return {
    title: '',
    engine: { key: 'wren-160', name: 'Wren 160' },
    summary: '',
    cautions: [],
    demoValues: false,
    stages: ['order'],
    parts: [],
    anchors: [],
    steps: [],
    pinSeats: [],
    fastenerGroups: [],
  };
}

/** A variant of a published procedure: same content, "(copy)" in the title, a new slug when published. */
export function cloneDocument(procedure: Procedure): Record<string, unknown> {
  const { slug: _slug, version: _version, ...rest } = structuredClone(procedure);
  const title = `${procedure.title} (copy)`;
  return { ...rest, title: title.length > 120 ? `${procedure.title.slice(0, 113)} (copy)` : title };
}

/** The draft for a new version of a published procedure: its latest document, less the version number. */
export function editDocument(procedure: Procedure): Record<string, unknown> {
  const { version: _version, ...rest } = structuredClone(procedure);
  return rest;
}

/** The slug a draft is checked under before it has one: the one the title would give. */
export function provisionalSlug(document: Record<string, unknown>): string {
  if (typeof document.slug === 'string' && document.slug) return document.slug;
  return slugify(typeof document.title === 'string' ? document.title : '') || 'untitled';
}

/** Full validation of a draft as it would be published (slug and version are the server's to set). */
export function validateDraft(document: Record<string, unknown>, slug = provisionalSlug(document)): ValidationResult {
  return validateProcedure({ ...document, slug, version: 1 });
}
