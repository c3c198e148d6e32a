import { z } from 'zod';
import { torqueUnitSchema } from '../procedure/schema';

// A learner's work in progress on a procedure version, saved as they go. Mirrors the trainer's Drafts
// (src/components/trainer/store.ts); every stage is optional, and partial work is normal.

const key = z.string().min(1).max(100);

export const draftsSchema = z
  .object({
    order: z.object({ sequence: z.array(key).max(256) }),
    pins: z.object({ placements: z.array(z.object({ part: key, anchor: key })).max(128) }),
    pattern: z.object({
      group: z.string().max(100),
      passes: z.array(z.object({ torque: z.number().finite().nullable(), sequence: z.array(key).max(128) })).max(12),
      activePass: z.number().int().min(0).max(11),
    }),
    wrench: z.object({ setting: z.number().finite().nullable(), unit: torqueUnitSchema }),
    'final-check': z.object({
      fastenersCounted: z.number().int().min(0).max(1000).nullable(),
      leftover: z.number().int().min(0).max(1000).nullable(),
      crankTurns: z.number().finite().min(0).max(1000),
    }),
  })
  .partial()
  .strict();

/** PUT /api/drafts/:procedure?version=N */
export const saveDraftSchema = z.object({
  drafts: draftsSchema,
  /** When the browser made this copy; the newer copy wins. */
  savedAt: z.string().datetime({ offset: true }),
});

export const MAX_DRAFT_BYTES = 64 * 1024;
