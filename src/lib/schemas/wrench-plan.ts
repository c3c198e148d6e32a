import { z } from 'zod';
import { LENGTH_UNIT_IDS, torqueUnitSchema } from '../procedure/schema';

// The calculator page's form, as typed: numbers arrive as text ("12,5" is read as 12.5) and blanks
// mean "not given". Errors are keyed by the field that caused them.

const typedNumber = (label: string) =>
  z.string().transform((text, ctx) => {
    const trimmed = text.trim().replace(',', '.');
    if (trimmed === '') return undefined;
    const value = Number(trimmed);
    if (!Number.isFinite(value)) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, message: `${label} must be a number` });
      return z.NEVER;
    }
    return value;
  });

/** "30, 60, 100" or "30 60 100 %" → [30, 60, 100]. */
const percentList = z.string().transform((text, ctx) => {
  const parts = text.replace(/%/g, ' ').split(/[\s,;/]+/).filter(Boolean);
  const values = parts.map(Number);
  if (parts.length === 0) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, message: 'Give at least one pass, e.g. 100' });
    return z.NEVER;
  }
  const bad = parts.find((p, i) => !Number.isFinite(values[i]) || values[i]! <= 0 || values[i]! > 100);
  if (bad !== undefined) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, message: `"${bad}" is not a percentage above 0 and at most 100` });
    return z.NEVER;
  }
  if (values.some((v, i) => i > 0 && v <= values[i - 1]!)) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, message: 'Each pass must be tighter than the one before' });
    return z.NEVER;
  }
  if (values[values.length - 1] !== 100) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, message: 'The last pass brings every bolt to the full spec: end with 100' });
    return z.NEVER;
  }
  return values;
});

export const wrenchPlanFormSchema = z
  .object({
    torque: typedNumber('The torque spec'),
    unit: torqueUnitSchema,
    dialUnit: torqueUnitSchema,
    wrenchLength: typedNumber('The wrench length'),
    extension: typedNumber('The extension'),
    lengthUnit: z.enum(LENGTH_UNIT_IDS),
    direction: z.enum(['forward', 'back']),
    passes: percentList,
    dialResolution: typedNumber('The dial mark'),
  })
  .superRefine((form, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: z.ZodIssueCode.custom, path: [path], message });
    if (form.torque === undefined) issue('torque', 'Give the torque spec');
    else if (form.torque <= 0) issue('torque', 'The torque spec must be above zero');
    if (form.wrenchLength !== undefined && form.wrenchLength <= 0) issue('wrenchLength', 'The wrench length must be above zero');
    if (form.extension !== undefined && form.extension < 0) issue('extension', 'The extension cannot be negative');
    if (form.extension && form.wrenchLength === undefined) issue('wrenchLength', 'An extension needs the wrench length (grip to drive)');
    if (form.direction === 'back' && form.extension && form.wrenchLength && form.extension >= form.wrenchLength) {
      issue('extension', 'An adapter pointing back must be shorter than the wrench');
    }
    if (form.dialResolution !== undefined && form.dialResolution <= 0) issue('dialResolution', 'The dial mark must be above zero');
  });

export type WrenchPlanForm = z.input<typeof wrenchPlanFormSchema>;
