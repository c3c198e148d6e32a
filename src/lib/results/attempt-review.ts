import type { Procedure, Stage } from '../procedure/schema';
import { answerSchemas } from '../scoring/answers';
import type { StepResult } from '../scoring/types';
import { boltLabel, readableKey } from '../../components/trainer/labels';

// An attempt replayed as it was done: one frame per thing the learner did (each step placed, each pin
// seated, each pass of bolts, the wrench setting, each final check), with the server's stored lines
// about it. Lines no frame claims (a step left out, an empty hole, a decoy left in the kit) come last,
// so the review shows every line the learner was given.

export interface ReviewFrame {
  title: string;
  /** What the learner did, in words: the bolts of a pass, the dial setting. */
  detail: string[];
  lines: StepResult[];
}

export function reviewFrames(procedure: Procedure, stage: Stage, answer: unknown, results: readonly StepResult[]): ReviewFrame[] {
  const claimed = new Set<number>();
  /** The stored lines about these keys that no earlier frame showed. */
  const take = (...keys: string[]) =>
    results.filter((r, i) => {
      if (claimed.has(i) || !keys.includes(r.key)) return false;
      claimed.add(i);
      return true;
    });
  const frames = framesFor(procedure, stage, answer, take);
  const rest = results.filter((_, i) => !claimed.has(i));
  if (rest.length) frames.push({ title: frames.length ? 'Also found' : 'Results', detail: [], lines: rest });
  return frames;
}

type Take = (...keys: string[]) => StepResult[];

function framesFor(procedure: Procedure, stage: Stage, answer: unknown, take: Take): ReviewFrame[] {
  const partName = (key: string) => procedure.parts.find((p) => p.key === key)?.name ?? `“${key}” (not in the kit)`;
  switch (stage) {
    case 'order': {
      const a = answerSchemas.order.safeParse(answer);
      if (!a.success) return [];
      return a.data.sequence.map((key, i) => {
        const step = procedure.steps.find((s) => s.key === key);
        return { title: `Step ${i + 1}: ${step?.text ?? `“${key}”, not a step of this procedure`}`, detail: [], lines: take(key) };
      });
    }
    case 'pins': {
      const a = answerSchemas.pins.safeParse(answer);
      if (!a.success) return [];
      return a.data.placements.map(({ part, anchor }, i) => ({
        title: `Pin ${i + 1}: ${partName(part)} into ${readableKey(anchor)}`,
        detail: [],
        lines: take(anchor, part),
      }));
    }
    case 'pattern': {
      const a = answerSchemas.pattern.safeParse(answer);
      if (!a.success) return [];
      const group = procedure.fastenerGroups.find((g) => g.key === (a.data.group ?? procedure.fastenerGroups[0]?.key));
      const unit = group?.torque.unit ?? '';
      const count = a.data.passes.length;
      return a.data.passes.map((pass, i) => ({
        title: `Pass ${i + 1} of ${count} at ${pass.torque} ${unit}`.trimEnd(),
        detail: pass.sequence.map((bolt, j) => `${j + 1}. ${boltLabel(bolt)}`),
        // The pass count is judged once; it is shown with the first pass.
        lines: [...(i === 0 ? take('passes') : []), ...take(`pass-${i + 1}`, `pass-${i + 1}-torque`)],
      }));
    }
    case 'wrench': {
      const a = answerSchemas.wrench.safeParse(answer);
      if (!a.success) return [];
      return [{ title: `Dial set to ${a.data.setting} ${a.data.unit}`, detail: [], lines: take('unit', 'setting') }];
    }
    case 'final-check': {
      const a = answerSchemas['final-check'].safeParse(answer);
      if (!a.success) return [];
      const frames: ReviewFrame[] = [{ title: `Counted ${a.data.fastenersCounted} fasteners`, detail: [], lines: take('fasteners') }];
      if (a.data.leftover !== undefined) frames.push({ title: `${a.data.leftover} left over on the bench`, detail: [], lines: take('leftover') });
      frames.push({ title: `Turned the crankshaft ${a.data.crankTurns} times`, detail: [], lines: take('crank-turns') });
      return frames;
    }
  }
}
