import { z } from 'zod';
import { procedureSchema, type Procedure } from '../procedure/schema';
import { validateProcedure, type Issue } from '../procedure/validate';

// Our own file format for moving a procedure between installations: a marker, a format version and
// the whole document (answer key included). docs/procedure.schema.json describes it as JSON Schema.

export const EXCHANGE_FORMAT = 'benchwright-procedure';
export const EXCHANGE_FORMAT_VERSION = 1;

export const exchangeFileSchema = z.object({
  /** Where the JSON Schema for this file lives (editors use it to check and complete the file). */
  $schema: z.string().optional(),
  format: z.literal(EXCHANGE_FORMAT),
  formatVersion: z.literal(EXCHANGE_FORMAT_VERSION),
  procedure: procedureSchema,
});
export type ExchangeFile = z.infer<typeof exchangeFileSchema>;

/** The file for a procedure, ready for JSON.stringify. */
export function toExchangeFile(procedure: Procedure, schemaUrl?: string): ExchangeFile {
  return {
    ...(schemaUrl ? { $schema: schemaUrl } : {}),
    format: EXCHANGE_FORMAT,
    formatVersion: EXCHANGE_FORMAT_VERSION,
    procedure: structuredClone(procedure),
  };
}

/** File name for a download: the slug and version. */
export function exchangeFileName(procedure: Pick<Procedure, 'slug' | 'version'>): string {
  return `${procedure.slug}-v${procedure.version}.benchwright.json`;
}

export type ImportResult = { ok: true; procedure: Procedure } | { ok: false; issues: Issue[] };

/**
 * Reads an imported file: the whole file checked against the format, then the procedure against every
 * rule of validateProcedure. Every problem is reported with its path in the file (e.g. "procedure.steps.3.after").
 */
export function readExchangeFile(input: unknown): ImportResult {
  const file = exchangeFileSchema.safeParse(input);
  if (!file.success) {
    return { ok: false, issues: file.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message })) };
  }
  const checked = validateProcedure(file.data.procedure);
  if (!checked.ok) {
    return { ok: false, issues: checked.issues.map((i) => ({ path: i.path ? `procedure.${i.path}` : 'procedure', message: i.message })) };
  }
  return { ok: true, procedure: checked.procedure };
}
