// Precedence helpers over a procedure's steps: each step lists in `after` the steps that come first.
// Keys in `after` that are not steps are ignored here; validation reports them.

/** The part of a step that precedence needs. */
export interface PrecedenceNode {
  key: string;
  after: readonly string[];
}

/** Direct prerequisites of each step, limited to keys that are steps. */
export function prerequisites(steps: readonly PrecedenceNode[]): Map<string, string[]> {
  const keys = new Set(steps.map((s) => s.key));
  const out = new Map<string, string[]>();
  for (const step of steps) {
    const list = out.get(step.key) ?? [];
    for (const p of step.after) if (keys.has(p) && !list.includes(p)) list.push(p);
    out.set(step.key, list);
  }
  return out;
}

/**
 * A linear extension of the precedence DAG, or null when the steps form a cycle.
 * Among ready steps the one listed first wins, so the same input always gives the same order.
 */
export function topoOrder(steps: readonly PrecedenceNode[]): string[] | null {
  const pre = prerequisites(steps);
  const keys = [...pre.keys()];
  const placed = new Set<string>();
  const order: string[] = [];
  while (order.length < keys.length) {
    const next = keys.find((k) => !placed.has(k) && pre.get(k)!.every((p) => placed.has(p)));
    if (next === undefined) return null;
    placed.add(next);
    order.push(next);
  }
  return order;
}

/**
 * One cycle in the precedence graph as a closed walk along `after` links
 * (e.g. ['seat-sump', 'fit-gasket', 'seat-sump']: seat-sump waits for fit-gasket, which waits for seat-sump),
 * or null when there is none.
 */
export function findCycle(steps: readonly PrecedenceNode[]): string[] | null {
  const pre = prerequisites(steps);
  const state = new Map<string, 'open' | 'done'>();
  const path: string[] = [];

  const visit = (key: string): string[] | null => {
    state.set(key, 'open');
    path.push(key);
    for (const p of pre.get(key)!) {
      const s = state.get(p);
      if (s === 'open') return [...path.slice(path.indexOf(p)), p];
      if (s === undefined) {
        const found = visit(p);
        if (found) return found;
      }
    }
    path.pop();
    state.set(key, 'done');
    return null;
  };

  for (const key of pre.keys()) {
    if (state.has(key)) continue;
    const found = visit(key);
    if (found) return found;
  }
  return null;
}

/** True when `sequence` holds every step exactly once and no step comes before one it waits for. */
export function isLinearExtension(sequence: readonly string[], steps: readonly PrecedenceNode[]): boolean {
  const pre = prerequisites(steps);
  if (sequence.length !== pre.size) return false;
  const seen = new Set<string>();
  for (const key of sequence) {
    const needs = pre.get(key);
    if (needs === undefined || seen.has(key)) return false;
    if (!needs.every((p) => seen.has(p))) return false;
    seen.add(key);
  }
  return true;
}

/** Every step each step waits for, directly or through others. Throws on a cycle (validate first). */
export function needsSets(steps: readonly PrecedenceNode[]): Map<string, Set<string>> {
  const order = topoOrder(steps);
  if (order === null) throw new Error('steps form a cycle; validate the procedure first');
  const pre = prerequisites(steps);
  const needs = new Map<string, Set<string>>();
  // In topological order every prerequisite's set is complete before it is used.
  for (const key of order) {
    const set = new Set<string>();
    for (const p of pre.get(key)!) {
      set.add(p);
      for (const q of needs.get(p)!) set.add(q);
    }
    needs.set(key, set);
  }
  return needs;
}
