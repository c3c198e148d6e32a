import { z } from 'zod';
import { stageSchema } from '../procedure/schema';

/** POST /api/attempts. The answer's own shape is checked per stage by the scorer's schemas. */
export const attemptRequestSchema = z.object({
  procedure: z.string({ required_error: 'Name the procedure by its slug' }).min(1).max(64),
  /** The version the trainer loaded; the latest when left out. */
  version: z.number().int().min(1).optional(),
  stage: stageSchema,
  answer: z.unknown().refine((a) => a !== undefined, 'An answer is required'),
  clientId: z.string({ required_error: 'clientId is required' }).uuid('clientId must be a UUID'),
  /** The drill this attempt counts toward; the server checks the learner, the stage and the limit. */
  drillId: z.string().uuid('drillId must be the id of a drill').optional(),
});
export type AttemptRequest = z.infer<typeof attemptRequestSchema>;
