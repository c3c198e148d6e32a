// Attempts the demo class has already made on the sump drill, so the instructor's results, step analysis
// and grade export show a class at work from the first `npm start`. Each is a real answer scored by the
// real scorer: either the reference answer or one of the slips learners make at the bench.
import { createHash } from 'node:crypto';
import type { Procedure, Stage } from '../src/lib/procedure/schema';
import { correctAnswer } from '../src/lib/procedure/reference-answers';

export type Try = 'right' | 'slip';

/** Per demo learner, their attempts in the order made (learner1 and learner2 have not started). */
export const DEMO_ATTEMPT_PLAN: Record<string, [Stage, Try][]> = {
  'learner3@larkspur.example': [['order', 'right'], ['pins', 'right'], ['pattern', 'right'], ['wrench', 'right'], ['final-check', 'right']],
  'learner4@larkspur.example': [['order', 'slip'], ['order', 'right'], ['pins', 'right'], ['pattern', 'slip'], ['pattern', 'right'], ['wrench', 'right'], ['final-check', 'right']],
  'learner5@larkspur.example': [['order', 'right'], ['pins', 'slip'], ['pattern', 'right'], ['wrench', 'slip'], ['wrench', 'right'], ['final-check', 'right']],
  'learner6@larkspur.example': [['order', 'slip'], ['pins', 'slip'], ['pattern', 'slip'], ['wrench', 'slip'], ['final-check', 'slip']],
  'learner7@larkspur.example': [['order', 'right'], ['pins', 'right'], ['pattern', 'slip'], ['wrench', 'right'], ['final-check', 'slip']],
  'learner8@larkspur.example': [['order', 'slip'], ['pins', 'right']],
};

/**
 * A wrong answer of the kind learners give (common practice, no source): a step that must wait done first,
 * the kit's decoy pin in a hole, bolts run round the flange instead of across it, the spec dialled without
 * converting it to the wrench's unit, one fastener miscounted.
 */
export function slipAnswer(procedure: Procedure, stage: Stage): unknown {
  const right = correctAnswer(procedure, stage) as Record<string, unknown>;
  switch (stage) {
    case 'order': {
      const sequence = [...(right.sequence as string[])];
      const waiting = sequence.findIndex((key) => procedure.steps.find((s) => s.key === key)!.after.length > 0);
      const [moved] = sequence.splice(waiting, 1);
      return { sequence: [moved, ...sequence] };
    }
    case 'pins': {
      const decoy = procedure.parts.find((p) => p.decoy && p.kind === 'dowel-pin');
      const placements = right.placements as { part: string; anchor: string }[];
      return { placements: placements.map((p, i) => (i === 0 && decoy ? { ...p, part: decoy.key } : p)) };
    }
    case 'pattern': {
      const group = procedure.fastenerGroups[0]!;
      const around = group.bolts.map((b) => b.key);
      return { ...right, passes: (right.passes as { torque: number }[]).map((pass) => ({ ...pass, sequence: around })) };
    }
    case 'wrench': {
      const group = procedure.fastenerGroups.find((g) => g.key === procedure.wrench!.group)!;
      return { setting: group.torque.value, unit: procedure.wrench!.dialUnit };
    }
    case 'final-check':
      return { ...right, fastenersCounted: (right.fastenersCounted as number) - 1 };
  }
}

/** The same clientId on every seed run, so a second run finds the attempt and adds nothing. */
export function demoClientId(email: string, index: number): string {
  const hex = createHash('sha256').update(`demo-attempt:${email}:${index}`).digest('hex');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-4${hex.slice(13, 16)}-8${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
}
