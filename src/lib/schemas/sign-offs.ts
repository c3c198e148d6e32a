import { z } from 'zod';

export const SIGN_OFF_OUTCOMES = ['pass', 'redo'] as const;
export type SignOffOutcome = (typeof SIGN_OFF_OUTCOMES)[number];
export const MAX_SIGN_OFF_NOTES = 2000;
export const MAX_SIGN_OFF_PHOTOS = 12;
/** Earlier dates are taken for typos (0205 for 2025), not old bench work. */
export const EARLIEST_BENCH_DATE = '2000-01-01';

/** Calendar dates as YYYY-MM-DD, checked to exist (no 2025-02-30). */
export function isCalendarDate(value: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  const date = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(date.getTime()) && date.toISOString().slice(0, 10) === value;
}

/**
 * The latest bench date that is not in the future for somebody: the date at UTC+14, the earliest
 * time zone. An instructor's "today" is never refused, wherever the server's clock says it is.
 */
export function latestBenchDate(now: Date): string {
  return new Date(now.getTime() + 14 * 3600_000).toISOString().slice(0, 10);
}

/** POST /api/classes/:id/sign-offs; `now` decides what "in the future" means. */
export function signOffRequestSchema(now: Date) {
  const latest = latestBenchDate(now);
  return z.object({
    learnerId: z.string({ required_error: 'Choose the learner' }).trim().min(1, 'Choose the learner').max(100),
    procedure: z.string({ required_error: 'Choose the procedure' }).trim().min(1, 'Choose the procedure').max(64),
    benchDate: z
      .string({ required_error: 'Give the bench date' })
      .trim()
      .refine(isCalendarDate, 'Give the bench date as YYYY-MM-DD')
      .refine((d) => !isCalendarDate(d) || d <= latest, 'The bench date cannot be in the future')
      .refine((d) => !isCalendarDate(d) || d >= EARLIEST_BENCH_DATE, `The bench date cannot be before ${EARLIEST_BENCH_DATE}`),
    outcome: z.enum(SIGN_OFF_OUTCOMES, { errorMap: () => ({ message: 'Choose pass or redo' }) }),
    notes: z.string().trim().max(MAX_SIGN_OFF_NOTES, `Notes are at most ${MAX_SIGN_OFF_NOTES} characters`).default(''),
    photoIds: z
      .array(z.string().uuid('Each photo id must be a UUID'))
      .max(MAX_SIGN_OFF_PHOTOS, `At most ${MAX_SIGN_OFF_PHOTOS} photos on one sign-off`)
      .default([])
      .transform((ids) => [...new Set(ids)]),
  });
}
export type SignOffRequest = z.infer<ReturnType<typeof signOffRequestSchema>>;

/** GET /api/classes/:id/sign-offs?learner=…&procedure=…&latest=true (all optional). */
export const signOffListQuerySchema = z.object({
  learner: z.string().trim().min(1).max(100).optional(),
  procedure: z.string().trim().min(1).max(64).optional(),
  /** Only the latest sign-off per learner and procedure. */
  latest: z.enum(['true', 'false'], { errorMap: () => ({ message: 'latest is true or false' }) }).optional(),
});

/** GET /api/classes/:id/bench-photos?learner=…&procedure=… (both required). */
export const benchPhotoQuerySchema = z.object({
  learner: z.string({ required_error: 'Choose the learner' }).trim().min(1, 'Choose the learner').max(100),
  procedure: z.string({ required_error: 'Choose the procedure' }).trim().min(1, 'Choose the procedure').max(64),
});
