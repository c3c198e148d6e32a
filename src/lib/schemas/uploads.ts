import { z } from 'zod';

const procedureSlug = z
  .string({ required_error: 'Name the procedure the photo shows (its slug)' })
  .trim()
  .min(1, 'Name the procedure the photo shows (its slug)')
  .max(64, 'A procedure slug is at most 64 characters');

/** The text fields of POST /api/uploads (multipart/form-data); the file itself is checked apart. */
export const uploadFieldsSchema = z.object({
  // Only bench photos are uploaded by learners; reference files come with the procedure editor.
  purpose: z.literal('bench-photo', { errorMap: () => ({ message: 'purpose must be "bench-photo"' }) }),
  procedure: procedureSlug,
});

/** GET /api/me/uploads?procedure=slug (the filter is optional). */
export const uploadListQuerySchema = z.object({ procedure: procedureSlug.optional() });
