import { z } from 'zod';

// The stored procedure document. One schema serves the server (validation, scoring),
// the editor and the JSON export, so every rule about the document lives here or in validate.ts.

export const STAGES = ['order', 'pins', 'pattern', 'wrench', 'final-check'] as const;
export const stageSchema = z.enum(STAGES);
export type Stage = z.infer<typeof stageSchema>;

export const TORQUE_UNIT_IDS = ['N·m', 'in·lbf', 'ft·lbf', 'kgf·m'] as const;
export const torqueUnitSchema = z.enum(TORQUE_UNIT_IDS);
export type TorqueUnit = z.infer<typeof torqueUnitSchema>;

export const LENGTH_UNIT_IDS = ['in', 'mm'] as const;
export const lengthUnitSchema = z.enum(LENGTH_UNIT_IDS);
export type LengthUnit = z.infer<typeof lengthUnitSchema>;

const key = z
  .string()
  .min(1)
  .max(64)
  .regex(/^[a-z0-9][a-z0-9-]*$/, 'use lower-case letters, digits and dashes');
/** Keys of parts, anchors, steps, groups and bolts, and slugs (named so the JSON Schema can refer to it). */
export const keySchema = key;

export const vec3Schema = z.tuple([z.number().finite(), z.number().finite(), z.number().finite()]);
export type Vec3 = z.infer<typeof vec3Schema>;

export const PART_KINDS = [
  'block', 'cover', 'gasket', 'dowel-pin', 'sleeve', 'bolt', 'nut', 'washer', 'key',
  'gear', 'shaft', 'seal', 'flywheel', 'head', 'spark-plug', 'tool', 'consumable',
] as const;

export const partSchema = z.object({
  key,
  name: z.string().min(1).max(80),
  kind: z.enum(PART_KINDS),
  /** Key of a model in models/ the trainer draws this part with. */
  model: key,
  /** How many of this part the kit holds (bolts come in sets). */
  count: z.number().int().min(1).max(64).default(1),
  /** Dowel pins and sleeves: diameter × length in millimetres. */
  pin: z.object({ diameterMm: z.number().positive(), lengthMm: z.number().positive() }).optional(),
  /** A decoy sits in the kit but must not be used. */
  decoy: z.boolean().default(false),
});
export type Part = z.infer<typeof partSchema>;

export const ANCHOR_KINDS = ['locating-hole', 'threaded-hole', 'bearing', 'keyway', 'shaft-end'] as const;

export const anchorSchema = z.object({
  key,
  /** Part key the anchor sits on. */
  part: key,
  kind: z.enum(ANCHOR_KINDS),
  /** Position in the assembled engine's frame, metres. */
  position: vec3Schema,
  sizeMm: z.number().positive(),
});
export type Anchor = z.infer<typeof anchorSchema>;

export const stepSchema = z.object({
  key,
  text: z.string().min(1).max(200),
  /** Parts the step acts on (an action such as "apply assembly lube" may name a consumable). */
  parts: z.array(key).default([]),
  caution: z.string().max(300).optional(),
  /** Precedence: keys of steps that must be done before this one. */
  after: z.array(key).default([]),
});
export type Step = z.infer<typeof stepSchema>;

/** Which pin (part key) belongs in which locating hole (anchor key). */
export const pinSeatSchema = z.object({ part: key, anchor: key });
export type PinSeat = z.infer<typeof pinSeatSchema>;

export const torqueSpecSchema = z.object({
  value: z.number().positive(),
  unit: torqueUnitSchema,
  /** Accepted deviation, percent of value (either side). */
  tolerancePct: z.number().min(0).max(25),
});
export type TorqueSpec = z.infer<typeof torqueSpecSchema>;

export const PATTERN_RULES = ['cross', 'opposite'] as const;

export const fastenerGroupSchema = z.object({
  key,
  name: z.string().min(1).max(80),
  /** The bolt (or nut) part the group uses. */
  part: key,
  /** Bolt axis: the pattern is judged in the plane normal to it. */
  axis: vec3Schema,
  /** One entry per fastener: its key and the threaded hole (anchor) it goes into. */
  bolts: z.array(z.object({ key, anchor: key })).min(1),
  torque: torqueSpecSchema,
  /** Fractions of the final torque, rising, ending at 1. */
  passes: z.array(z.number().gt(0).max(1)).min(1),
  /** cross: star pattern for bolts on a circle; opposite: across the centroid, middle out. */
  rule: z.enum(PATTERN_RULES),
});
export type FastenerGroup = z.infer<typeof fastenerGroupSchema>;

/** What the Wrench stage hands the learner: which spec, and the wrench on the bench. */
export const wrenchTaskSchema = z.object({
  group: key,
  dialUnit: torqueUnitSchema,
  wrenchLength: z.number().positive(),
  extension: z.number().min(0).default(0),
  lengthUnit: lengthUnitSchema,
  /** forward: extension lengthens the lever (L+E); back: adapter points back at the handle (L−E). */
  direction: z.enum(['forward', 'back']).default('forward'),
  /** The unit the spec is shown to the learner in (may differ from the dial). */
  specShownIn: torqueUnitSchema,
});
export type WrenchTask = z.infer<typeof wrenchTaskSchema>;

export const finalCheckSchema = z.object({
  fastenerCount: z.number().int().min(0),
  crankTurns: z.number().int().min(0),
});

export const procedureSchema = z.object({
  slug: key,
  title: z.string().min(1).max(120),
  version: z.number().int().min(1),
  engine: z.object({ key, name: z.string().min(1).max(80) }),
  summary: z.string().max(500).default(''),
  /** Shown beside the scene before the first stage. */
  cautions: z.array(z.string().min(1).max(300)).min(1),
  /** True when the numbers are demo values for a fictional engine. */
  demoValues: z.boolean().default(false),
  stages: z.array(stageSchema).min(1),
  parts: z.array(partSchema).min(1),
  anchors: z.array(anchorSchema).default([]),
  steps: z.array(stepSchema).min(1),
  pinSeats: z.array(pinSeatSchema).default([]),
  fastenerGroups: z.array(fastenerGroupSchema).default([]),
  wrench: wrenchTaskSchema.optional(),
  finalCheck: finalCheckSchema.optional(),
});
export type Procedure = z.infer<typeof procedureSchema>;
export type ProcedureInput = z.input<typeof procedureSchema>;
