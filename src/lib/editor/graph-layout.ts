import { prerequisites } from '../procedure/graph';
import { closure, type OrderedStep } from './ordering';

// A layered drawing of the precedence graph: each step in the column after the longest chain of steps
// it waits for, edges only for direct waits that are not implied by others (the transitive reduction).

export interface GraphNode {
  key: string;
  layer: number;
  /** Row within its layer, in the list's order. */
  row: number;
}

export interface GraphLayout {
  nodes: GraphNode[];
  /** [from, to]: `to` waits for `from`. */
  edges: [string, string][];
  layers: number;
  rows: number;
}

/** Null when the steps form a cycle (validation names it). */
export function layoutPrecedence(steps: readonly OrderedStep[]): GraphLayout | null {
  const needs = closure(steps);
  if (!needs) return null;
  const pre = prerequisites(steps);
  const layer = new Map<string, number>();
  const layerOf = (key: string): number => {
    const known = layer.get(key);
    if (known !== undefined) return known;
    const value = Math.max(-1, ...pre.get(key)!.map(layerOf)) + 1;
    layer.set(key, value);
    return value;
  };
  const rowsUsed: number[] = [];
  const nodes = [...pre.keys()].map((key) => {
    const l = layerOf(key);
    const row = rowsUsed[l] ?? 0;
    rowsUsed[l] = row + 1;
    return { key, layer: l, row };
  });
  const edges: [string, string][] = [];
  for (const [key, direct] of pre) {
    for (const p of direct) {
      // Drop p → key when another direct prerequisite already waits for p.
      const implied = direct.some((q) => q !== p && needs.get(q)!.has(p));
      if (!implied) edges.push([p, key]);
    }
  }
  return { nodes, edges, layers: rowsUsed.length, rows: Math.max(0, ...rowsUsed) };
}
