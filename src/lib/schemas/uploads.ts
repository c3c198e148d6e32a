import { z } from 'zod';

const procedureSlug = z
  .string({ required_error: 'Name the procedure (its slug)' })
  .trim()
  .min(1, 'Name the procedure (its slug)')
  .max(64, 'A procedure slug is at most 64 characters');

export const UPLOAD_PURPOSES = ['bench-photo', 'procedure-reference'] as const;
export type UploadPurpose = (typeof UPLOAD_PURPOSES)[number];

/**
 * The text fields of POST /api/uploads (multipart/form-data); the file itself is checked apart.
 * bench-photo: a learner's photo of their work; procedure-reference: a file attached to a procedure.
 */
export const uploadFieldsSchema = z.object({
  purpose: z.enum(UPLOAD_PURPOSES, { errorMap: () => ({ message: 'purpose must be "bench-photo" or "procedure-reference"' }) }),
  procedure: procedureSlug,
});

/** GET /api/me/uploads?procedure=slug (the filter is optional). */
export const uploadListQuerySchema = z.object({ procedure: procedureSlug.optional() });
