import type { LengthUnit, TorqueUnit } from './procedure/schema';
import { convertTorque, formatNumber, torqueFactor } from './torque';

// Dial setting of a torque wrench: convert the spec to the dial's unit, then compensate for an
// extension or adapter on the drive, which changes the lever the wrench's clicker does not see.

export type ExtensionDirection = 'forward' | 'back';

/** Raised when the wrench and extension cannot be used together (or a number is not usable). */
export class WrenchSetupError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'WrenchSetupError';
  }
}

export interface WrenchSettingInput {
  torque: number;
  unit: TorqueUnit;
  toUnit: TorqueUnit;
  wrenchLength?: number;
  extension?: number;
  lengthUnit?: LengthUnit;
  direction?: ExtensionDirection;
}

export interface WrenchSetting {
  setting: number;
  unit: TorqueUnit;
  /** The worked arithmetic, one line per step, in words a learner can follow. */
  steps: string[];
}

/** Why a wrench length and extension cannot work together, or null when they can. */
export function wrenchGeometryProblem(
  wrenchLength: number,
  extension: number,
  direction: ExtensionDirection = 'forward',
): string | null {
  if (!Number.isFinite(wrenchLength) || wrenchLength <= 0) {
    return 'the wrench length must be a positive number';
  }
  if (!Number.isFinite(extension) || extension < 0) {
    return 'the extension length must be zero or a positive number';
  }
  if (direction === 'back' && wrenchLength - extension <= 0) {
    // L − E ≤ 0 would put the drive behind the handle's pivot: the formula breaks down.
    return `an adapter pointing back must be shorter than the wrench (L − E = ${formatNumber(
      wrenchLength - extension,
    )}); this setup cannot be compensated`;
  }
  return null;
}

/** The multiply-or-divide step a learner would key into a calculator. */
function conversionStep(value: number, from: TorqueUnit, to: TorqueUnit): string {
  const factor = torqueFactor(from, to);
  const result = value * factor;
  const operation = factor >= 1 ? `× ${formatNumber(factor, 6)}` : `÷ ${formatNumber(1 / factor, 6)}`;
  return `${formatNumber(value)} ${from} ${operation} = ${formatNumber(result)} ${to}`;
}

export function wrenchSetting(input: WrenchSettingInput): WrenchSetting {
  const { torque, unit, toUnit, wrenchLength, lengthUnit = 'in', direction = 'forward' } = input;
  const extension = input.extension ?? 0;
  if (!Number.isFinite(torque) || torque <= 0) {
    throw new WrenchSetupError('the torque spec must be a positive number');
  }

  const steps: string[] = [];
  const converted = convertTorque(torque, unit, toUnit);
  if (unit === toUnit) {
    steps.push(`The spec is already in the dial's unit: ${formatNumber(torque)} ${unit}.`);
  } else {
    steps.push(`Convert the spec to the dial's unit: ${conversionStep(torque, unit, toUnit)}.`);
  }

  if (extension === 0) {
    if (wrenchLength !== undefined) {
      const problem = wrenchGeometryProblem(wrenchLength, 0, direction);
      if (problem) throw new WrenchSetupError(problem);
    }
    steps.push(`No extension, so the setting is the spec: ${formatNumber(converted)} ${toUnit}.`);
    return { setting: converted, unit: toUnit, steps };
  }

  if (wrenchLength === undefined) {
    throw new WrenchSetupError('an extension needs the wrench length to compensate for it');
  }
  const problem = wrenchGeometryProblem(wrenchLength, extension, direction);
  if (problem) throw new WrenchSetupError(problem);

  const L = formatNumber(wrenchLength);
  const E = formatNumber(extension);
  const T = formatNumber(converted);
  const sign = direction === 'forward' ? '+' : '−';
  const lever = direction === 'forward' ? wrenchLength + extension : wrenchLength - extension;
  const setting = (converted * wrenchLength) / lever;

  steps.push(
    direction === 'forward'
      ? `The extension (E = ${E} ${lengthUnit}) lengthens the wrench (L = ${L} ${lengthUnit}) to L + E = ${formatNumber(lever)} ${lengthUnit}, so the wrench must click early.`
      : `The adapter (E = ${E} ${lengthUnit}) points back toward the handle and shortens the wrench (L = ${L} ${lengthUnit}) to L − E = ${formatNumber(lever)} ${lengthUnit}, so the wrench must click late.`,
  );
  steps.push(
    `setting = T × L / (L ${sign} E) = ${T} × ${L} / (${L} ${sign} ${E}) = ${formatNumber(setting)} ${toUnit}`,
  );
  return { setting, unit: toUnit, steps };
}

/** The torque that reaches the fastener when the wrench clicks at `setting` (the reverse of wrenchSetting). */
export function appliedTorque(
  setting: number,
  wrenchLength: number,
  extension: number,
  direction: ExtensionDirection = 'forward',
): number {
  const problem = wrenchGeometryProblem(wrenchLength, extension, direction);
  if (problem) throw new WrenchSetupError(problem);
  const lever = direction === 'forward' ? wrenchLength + extension : wrenchLength - extension;
  return (setting * lever) / wrenchLength;
}

/** Torque for each pass: the final torque times each pass's fraction. */
export function passSchedule(finalTorque: number, fractions: readonly number[]): number[] {
  if (!Number.isFinite(finalTorque) || finalTorque <= 0) {
    throw new WrenchSetupError('the final torque must be a positive number');
  }
  return fractions.map((fraction) => {
    if (!Number.isFinite(fraction) || fraction <= 0 || fraction > 1) {
      throw new WrenchSetupError('each pass fraction must be above 0 and at most 1');
    }
    return finalTorque * fraction;
  });
}
