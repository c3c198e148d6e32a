import type { Procedure, Stage } from '../procedure/schema';
import { correctAnswer } from '../procedure/reference-answers';
import { scoreAttempt } from '../scoring';
import type { StepResult } from '../scoring/types';
import { STAGE_LABELS, readableKey } from '../../components/trainer/labels';

// The steps of a drill for the step analysis: the result keys the scorer reports for a correct answer
// to each of the drill's stages (every step of the order, every pin seat and decoy, every pass and its
// torque, the wrench unit and setting, each final check). Stray lines a wrong answer adds (an unknown
// entry, a pin in a threaded hole) belong to no fixed step: the attempt review shows them.

export interface DrillStep {
  stage: Stage;
  key: string;
  label: string;
}

export function drillSteps(procedure: Procedure, stages: readonly Stage[]): DrillStep[] {
  return stages.flatMap((stage) => {
    const scored = scoreAttempt(procedure, stage, correctAnswer(procedure, stage));
    if (!scored.ok) return [];
    const seen = new Set<string>();
    return scored.score.results
      .filter((r) => !seen.has(r.key) && seen.add(r.key))
      .map((r) => ({ stage, key: r.key, label: stepLabel(procedure, stage, r.key) }));
  });
}

/**
 * 1 when the attempt got the step right: no line about it says wrong. A line the scorer leaves out
 * (the final check's leftover count when none was given) is not a miss, as the score treats it.
 */
export function stepRight(results: readonly StepResult[], key: string): 0 | 1 {
  return results.some((r) => r.key === key && !r.ok) ? 0 : 1;
}

const FIXED_LABELS: Record<string, string> = {
  passes: 'Number of passes',
  unit: 'Dial unit',
  setting: 'Wrench setting',
  fasteners: 'Fasteners counted',
  leftover: 'Nothing left over',
  'crank-turns': 'Crank turned',
};

/** Words for a step the instructor can re-teach from: the step's text, the hole, the pass. */
export function stepLabel(procedure: Procedure, stage: Stage, key: string): string {
  if (stage === 'order') return procedure.steps.find((s) => s.key === key)?.text ?? readableKey(key);
  if (stage === 'pins') {
    const seat = procedure.pinSeats.find((s) => s.anchor === key);
    if (seat) return `${procedure.parts.find((p) => p.key === seat.part)?.name ?? readableKey(seat.part)} in ${readableKey(key)}`;
    const part = procedure.parts.find((p) => p.key === key);
    if (part) return `Leave out ${part.name}`;
    return readableKey(key);
  }
  if (stage === 'pattern') {
    const pass = /^pass-(\d+)(-torque)?$/.exec(key);
    if (pass) return `Pass ${pass[1]} ${pass[2] ? 'torque' : 'sequence'}`;
  }
  return FIXED_LABELS[key] ?? readableKey(key);
}

export const stageLabel = (stage: Stage) => STAGE_LABELS[stage];
