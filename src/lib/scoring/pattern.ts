import type { FastenerGroup, Vec3 } from '../procedure/schema';
import { checkSequence, RULE_DESCRIPTIONS, type BoltPosition } from '../patterns';
import { formatNumber, formatTorque } from '../torque';
import { passSchedule } from '../wrench';
import type { PatternAnswer } from './answers';
import { markPerResult } from './marks';
import type { StageScore, StepResult } from './types';

// Pattern stage: the learner gives each pass's torque and tightening sequence. One point per pass
// for the sequence, one per pass for the torque, one for the number of passes.

/** Bolt positions of a group, from the anchors its bolts go into. */
export function groupBoltPositions(group: FastenerGroup, positions: Record<string, Vec3>): BoltPosition[] {
  return group.bolts.map((bolt) => {
    const position = Object.hasOwn(positions, bolt.anchor) ? positions[bolt.anchor] : undefined;
    // A group pointing at a missing anchor is a broken procedure, not a learner's mistake.
    if (!position) throw new RangeError(`no position for anchor "${bolt.anchor}" of bolt "${bolt.key}"`);
    return { key: bolt.key, position };
  });
}

// The answer arrives from the browser: read it defensively instead of trusting its shape.
function readPasses(answer: unknown): { torque: number; sequence: unknown[] }[] {
  const passes = (answer as { passes?: unknown } | null)?.passes;
  if (!Array.isArray(passes)) return [];
  return passes.map((pass: unknown) => {
    const p = (pass ?? {}) as { torque?: unknown; sequence?: unknown };
    return {
      torque: typeof p.torque === 'number' ? p.torque : Number.NaN,
      sequence: Array.isArray(p.sequence) ? p.sequence : [],
    };
  });
}

function percent(fraction: number): string {
  return `${formatNumber(fraction * 100, 3)} %`;
}

export function scorePattern(
  group: FastenerGroup,
  positions: Record<string, Vec3>,
  answer: Pick<PatternAnswer, 'passes'>,
): StageScore {
  const bolts = groupBoltPositions(group, positions);
  const { value: final, unit, tolerancePct } = group.torque;
  const expected = passSchedule(final, group.passes);
  // "Last equals final": the last pass is judged against the spec itself.
  expected[expected.length - 1] = final;
  const given = readPasses(answer);
  const results: StepResult[] = [];

  const plan = expected.map((t) => formatTorque(t, unit)).join(', then ');
  results.push(
    given.length === expected.length
      ? { key: 'passes', ok: true, message: `${expected.length} ${expected.length === 1 ? 'pass' : 'passes'}, as the spec asks` }
      : {
          key: 'passes',
          ok: false,
          message: `${given.length} ${given.length === 1 ? 'pass' : 'passes'} given; this group takes ${expected.length}: ${plan}`,
        },
  );

  expected.forEach((target, i) => {
    const n = i + 1;
    const pass = given[i];
    if (!pass) {
      results.push({ key: `pass-${n}`, ok: false, message: `pass ${n} is missing` });
      results.push({ key: `pass-${n}-torque`, ok: false, message: `pass ${n} is missing; it goes to ${formatTorque(target, unit)}` });
      return;
    }

    const check = checkSequence(bolts, group.axis, group.rule, pass.sequence);
    results.push(
      check.ok
        ? { key: `pass-${n}`, ok: true, message: `pass ${n}: all ${bolts.length} bolts in a good ${group.rule} order` }
        : { key: `pass-${n}`, ok: false, message: `pass ${n}: ${check.message}` },
    );

    const share = i === expected.length - 1 ? 'the final torque' : `${percent(group.passes[i]!)} of ${formatTorque(final, unit)}`;
    const should = `it should be ${formatTorque(target, unit)} (${share}, ±${formatNumber(tolerancePct)} %)`;
    const previous = given[i - 1];
    let torque: StepResult;
    if (!Number.isFinite(pass.torque) || pass.torque <= 0) {
      torque = { key: `pass-${n}-torque`, ok: false, message: `pass ${n} has no torque; ${should}` };
    } else if (Math.abs(pass.torque - target) > (target * tolerancePct) / 100 + target * 1e-9) {
      torque = { key: `pass-${n}-torque`, ok: false, message: `pass ${n} at ${formatTorque(pass.torque, unit)}; ${should}` };
    } else if (previous && Number.isFinite(previous.torque) && pass.torque <= previous.torque) {
      // Tolerance bands of close passes can overlap; each pass must still go higher than the last.
      torque = {
        key: `pass-${n}-torque`,
        ok: false,
        message: `pass ${n} at ${formatTorque(pass.torque, unit)} does not rise above pass ${i} (${formatTorque(previous.torque, unit)}); each pass goes higher`,
      };
    } else {
      torque = { key: `pass-${n}-torque`, ok: true, message: `pass ${n} at ${formatTorque(pass.torque, unit)}` };
    }
    results.push(torque);
  });

  return markPerResult('pattern', results, [`Passes for this group: ${plan}.`, RULE_DESCRIPTIONS[group.rule]]);
}
