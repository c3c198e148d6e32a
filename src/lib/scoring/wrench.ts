import type { TorqueSpec, WrenchTask } from '../procedure/schema';
import { convertTorque, formatNumber, formatTorque, isTorqueUnit } from '../torque';
import { wrenchSetting, type WrenchSetting } from '../wrench';
import type { WrenchAnswer } from './answers';
import { markPerResult } from './marks';
import type { StageScore, StepResult } from './types';

// Wrench stage: the learner dials the setting for the wrench on the bench. One point for the unit
// (the dial's), one for the number. A task whose wrench and adapter cannot work together throws
// WrenchSetupError: that is a broken procedure, not a learner's mistake.

/** The dial setting a task asks for, with the worked arithmetic. */
export function expectedWrenchSetting(task: WrenchTask, spec: TorqueSpec): WrenchSetting {
  // Work from the unit the learner is shown, so the steps match what they see on screen.
  return wrenchSetting({
    torque: convertTorque(spec.value, spec.unit, task.specShownIn),
    unit: task.specShownIn,
    toUnit: task.dialUnit,
    wrenchLength: task.wrenchLength,
    extension: task.extension,
    lengthUnit: task.lengthUnit,
    direction: task.direction,
  });
}

export function scoreWrench(task: WrenchTask, spec: TorqueSpec, answer: WrenchAnswer): StageScore {
  const worked = expectedWrenchSetting(task, spec);
  const expected = worked.setting;
  const dial = task.dialUnit;
  const band = (expected * spec.tolerancePct) / 100;

  // The answer comes from the browser: never trust its shape.
  const unit: unknown = (answer as { unit?: unknown } | null)?.unit;
  const raw: unknown = (answer as { setting?: unknown } | null)?.setting;
  const setting = typeof raw === 'number' && Number.isFinite(raw) ? raw : null;
  const unitOk = unit === dial;

  const unitResult: StepResult = unitOk
    ? { key: 'unit', ok: true, message: `set in ${dial}, the unit the dial reads` }
    : {
        key: 'unit',
        ok: false,
        message: isTorqueUnit(unit)
          ? `the answer is in ${unit} but this wrench's dial reads ${dial}; a wrench set in the wrong unit is the classic mistake, so convert the spec to ${dial} first`
          : `no unit chosen; this wrench's dial reads ${dial}`,
      };

  // The setting is the number turned onto the dial, so it is judged in the dial's unit whatever label came with it.
  const should = `the dial should read ${formatTorque(expected, dial)} (±${formatNumber(spec.tolerancePct)} %: ${formatNumber(expected - band)} to ${formatNumber(expected + band)})`;
  let settingResult: StepResult;
  if (setting === null || setting <= 0) {
    settingResult = { key: 'setting', ok: false, message: `no setting given; ${should}` };
  } else if (Math.abs(setting - expected) <= band + expected * 1e-9) {
    settingResult = { key: 'setting', ok: true, message: `${formatNumber(setting)} on the dial is within ±${formatNumber(spec.tolerancePct)} % of ${formatTorque(expected, dial)}` };
  } else {
    const rightInOtherUnit =
      isTorqueUnit(unit) && unit !== dial && Math.abs(setting - convertTorque(expected, dial, unit)) <= convertTorque(band, dial, unit) * 1.000001;
    settingResult = {
      key: 'setting',
      ok: false,
      message: rightInOtherUnit
        ? `${formatTorque(setting, unit)} is the right torque, but the dial reads ${dial}: turned onto this wrench it would be badly off; ${should}`
        : `${formatNumber(setting)} on the dial is off; ${should}`,
    };
  }

  return markPerResult('wrench', [unitResult, settingResult], worked.steps);
}
