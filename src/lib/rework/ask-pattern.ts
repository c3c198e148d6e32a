import type { FastenerGroup, Procedure, TorqueUnit, Vec3 } from '../procedure/schema';
import { RULE_DESCRIPTIONS, checkSequence, nextBolts, type BoltPosition } from '../patterns';
import { groupBoltPositions, scorePattern } from '../scoring/pattern';
import { convertTorque, formatNumber, formatTorque } from '../torque';
import { passSchedule } from '../wrench';
import { boltLabel } from '../../components/trainer/labels';
import type { Asker, Choice, Judgement } from './question-types';
import { randomFor, shuffled } from './variant';

// Pattern: "which bolt comes next in this pass?" for a pass whose sequence broke the rule, "what torque
// does this pass go to?" for a wrong pass torque, "how many passes?" for a wrong count. Bolts are judged
// by the same rule checker the Pattern scorer uses; torques and counts by the scorer itself.

/** Shares of the final torque offered besides the right one (common practice, no source). */
const TORQUE_SHARES = [0.2, 0.25, 1 / 3, 0.5, 2 / 3, 0.75, 1];

interface GroupContext {
  group: FastenerGroup;
  bolts: BoltPosition[];
  positions: Record<string, Vec3>;
}

function groupOf(procedure: Procedure): GroupContext | null {
  const group = procedure.fastenerGroups[0];
  if (!group) return null;
  const positions: Record<string, Vec3> = Object.fromEntries(procedure.anchors.map((a) => [a.key, a.position]));
  return { group, positions, bolts: groupBoltPositions(group, positions) };
}

/** The final torque as the learner is given it: the wrench stage's unit when that stage shows the spec. */
function specShown(procedure: Procedure, group: FastenerGroup): { value: number; unit: TorqueUnit } {
  const unit = procedure.wrench?.group === group.key ? procedure.wrench.specShownIn : group.torque.unit;
  return { value: convertTorque(group.torque.value, group.torque.unit, unit), unit };
}

/** The right passes (torques and a sequence the rule accepts), to change one thing in. */
function referencePasses(g: GroupContext): { torque: number; sequence: string[] }[] {
  const sequence = validSequence(g, () => 0);
  return passSchedule(g.group.torque.value, g.group.passes).map((torque) => ({ torque, sequence }));
}

/** A whole sequence the rule accepts, each bolt drawn among those the rule allows next. */
function validSequence(g: GroupContext, random: () => number): string[] {
  const done: string[] = [];
  while (done.length < g.bolts.length) {
    const allowed = nextBolts(g.bolts, g.group.axis, g.group.rule, done);
    done.push(allowed[Math.floor(random() * allowed.length)]!);
  }
  return done;
}

/** Right when the bolt keeps the pass acceptable to the group's rule: the Pattern scorer's own check. */
function judgeBolt(g: GroupContext, pass: number, done: readonly string[], choice: string): Judgement {
  const check = checkSequence(g.bolts, g.group.axis, g.group.rule, [...done, choice]);
  // Valid so far when the only complaint is the bolts still to come.
  if (check.ok || check.index > done.length) {
    return { correct: true, results: [{ key: `pass-${pass}`, ok: true, message: `pass ${pass}: ${boltLabel(choice)} keeps a good order` }] };
  }
  return { correct: false, results: [{ key: `pass-${pass}`, ok: false, message: `pass ${pass}: ${check.message}` }] };
}

/** Judges "which bolt comes next" after any prefix, for the procedure's first group (tests use it directly). */
export function judgeNextBolt(procedure: Procedure, pass: number, done: readonly string[], choice: string): Judgement | null {
  const g = groupOf(procedure);
  return g ? judgeBolt(g, pass, done, choice) : null;
}

function nextBolt(g: GroupContext, pass: number, variant: number): Asker | null {
  const random = randomFor(variant, 'pattern');
  const sequence = validSequence(g, random);
  // Ask where the rule leaves a real choice to make: not where every bolt left would do.
  const telling = sequence
    .map((_, k) => k)
    .filter((k) => k < sequence.length - 1 && nextBolts(g.bolts, g.group.axis, g.group.rule, sequence.slice(0, k)).length < sequence.length - k);
  const at = telling.length > 0 ? telling[Math.floor(random() * telling.length)]! : 0;
  const done = sequence.slice(0, at);
  const left = g.bolts.map((b) => b.key).filter((k) => !done.includes(k));
  const byNumber = (a: string, b: string) => a.localeCompare(b, 'en', { numeric: true });
  const choices: Choice[] = left.sort(byNumber).map((k) => ({ id: k, label: boltLabel(k) }));

  const judge = (choice: string) => judgeBolt(g, pass, done, choice);
  return {
    question: {
      kind: 'next-bolt',
      stage: 'pattern',
      itemKey: `pass-${pass}`,
      variant,
      prompt: `Which bolt comes next in pass ${pass}?`,
      context: [
        `${g.group.name}, ${g.bolts.length} bolts, pass ${pass} of ${g.group.passes.length}.`,
        done.length === 0 ? 'No bolt is tightened yet in this pass.' : `Already tightened in this pass, in order: ${done.map(boltLabel).join(', ')}.`,
      ],
      choices,
      hint: RULE_DESCRIPTIONS[g.group.rule],
      model: { kind: 'bolts', group: g.group.key, done },
    },
    judge,
  };
}

function passTorque(procedure: Procedure, g: GroupContext, pass: number, variant: number): Asker | null {
  const { group } = g;
  const unit = group.torque.unit;
  const final = group.torque.value;
  const target = passSchedule(final, group.passes)[pass - 1]!;
  const band = (target * group.torque.tolerancePct) / 100;
  // Distractors at other usual shares, far enough from the right value that only one choice is right.
  const values = [target, ...TORQUE_SHARES.map((s) => s * final).filter((v) => Math.abs(v - target) > 2 * band + 1e-9)];
  const unique = [...new Map(values.map((v) => [formatNumber(v), v])).values()];
  const choices: Choice[] = shuffled(unique.map((v) => ({ id: formatNumber(v), label: formatTorque(v, unit) })), variant);
  const valueOf = new Map(unique.map((v) => [formatNumber(v), v]));

  const judge = (choice: string): Judgement => {
    const passes = referencePasses(g);
    passes[pass - 1] = { ...passes[pass - 1]!, torque: valueOf.get(choice)! };
    const line = scorePattern(group, g.positions, { passes }).results.find((r) => r.key === `pass-${pass}-torque`)!;
    return { correct: line.ok, results: [line] };
  };
  const spec = specShown(procedure, group);
  return {
    question: {
      kind: 'pass-torque',
      stage: 'pattern',
      itemKey: `pass-${pass}-torque`,
      variant,
      prompt: `What torque does pass ${pass} go to?`,
      context: [
        `${group.name}: final torque ${formatTorque(spec.value, spec.unit)}, in ${group.passes.length} ${group.passes.length === 1 ? 'pass' : 'passes'}.`,
        ...(spec.unit === unit ? [] : [`Answer in ${unit}: ${formatTorque(final, unit)} final.`]),
      ],
      choices,
      hint: 'Each pass goes higher than the last, and the last pass goes to the full torque; earlier passes are a share of it.',
    },
    judge,
  };
}

function passCount(g: GroupContext, variant: number): Asker {
  const { group } = g;
  const most = Math.max(4, group.passes.length + 1);
  const choices: Choice[] = Array.from({ length: most }, (_, i) => ({ id: String(i + 1), label: `${i + 1} ${i === 0 ? 'pass' : 'passes'}` }));
  const judge = (choice: string): Judgement => {
    const reference = referencePasses(g);
    const count = Number(choice);
    const passes = Array.from({ length: count }, (_, i) => reference[Math.min(i, reference.length - 1)]!);
    const line = scorePattern(group, g.positions, { passes }).results.find((r) => r.key === 'passes')!;
    return { correct: line.ok, results: [line] };
  };
  return {
    question: {
      kind: 'pass-count',
      stage: 'pattern',
      itemKey: 'passes',
      variant,
      prompt: `In how many passes do you bring the ${group.name.toLowerCase()} to torque?`,
      context: [`${group.name}, ${g.bolts.length} bolts.`],
      choices,
      hint: 'Read the tightening step of the procedure: it says how the bolts are brought up to torque.',
    },
    judge,
  };
}

export function askPattern(procedure: Procedure, key: string, variant: number): Asker | null {
  const g = groupOf(procedure);
  if (!g) return null;
  if (key === 'passes') return passCount(g, variant);
  const match = /^pass-(\d+)(-torque)?$/.exec(key);
  const pass = match ? Number(match[1]) : 0;
  if (!match || pass < 1 || pass > g.group.passes.length) return null;
  return match[2] ? passTorque(procedure, g, pass, variant) : nextBolt(g, pass, variant);
}
