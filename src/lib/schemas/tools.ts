import { z } from 'zod';
import { LENGTH_UNIT_IDS } from '../procedure/schema';
import { parseTorqueUnit } from '../torque';

// Units arrive as people type them ("ft-lb", "Nm", "in·lbf"); each is read to one of our unit ids.
const torqueUnit = z
  .string({ required_error: 'Give a torque unit' })
  .transform((label, ctx) => {
    const unit = parseTorqueUnit(label);
    if (!unit) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, message: `"${label}" is not a torque unit (use N·m, in·lbf, ft·lbf or kgf·m)` });
      return z.NEVER;
    }
    return unit;
  });

/** POST /api/tools/wrench-setting */
export const wrenchSettingRequestSchema = z.object({
  torque: z.number({ required_error: 'Give the torque spec', invalid_type_error: 'torque must be a number' }).positive('torque must be above zero').finite(),
  unit: torqueUnit,
  toUnit: torqueUnit,
  wrenchLength: z.number().positive('wrenchLength must be above zero').finite().optional(),
  extension: z.number().min(0, 'extension cannot be negative').finite().optional(),
  lengthUnit: z.enum(LENGTH_UNIT_IDS).optional(),
  direction: z.enum(['forward', 'back']).optional(),
});
