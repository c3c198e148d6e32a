import { prerequisites } from '../procedure/graph';

// The editor's way of stating precedence: the steps in one list, each step either after the previous
// one or marked "may come in any order with the previous step". Runs of marked steps form groups;
// every step of a group waits for every step of the group before it. Stored as `after` constraints.

export interface OrderedStep {
  key: string;
  after: readonly string[];
}

/** Groups of step keys from the list and its marks (anyOrder[i]: step i joins step i − 1's group; anyOrder[0] is ignored). */
export function groupsFromMarks(keys: readonly string[], anyOrder: readonly boolean[]): string[][] {
  const groups: string[][] = [];
  keys.forEach((key, i) => {
    if (i > 0 && anyOrder[i] && groups.length > 0) groups[groups.length - 1]!.push(key);
    else groups.push([key]);
  });
  return groups;
}

/** `after` for every step: the whole previous group, nothing more (the rest follows through it). */
export function constraintsFromMarks(keys: readonly string[], anyOrder: readonly boolean[]): Map<string, string[]> {
  const out = new Map<string, string[]>();
  const groups = groupsFromMarks(keys, anyOrder);
  groups.forEach((group, g) => {
    for (const key of group) out.set(key, g === 0 ? [] : [...groups[g - 1]!]);
  });
  return out;
}

/** The steps with `after` rewritten from the list order and marks. */
export function applyMarks<T extends OrderedStep>(steps: readonly T[], anyOrder: readonly boolean[]): T[] {
  const after = constraintsFromMarks(steps.map((s) => s.key), anyOrder);
  return steps.map((s) => ({ ...s, after: after.get(s.key) ?? [] }));
}

/** Every step each step waits for, directly or through others; null on a cycle. */
export function closure(steps: readonly OrderedStep[]): Map<string, Set<string>> | null {
  const pre = prerequisites(steps);
  const out = new Map<string, Set<string>>();
  const state = new Map<string, 'open' | 'done'>();
  const visit = (key: string): boolean => {
    if (state.get(key) === 'done') return true;
    if (state.get(key) === 'open') return false;
    state.set(key, 'open');
    const set = new Set<string>();
    for (const p of pre.get(key) ?? []) {
      if (!visit(p)) return false;
      set.add(p);
      for (const q of out.get(p)!) set.add(q);
    }
    out.set(key, set);
    state.set(key, 'done');
    return true;
  };
  for (const key of pre.keys()) if (!visit(key)) return null;
  return out;
}

export interface ReadMarks {
  /** anyOrder[i]: step i may come in any order with step i − 1. */
  anyOrder: boolean[];
  /**
   * True when the list and marks say exactly what the stored constraints say. False when the document
   * was written by hand or imported with finer constraints (or a cycle): the editor then keeps them as they
   * are until the instructor reorders or changes a mark.
   */
  exact: boolean;
}

/** The marks that best describe stored constraints, read in the list's order. */
export function marksFromSteps(steps: readonly OrderedStep[]): ReadMarks {
  const needs = closure(steps);
  if (!needs) return { anyOrder: steps.map(() => false), exact: false };
  const anyOrder = steps.map((s, i) => {
    if (i === 0) return false;
    const prev = steps[i - 1]!;
    return !needs.get(s.key)!.has(prev.key) && !needs.get(prev.key)!.has(s.key);
  });
  const rebuilt = closure(applyMarks(steps, anyOrder))!;
  const exact = steps.every((s) => sameSet(needs.get(s.key)!, rebuilt.get(s.key)!));
  return { anyOrder, exact };
}

function sameSet(a: Set<string>, b: Set<string>): boolean {
  return a.size === b.size && [...a].every((x) => b.has(x));
}

/** Moves one item of a list (drag and drop, or the up and down buttons). */
export function moveItem<T>(items: readonly T[], from: number, to: number): T[] {
  const out = [...items];
  if (from < 0 || from >= out.length || to < 0 || to >= out.length) return out;
  const [item] = out.splice(from, 1);
  out.splice(to, 0, item!);
  return out;
}
