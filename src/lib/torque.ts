import { TORQUE_UNIT_IDS, type TorqueUnit } from './procedure/schema';

// Torque units as force × lever length, with factors exact from their definitions
// (lb = 0.45359237 kg, g_n = 9.80665 m/s², ft = 0.3048 m, in = 0.0254 m).

const STANDARD_GRAVITY = 9.80665;
const POUND_KG = 0.45359237;
const INCH_M = 0.0254;

type Force = 'N' | 'lbf' | 'kgf';
type Length = 'm' | 'ft' | 'in';

const NEWTONS_PER: Record<Force, number> = {
  N: 1,
  lbf: POUND_KG * STANDARD_GRAVITY,
  kgf: STANDARD_GRAVITY,
};

// Lengths counted in inches so that ft ↔ in is exactly 12 (17 ft·lbf gives 204 in·lbf, not 204.00000000000003).
const INCHES_PER: Record<Length, number> = {
  m: 1 / INCH_M,
  ft: 12,
  in: 1,
};

const PARTS: Record<TorqueUnit, { force: Force; length: Length }> = {
  'N·m': { force: 'N', length: 'm' },
  'in·lbf': { force: 'lbf', length: 'in' },
  'ft·lbf': { force: 'lbf', length: 'ft' },
  'kgf·m': { force: 'kgf', length: 'm' },
};

export function isTorqueUnit(value: unknown): value is TorqueUnit {
  return typeof value === 'string' && (TORQUE_UNIT_IDS as readonly string[]).includes(value);
}

/** How many `to` units one `from` unit is. */
export function torqueFactor(from: TorqueUnit, to: TorqueUnit): number {
  if (from === to) return 1;
  const a = PARTS[from];
  const b = PARTS[to];
  // Same-force and same-length ratios are exactly 1, so the common conversions stay exact.
  const force = a.force === b.force ? 1 : NEWTONS_PER[a.force] / NEWTONS_PER[b.force];
  const length = a.length === b.length ? 1 : INCHES_PER[a.length] / INCHES_PER[b.length];
  return force * length;
}

export function convertTorque(value: number, from: TorqueUnit, to: TorqueUnit): number {
  return value * torqueFactor(from, to);
}

// Spellings people type, compared after lower-casing and dropping spaces, dots, dashes and products.
const ALIASES: Record<TorqueUnit, readonly string[]> = {
  'N·m': ['nm', 'newtonmetre', 'newtonmetres', 'newtonmeter', 'newtonmeters'],
  'in·lbf': [
    'inlbf', 'inlb', 'inlbs', 'lbfin', 'lbin', 'lbsin', 'inchpound', 'inchpounds', 'inchpoundforce',
    'poundinch', 'poundinches', 'poundforceinch',
  ],
  'ft·lbf': [
    'ftlbf', 'ftlb', 'ftlbs', 'lbfft', 'lbft', 'lbsft', 'footpound', 'footpounds', 'footpoundforce',
    'poundfoot', 'poundfeet', 'poundforcefoot',
  ],
  'kgf·m': ['kgfm', 'kgm', 'mkgf', 'mkg', 'kilogramforcemetre', 'kilogramforcemeter', 'kilogrammetre', 'kilogrammeter'],
};

const ALIAS_TO_UNIT = new Map<string, TorqueUnit>(
  (Object.entries(ALIASES) as [TorqueUnit, readonly string[]][]).flatMap(([unit, names]) =>
    names.map((name) => [name, unit] as const),
  ),
);

/** 'Nm', 'in-lb', 'lbf·ft', 'kgf·m' … → a unit id, or null when the label is not a torque unit. */
export function parseTorqueUnit(label: string): TorqueUnit | null {
  if (typeof label !== 'string') return null;
  if (isTorqueUnit(label)) return label;
  // '/' is kept on purpose: 'lbf/in' is a stiffness, not a torque.
  const compact = label
    .normalize('NFKC')
    .toLowerCase()
    .replace(/[\s.·⋅∙•*×_\-‐‑–]/g, '');
  return ALIAS_TO_UNIT.get(compact) ?? null;
}

/** Decimal places a dial resolution needs (0.5 → 1, 0.25 → 2, 2 → 0). */
export function decimalsOf(resolution: number): number {
  for (let d = 0; d <= 10; d++) {
    const scaled = resolution * 10 ** d;
    if (Math.abs(scaled - Math.round(scaled)) < 1e-9 * Math.max(1, scaled)) return d;
  }
  return 10;
}

/** Rounds to the nearest mark of a dial with the given resolution (e.g. 214.29 at 0.5 → 214.5). */
export function roundToResolution(value: number, resolution: number): number {
  if (!(resolution > 0) || !Number.isFinite(resolution)) {
    throw new RangeError('resolution must be a positive number');
  }
  const marks = Math.round(value / resolution);
  // toFixed drops the binary noise that multiplying back by 0.1 or 0.25 leaves behind.
  return Number((marks * resolution).toFixed(decimalsOf(resolution)));
}

/** A number for people: `significant` figures but never fewer than the whole part (2034.6 → 2035, 0.11298 → 0.113). */
export function formatNumber(value: number, significant = 4): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.min(12, Math.max(0, significant - 1 - magnitude));
  const text = value.toFixed(decimals);
  const trimmed = text.includes('.') ? text.replace(/\.?0+$/, '') : text;
  return trimmed === '-0' ? '0' : trimmed;
}

/** '214.3 in·lbf'; with a resolution, the value as the dial shows it ('214.5 in·lbf' at 0.5). */
export function formatTorque(value: number, unit: TorqueUnit, resolution?: number): string {
  if (resolution === undefined) return `${formatNumber(value)} ${unit}`;
  return `${roundToResolution(value, resolution).toFixed(decimalsOf(resolution))} ${unit}`;
}
