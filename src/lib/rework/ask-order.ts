import type { Procedure } from '../procedure/schema';
import { needsSets, topoOrder } from '../procedure/graph';
import { scoreOrder } from '../scoring/order';
import type { Asker, Judgement } from './question-types';
import { shuffled } from './variant';

// Order: "what comes right after this step?" (or, for a step nothing can follow, "right before").
// A choice is judged by building the whole sequence that puts the two steps side by side and letting the
// Order scorer judge it, so every step the precedence rules allow there is accepted.

const quote = (text: string) => `“${text.trim().replace(/\.$/, '')}”`;

/**
 * A full sequence with `first` immediately followed by `second`: everything either of them needs, in a
 * valid order, then the pair, then the rest in a valid order. It keeps every rule exactly when some valid
 * order has the pair side by side.
 */
export function sequenceWithPair(procedure: Procedure, first: string, second: string): string[] {
  const order = topoOrder(procedure.steps) ?? procedure.steps.map((s) => s.key);
  const needs = needsSets(procedure.steps);
  const before = new Set([...(needs.get(first) ?? []), ...(needs.get(second) ?? [])]);
  before.delete(first);
  before.delete(second);
  return [...order.filter((k) => before.has(k)), first, second, ...order.filter((k) => !before.has(k) && k !== first && k !== second)];
}

function judgePair(procedure: Procedure, first: string, second: string, asked: string, choice: string): Judgement {
  const score = scoreOrder(procedure, { sequence: sequenceWithPair(procedure, first, second) });
  const text = (key: string) => quote(procedure.steps.find((s) => s.key === key)?.text ?? key);
  const relation = first === asked ? 'right after' : 'right before';
  if (score.passed) {
    return { correct: true, results: [{ key: choice, ok: true, message: `${text(choice)} can come ${relation} ${text(asked)}` }] };
  }
  return {
    correct: false,
    results: [{ key: choice, ok: false, message: `${text(choice)} cannot come ${relation} ${text(asked)}` }, ...score.results.filter((r) => !r.ok)],
  };
}

export function askOrder(procedure: Procedure, stepKey: string, variant: number): Asker | null {
  const step = procedure.steps.find((s) => s.key === stepKey);
  if (!step || procedure.steps.length < 2) return null;
  const others = procedure.steps.filter((s) => s.key !== stepKey);
  // "Right after" unless the step must come last; then "right before", which some step always can.
  const canFollow = others.some((s) => scoreOrder(procedure, { sequence: sequenceWithPair(procedure, stepKey, s.key) }).passed);
  const after = canFollow;
  const judge = (choice: string): Judgement =>
    after ? judgePair(procedure, stepKey, choice, stepKey, choice) : judgePair(procedure, choice, stepKey, stepKey, choice);

  return {
    question: {
      kind: after ? 'next-step' : 'previous-step',
      stage: 'order',
      itemKey: stepKey,
      variant,
      prompt: after ? 'What comes right after this step?' : 'What comes right before this step?',
      context: [quote(step.text)],
      choices: shuffled(others.map((s) => ({ id: s.key, label: s.text })), variant),
      hint: after
        ? 'A step can come next only when everything it needs is already done. For each choice, ask what must be in place first.'
        : 'The step just before must leave everything this step needs already done.',
    },
    judge,
  };
}
