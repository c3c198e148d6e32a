import { TORQUE_UNIT_IDS, type LengthUnit, type TorqueUnit } from '../procedure/schema';
import { convertTorque, formatNumber, roundToResolution, torqueFactor } from '../torque';
import { passSchedule, wrenchSetting, type ExtensionDirection } from '../wrench';

// The wrench calculator page: one spec worked into every unit, a dial setting (with an extension
// or adapter compensated), and the setting for each pass of a tightening schedule.

export interface WrenchPlanInput {
  torque: number;
  unit: TorqueUnit;
  dialUnit: TorqueUnit;
  wrenchLength?: number;
  extension?: number;
  lengthUnit?: LengthUnit;
  direction?: ExtensionDirection;
  /** Percent of the spec for each pass, rising and ending at 100. */
  passPercents: number[];
  /** The dial's smallest mark; settings are also shown rounded to it. */
  dialResolution?: number;
}

export interface PlannedPass {
  percent: number;
  /** Torque that reaches the fastener on this pass, in the dial's unit. */
  torque: number;
  /** What to set on the dial for it (equal to torque without an extension). */
  setting: number;
  dialMark: number | null;
}

export interface WrenchPlan {
  conversions: { unit: TorqueUnit; value: number; factor: number }[];
  setting: number;
  dialMark: number | null;
  unit: TorqueUnit;
  steps: string[];
  passes: PlannedPass[];
  /** Plain text a person can paste into a job sheet. */
  summary: string;
}

export function planWrench(input: WrenchPlanInput): WrenchPlan {
  const { torque, unit, dialUnit, dialResolution } = input;
  const geometry = {
    wrenchLength: input.wrenchLength,
    extension: input.extension,
    lengthUnit: input.lengthUnit,
    direction: input.direction,
  };
  const final = wrenchSetting({ torque, unit, toUnit: dialUnit, ...geometry });
  const onDial = (value: number) => (dialResolution ? roundToResolution(value, dialResolution) : null);

  const specInDial = convertTorque(torque, unit, dialUnit);
  const passTorques = passSchedule(specInDial, input.passPercents.map((p) => p / 100));
  const passes = passTorques.map((passTorque, i) => {
    // Every pass goes through the same extension, so each is compensated like the final one.
    const setting = wrenchSetting({ torque: passTorque, unit: dialUnit, toUnit: dialUnit, ...geometry }).setting;
    return { percent: input.passPercents[i]!, torque: passTorque, setting, dialMark: onDial(setting) };
  });

  const conversions = TORQUE_UNIT_IDS.map((to) => ({ unit: to, value: convertTorque(torque, unit, to), factor: torqueFactor(unit, to) }));
  const plan = { conversions, setting: final.setting, dialMark: onDial(final.setting), unit: dialUnit, steps: final.steps, passes };
  return { ...plan, summary: summarise(input, plan) };
}

function summarise(input: WrenchPlanInput, plan: Omit<WrenchPlan, 'summary'>): string {
  const shown = (value: number, mark: number | null) => `${formatNumber(mark ?? value)} ${plan.unit}`;
  const lines = [`Torque spec: ${formatNumber(input.torque)} ${input.unit}`];
  if (input.extension) {
    const way = input.direction === 'back' ? 'adapter pointing back' : 'extension';
    lines.push(`Wrench ${formatNumber(input.wrenchLength ?? 0)} ${input.lengthUnit ?? 'in'} with a ${formatNumber(input.extension)} ${input.lengthUnit ?? 'in'} ${way}`);
  }
  lines.push(`Dial setting: ${shown(plan.setting, plan.dialMark)}`);
  plan.passes.forEach((pass, i) => {
    const reaches = input.extension ? ` (reaches ${formatNumber(pass.torque)} ${plan.unit})` : '';
    lines.push(`Pass ${i + 1}, ${formatNumber(pass.percent)} %: set ${shown(pass.setting, pass.dialMark)}${reaches}`);
  });
  lines.push("The engine maker's figure rules; use a wrench that is in calibration.");
  return lines.join('\n');
}
