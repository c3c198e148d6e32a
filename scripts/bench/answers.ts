import { STAGES, TORQUE_UNIT_IDS, type Procedure, type Stage, type Vec3 } from '../../src/lib/procedure/schema';
import { topoOrder } from '../../src/lib/procedure/graph';
import { seededShuffle } from '../../src/lib/procedure/public-view';
import { exampleSequence } from '../../src/lib/patterns';
import { groupBoltPositions } from '../../src/lib/scoring/pattern';
import { expectedWrenchSetting } from '../../src/lib/scoring/wrench';
import { convertTorque } from '../../src/lib/torque';

// Answers a class would send for one procedure: one right answer per stage and the usual mistakes.
// Everything is derived from the procedure, so the set follows the demo data when it changes.

export interface AnswerCase {
  stage: Stage;
  label: string;
  /** Whether a correct scorer passes this answer; printed beside the actual result. */
  expectPass: boolean;
  answer: unknown;
}

const right = (stage: Stage, label: string, answer: unknown): AnswerCase => ({ stage, label, expectPass: true, answer });
const wrong = (stage: Stage, label: string, answer: unknown): AnswerCase => ({ stage, label, expectPass: false, answer });

const swap = <T>(items: readonly T[], i: number, j: number): T[] => {
  const out = [...items];
  [out[i], out[j]] = [out[j]!, out[i]!];
  return out;
};

function orderCases(p: Procedure): AnswerCase[] {
  const valid = topoOrder(p.steps);
  if (!valid) throw new Error(`procedure ${p.slug} has a cycle`);
  const afterOf = (key: string) => p.steps.find((s) => s.key === key)!.after;
  const cases = [right('order', 'valid order', { sequence: valid })];
  // Swap the first constrained step with its last-placed prerequisite: exactly one broken rule.
  const at = valid.findIndex((key) => afterOf(key).length > 0);
  if (at > 0) {
    const before = Math.max(...afterOf(valid[at]!).map((k) => valid.indexOf(k)));
    cases.push(wrong('order', `${valid[at]} before ${valid[before]}`, { sequence: swap(valid, at, before) }));
  }
  const middle = Math.floor(valid.length / 2);
  cases.push(wrong('order', `left out ${valid[middle]}`, { sequence: valid.filter((_, i) => i !== middle) }));
  cases.push(wrong('order', 'guessed (shuffled) order', { sequence: seededShuffle(valid, 'bench-guess') }));
  return cases;
}

function pinsCases(p: Procedure): AnswerCase[] {
  const seats = p.pinSeats.map((s) => ({ part: s.part, anchor: s.anchor }));
  const cases = [right('pins', 'every pin in its hole', { placements: seats })];
  const decoy = p.parts.find((x) => x.decoy && (x.kind === 'dowel-pin' || x.kind === 'sleeve'));
  if (decoy) {
    const placements = seats.map((s, i) => (i === 0 ? { ...s, part: decoy.key } : s));
    cases.push(wrong('pins', `decoy ${decoy.key} used`, { placements }));
  }
  const threaded = p.anchors.find((a) => a.kind === 'threaded-hole');
  if (threaded) {
    const placements = seats.map((s, i) => (i === seats.length - 1 ? { ...s, anchor: threaded.key } : s));
    cases.push(wrong('pins', `pin in threaded hole ${threaded.key}`, { placements }));
  }
  cases.push(wrong('pins', 'one hole left empty', { placements: seats.slice(1) }));
  return cases;
}

function patternCases(p: Procedure): AnswerCase[] {
  const group = p.fastenerGroups[0]!;
  const positions: Record<string, Vec3> = Object.fromEntries(p.anchors.map((a) => [a.key, a.position]));
  const good = exampleSequence(groupBoltPositions(group, positions), group.axis, group.rule);
  const torques = group.passes.map((f) => group.torque.value * f);
  const last = torques.length - 1;
  const answer = (sequenceOfPass: (i: number) => string[], torqueOfPass: (i: number) => number) => ({
    group: group.key,
    passes: torques.map((_, i) => ({ torque: torqueOfPass(i), sequence: sequenceOfPass(i) })),
  });
  const planned = (i: number) => torques[i]!;
  const shown = good.map((k) => k.replace(/^bolt-/, '')).join('-');

  const cases = [right('pattern', `${group.rule} order ${shown}, every pass`, answer(() => good, planned))];
  if (good.length > 2) {
    const late = (i: number) => (i === last ? swap(good, 1, 2) : good);
    cases.push(wrong('pattern', 'last pass out of order (2nd and 3rd bolts swapped)', answer(late, planned)));
  }
  const round = group.bolts.map((b) => b.key);
  cases.push(wrong('pattern', 'round the circle', answer(() => round, planned)));
  cases.push(wrong('pattern', 'every pass at full torque', answer(() => good, () => group.torque.value)));
  const single = { group: group.key, passes: [{ torque: group.torque.value, sequence: good }] };
  cases.push({ stage: 'pattern', label: 'single pass', expectPass: torques.length === 1, answer: single });
  return cases;
}

function wrenchCases(p: Procedure): AnswerCase[] {
  const task = p.wrench!;
  const spec = p.fastenerGroups.find((g) => g.key === task.group)!.torque;
  const { setting } = expectedWrenchSetting(task, spec);
  // A learner reads the dial to one decimal.
  const dialed = (x: number) => Math.round(x * 10) / 10;
  // The classic mistake: the spec as shown, in its own unit, on a dial that reads another one.
  const other = task.specShownIn !== task.dialUnit ? task.specShownIn : TORQUE_UNIT_IDS.find((u) => u !== task.dialUnit)!;
  return [
    right('wrench', `${dialed(setting)} ${task.dialUnit}`, { setting: dialed(setting), unit: task.dialUnit }),
    wrong('wrench', `wrong unit (${other})`, { setting: dialed(convertTorque(setting, task.dialUnit, other)), unit: other }),
    wrong('wrench', 'dial 30 % high', { setting: dialed(setting * 1.3), unit: task.dialUnit }),
  ];
}

function finalCheckCases(p: Procedure): AnswerCase[] {
  const { fastenerCount, crankTurns } = p.finalCheck!;
  return [
    right('final-check', 'all counted, enough turns', { fastenersCounted: fastenerCount, crankTurns, leftover: 0 }),
    wrong('final-check', 'one fastener left over', { fastenersCounted: fastenerCount - 1, crankTurns, leftover: 1 }),
    wrong('final-check', 'too few crank turns', { fastenersCounted: fastenerCount, crankTurns: Math.max(0, crankTurns - 1) }),
  ];
}

const builders: Record<Stage, (p: Procedure) => AnswerCase[]> = {
  order: orderCases,
  pins: pinsCases,
  pattern: patternCases,
  wrench: wrenchCases,
  'final-check': finalCheckCases,
};

/** Answer cases for every stage the procedure has, grouped by stage in the stage order. */
export function answerCases(p: Procedure): AnswerCase[] {
  return STAGES.filter((s) => p.stages.includes(s)).flatMap((s) => builders[s](p));
}
