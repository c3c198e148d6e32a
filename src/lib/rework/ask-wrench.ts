import { TORQUE_UNIT_IDS, type Procedure, type TorqueUnit } from '../procedure/schema';
import { expectedWrenchSetting, scoreWrench } from '../scoring/wrench';
import { convertTorque, formatNumber } from '../torque';
import { extensionText } from './words';
import type { Asker, Choice, Judgement } from './question-types';
import { shuffled } from './variant';

// Wrench: "what do you set the wrench to?", for a wrong unit or a wrong number alike. The choices pair a
// number with a unit and include the usual slips (the spec's unit, no conversion, no extension allowance,
// the lever the wrong way); the Wrench scorer judges each one.

interface Setting {
  value: number;
  unit: TorqueUnit;
}

const idOf = (s: Setting) => `${formatNumber(s.value)} ${s.unit}`;

export function askWrench(procedure: Procedure, key: string, variant: number): Asker | null {
  if (key !== 'unit' && key !== 'setting') return null;
  const task = procedure.wrench;
  const group = task && procedure.fastenerGroups.find((g) => g.key === task.group);
  if (!task || !group) return null;
  const spec = group.torque;
  const shown = { value: convertTorque(spec.value, spec.unit, task.specShownIn), unit: task.specShownIn };
  const right = expectedWrenchSetting(task, spec).setting;
  const dial = task.dialUnit;
  const converted = convertTorque(shown.value, shown.unit, dial);
  const otherUnit = TORQUE_UNIT_IDS.find((u) => u !== dial && u !== shown.unit) ?? shown.unit;

  const candidates: Setting[] = [
    { value: right, unit: dial },
    { value: shown.value, unit: shown.unit },
    { value: shown.value, unit: dial },
    { value: right, unit: shown.unit === dial ? otherUnit : shown.unit },
    { value: convertTorque(shown.value, shown.unit, otherUnit), unit: dial },
  ];
  if (task.extension > 0) {
    const L = task.wrenchLength;
    const E = task.extension;
    candidates.push({ value: converted, unit: dial });
    candidates.push({ value: (converted * L) / (task.direction === 'forward' ? L - E : L + E), unit: dial });
  }
  const judgeSetting = (s: Setting): Judgement => {
    const score = scoreWrench(task, spec, { setting: Number(formatNumber(s.value)), unit: s.unit });
    return score.passed
      ? { correct: true, results: score.results, notes: score.notes }
      : { correct: false, results: score.results.filter((r) => !r.ok), notes: score.notes };
  };
  // One right choice only: a slip that lands inside the tolerance (a tiny extension) is dropped.
  const settings = new Map<string, Setting>();
  candidates.forEach((s, i) => {
    if (!(s.value > 0) || settings.has(idOf(s))) return;
    if (i > 0 && judgeSetting(s).correct) return;
    settings.set(idOf(s), s);
  });
  const choices: Choice[] = shuffled([...settings.keys()].map((id) => ({ id, label: id })), variant);

  return {
    question: {
      kind: 'wrench-setting',
      stage: 'wrench',
      itemKey: key,
      variant,
      prompt: 'What do you set the wrench to?',
      context: [
        `Spec: ${formatNumber(shown.value)} ${shown.unit} (± ${formatNumber(spec.tolerancePct)} %).`,
        `Click wrench, ${formatNumber(task.wrenchLength)} ${task.lengthUnit} long; its dial reads in ${dial}.`,
        extensionText(task),
      ],
      choices,
      hint:
        task.extension > 0
          ? `Convert the spec to the dial's unit first, then allow for the extension: setting = T × L / (L ${task.direction === 'forward' ? '+' : '−'} E).`
          : "Convert the spec to the unit the dial reads; with no extension that is the setting.",
    },
    judge: (choice) => judgeSetting(settings.get(choice)!),
  };
}
