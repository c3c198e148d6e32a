import { z } from 'zod';
import { isTimeZone } from '../rework/progress';

// Requests of the rework and progress endpoints.

/** What the learner picked for one rework question. */
export const reworkAnswerSchema = z.object({
  /** The id of the chosen choice, as the question listed it. */
  choice: z.string().min(1).max(100),
  /** The question's variant, sent back so the server judges the very question shown. */
  variant: z.number().int().min(0).max(999_999),
  /** The learner opened the hint before answering. */
  hinted: z.boolean().default(false),
});
export type ReworkAnswer = z.infer<typeof reworkAnswerSchema>;

export const reworkAnswerRequestSchema = z.object({
  answer: reworkAnswerSchema,
  clientId: z.string().uuid('clientId must be a UUID'),
});
export type ReworkAnswerRequest = z.infer<typeof reworkAnswerRequestSchema>;

/** ?tz=Area/City: the learner's time zone for days and streaks; UTC when left out. */
export const timeZoneSchema = z
  .string()
  .refine(isTimeZone, { message: 'tz must be a time zone name such as Europe/Oslo or UTC' })
  .default('UTC');
