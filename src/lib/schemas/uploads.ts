import { z } from 'zod';
import { CAPTION_MAX } from '../uploads/views';

const procedureSlug = z
  .string({ required_error: 'Name the procedure (its slug)' })
  .trim()
  .min(1, 'Name the procedure (its slug)')
  .max(64, 'A procedure slug is at most 64 characters');

export const UPLOAD_PURPOSES = ['bench-photo', 'procedure-reference'] as const;
export type UploadPurpose = (typeof UPLOAD_PURPOSES)[number];

/** A reference file's caption: blank means none (the file name shows instead). */
export const captionSchema = z
  .string({ invalid_type_error: 'A caption is text' })
  .trim()
  .max(CAPTION_MAX, `A caption is at most ${CAPTION_MAX} characters`)
  .transform((text) => (text === '' ? null : text));

/**
 * The text fields of POST /api/uploads (multipart/form-data); the file itself is checked apart.
 * bench-photo: a learner's photo of their work; procedure-reference: a file attached to a procedure,
 * which may carry a caption.
 */
export const uploadFieldsSchema = z
  .object({
    purpose: z.enum(UPLOAD_PURPOSES, { errorMap: () => ({ message: 'purpose must be "bench-photo" or "procedure-reference"' }) }),
    procedure: procedureSlug,
    caption: captionSchema.optional(),
  })
  .refine((f) => f.purpose === 'procedure-reference' || f.caption == null, {
    path: ['caption'],
    message: 'Only a reference file takes a caption',
  });

/** PATCH /api/uploads/:id for a reference file: its caption, or null (or blank) for none. */
export const captionUpdateSchema = z.object({ caption: captionSchema.nullable() }).strict();

/** GET /api/me/uploads?procedure=slug (the filter is optional). */
export const uploadListQuerySchema = z.object({ procedure: procedureSlug.optional() });
