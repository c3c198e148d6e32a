import { z } from 'zod';
import { STAGES, stageSchema } from '../procedure/schema';

// Requests that make and change a drill. The due date is an instant (ISO 8601 with its offset): the
// instructor's browser turns the local date and time they picked into one, so no server guesses a zone.

export const MAX_ATTEMPT_LIMIT = 20;

const stagesField = z
  .array(stageSchema, { required_error: 'Pick at least one stage', invalid_type_error: 'Pick at least one stage' })
  .min(1, 'Pick at least one stage')
  // Kept in the trainer's order, each stage once, however the form sent them.
  .transform((picked) => STAGES.filter((s) => picked.includes(s)));

const dueAtField = z
  .string({ required_error: 'A due date is required', invalid_type_error: 'Give the due date as a date and time' })
  .datetime({ offset: true, message: 'Give the due date as a date and time (ISO 8601, e.g. 2030-05-01T15:00:00Z)' })
  .transform((text) => new Date(text));

const passMarkField = z
  .number({ required_error: 'A pass mark is required', invalid_type_error: 'The pass mark is a number from 1 to 100' })
  .int('The pass mark is a whole percent')
  .min(1, 'The pass mark is at least 1 %')
  .max(100, 'The pass mark is at most 100 %');

const attemptLimitField = z
  .number({ invalid_type_error: 'The attempt limit is a whole number, or empty for no limit' })
  .int('The attempt limit is a whole number')
  .min(1, 'Allow at least 1 attempt, or leave it empty for no limit')
  .max(MAX_ATTEMPT_LIMIT, `At most ${MAX_ATTEMPT_LIMIT} attempts per stage; leave it empty for no limit`)
  .nullable();

const answersAfterDueField = z.boolean({ invalid_type_error: 'answersAfterDue is true or false' });

const PAST_DUE = 'The due date has already passed: pick a later one';

/** A new due date must lie ahead; `now` is passed in so the rule stays pure and testable. */
export const isAhead = (dueAt: Date, now: Date) => dueAt.getTime() > now.getTime();

/** POST /api/classes/:id/drills. */
export function createDrillSchema(now: Date) {
  return z.object({
    procedure: z.string({ required_error: 'Pick a procedure' }).trim().min(1, 'Pick a procedure').max(64),
    /** The version to pin; the latest published one when left out. */
    version: z.number().int().min(1, 'A version number starts at 1').optional(),
    stages: stagesField,
    dueAt: dueAtField.refine((d) => isAhead(d, now), PAST_DUE),
    passMarkPct: passMarkField,
    attemptLimit: attemptLimitField.default(null),
    answersAfterDue: answersAfterDueField.default(false),
  });
}
export type CreateDrillInput = z.infer<ReturnType<typeof createDrillSchema>>;

/**
 * PATCH /api/drills/:id: any of the editable fields; `closed: true` closes the drill (its attempts stay),
 * `closed: false` opens it again. The procedure version stays pinned: a drill never changes what it asks.
 */
export const updateDrillSchema = z
  .object({
    stages: stagesField.optional(),
    dueAt: dueAtField.optional(),
    passMarkPct: passMarkField.optional(),
    attemptLimit: attemptLimitField.optional(),
    answersAfterDue: answersAfterDueField.optional(),
    closed: z.boolean({ invalid_type_error: 'closed is true or false' }).optional(),
  })
  .strict('Only stages, dueAt, passMarkPct, attemptLimit, answersAfterDue and closed can change; the procedure stays pinned')
  .refine((change) => Object.values(change).some((v) => v !== undefined), 'Nothing to change: send at least one field');
export type UpdateDrillInput = z.infer<typeof updateDrillSchema>;

/**
 * An edited due date must lie ahead, but an unchanged one may have passed: an overdue drill can still
 * get a new pass mark or be closed with the form that sends every field.
 */
export function dueAtChangeError(next: Date | undefined, current: Date, now: Date): string | null {
  if (next === undefined || next.getTime() === current.getTime()) return null;
  return isAhead(next, now) ? null : PAST_DUE;
}
