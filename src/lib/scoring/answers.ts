import { z } from 'zod';
import { torqueUnitSchema, type Stage } from '../procedure/schema';

// What a learner submits for each stage. Keys are plain strings, not the procedure's key pattern:
// a wrong or unknown key is a mistake to score and explain, not a malformed request.

const entry = z.string().min(1).max(100);

export const orderAnswerSchema = z.object({
  sequence: z.array(entry).max(256),
});
export type OrderAnswer = z.infer<typeof orderAnswerSchema>;

export const pinsAnswerSchema = z.object({
  placements: z.array(z.object({ part: entry, anchor: entry })).max(128),
});
export type PinsAnswer = z.infer<typeof pinsAnswerSchema>;

export const patternAnswerSchema = z.object({
  /** The fastener group this answer is for; the procedure's first group when left out. */
  group: entry.optional(),
  passes: z
    .array(z.object({ torque: z.number().finite().min(0), sequence: z.array(entry).max(128) }))
    .min(1)
    .max(12),
});
export type PatternAnswer = z.infer<typeof patternAnswerSchema>;

export const wrenchAnswerSchema = z.object({
  setting: z.number().finite(),
  unit: torqueUnitSchema,
});
export type WrenchAnswer = z.infer<typeof wrenchAnswerSchema>;

export const finalCheckAnswerSchema = z.object({
  fastenersCounted: z.number().int().min(0).max(1000),
  crankTurns: z.number().finite().min(0).max(1000),
  leftover: z.number().int().min(0).max(1000).optional(),
});
export type FinalCheckAnswer = z.infer<typeof finalCheckAnswerSchema>;

export const answerSchemas = {
  order: orderAnswerSchema,
  pins: pinsAnswerSchema,
  pattern: patternAnswerSchema,
  wrench: wrenchAnswerSchema,
  'final-check': finalCheckAnswerSchema,
} as const satisfies Record<Stage, z.ZodTypeAny>;
