import type { Procedure } from '../procedure/schema';
import { needsSets } from '../procedure/graph';
import { nearestLinearExtension } from './kendall';
import type { OrderAnswer } from './answers';
import type { StageScore, StepResult } from './types';

// Order stage. Any order that keeps every "after" rule earns full marks. Otherwise each placed step
// earns a mark scaled by how near the order is to the nearest valid one (Kendall tau), rounded down so
// any broken rule loses at least one mark; steps left out earn nothing; stray entries cost a mark each.

// Step texts are often whole sentences; quoting them (without the full stop) keeps a message readable.
const quote = (text: string) => `“${text.trim().replace(/\.$/, '')}”`;

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

function joinAnd(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

export function scoreOrder(procedure: Procedure, answer: OrderAnswer): StageScore {
  const steps = new Map(procedure.steps.map((s) => [s.key, s] as const));
  const text = (key: string) => quote(steps.get(key)?.text ?? key);

  // First placement of each known step counts; repeats and unknown keys are strays.
  const placed: string[] = [];
  const index = new Map<string, number>();
  const repeats = new Map<string, number>();
  const unknown: string[] = [];
  for (const key of answer.sequence) {
    if (!steps.has(key)) unknown.push(key);
    else if (index.has(key)) repeats.set(key, (repeats.get(key) ?? 0) + 1);
    else {
      index.set(key, placed.length);
      placed.push(key);
    }
  }
  const missing = procedure.steps.filter((s) => !index.has(s.key)).map((s) => s.key);

  // Judge the placed steps among themselves; a rule through a left-out step still binds the others.
  const needs = needsSets(procedure.steps);
  const restricted = placed.map((key) => ({ key, after: [...needs.get(key)!].filter((k) => index.has(k)) }));
  const nearest = nearestLinearExtension(placed, restricted);

  const results: StepResult[] = placed.map((key, i) => {
    const step = steps.get(key)!;
    const after = [...new Set(step.after)];
    const late = after.filter((k) => (index.get(k) ?? -1) > i);
    const absent = after.filter((k) => !index.has(k));
    const problems: string[] = [];
    if (late.length > 0) {
      problems.push(`${text(key)} came before ${joinAnd(late.map(text))} (needs: ${after.map(text).join(', ')})`);
    }
    if (absent.length > 0) {
      problems.push(`${text(key)} needs ${joinAnd(absent.map(text))}, which ${absent.length === 1 ? 'was' : 'were'} left out`);
    }
    const times = repeats.get(key);
    if (times !== undefined) problems.push(`${text(key)} was placed ${times + 1} times; only the first counts`);
    return problems.length === 0
      ? { key, ok: true, message: `${text(key)}: in a valid place (position ${i + 1})` }
      : { key, ok: false, message: problems.join('; ') };
  });
  for (const key of missing) results.push({ key, ok: false, message: `${text(key)}: left out of the sequence` });
  for (const key of unknown) results.push({ key, ok: false, message: `"${key}" is not a step of this procedure` });

  const n = placed.length;
  const pairs = (n * (n - 1)) / 2;
  const d = nearest.distance;
  // Integer arithmetic keeps the floor exact: with d ≥ 1 the result is always below n.
  const orderMarks = pairs === 0 ? n : Math.floor((n * (pairs - d)) / pairs);
  const strays = unknown.length + [...repeats.values()].reduce((a, b) => a + b, 0);
  const score = Math.max(0, orderMarks - strays);

  const notes: string[] = [];
  if (d === 0) notes.push('The placed steps keep every order rule.');
  else {
    const exact = (n * (pairs - d)) / pairs;
    notes.push(`${plural(d, 'swap', 'swaps')} of neighbouring steps from the nearest correct order`);
    notes.push(`Order marks: ${n} placed × (1 − ${d}/${pairs}) = ${Number(exact.toFixed(2))}, rounded down to ${orderMarks}`);
  }
  if (missing.length > 0) notes.push(`${plural(missing.length, 'step', 'steps')} left out earn no mark`);
  if (strays > 0) notes.push(`${plural(strays, 'stray entry', 'stray entries')} (unknown or repeated) cost one mark each`);
  if (nearest.method === 'greedy') notes.push('Too many valid orders to compare them all; the nearest one is estimated.');

  return {
    stage: 'order',
    score,
    maxScore: procedure.steps.length,
    passed: results.every((r) => r.ok),
    results,
    notes,
  };
}
