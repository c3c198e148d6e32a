import { prerequisites, type PrecedenceNode } from '../procedure/graph';

// Kendall tau distance: the number of pairs two orderings disagree on, which equals the
// fewest swaps of neighbours that turn one into the other.

function positions<T>(items: readonly T[]): Map<T, number> {
  const pos = new Map<T, number>();
  items.forEach((item, i) => {
    if (pos.has(item)) throw new RangeError('an ordering holds an item twice');
    pos.set(item, i);
  });
  return pos;
}

/** Inversions of a number array by merge sort, O(n log n). */
function countInversions(values: number[]): number {
  if (values.length < 2) return 0;
  const mid = values.length >> 1;
  const left = values.slice(0, mid);
  const right = values.slice(mid);
  let count = countInversions(left) + countInversions(right);
  let i = 0;
  let j = 0;
  let k = 0;
  while (i < left.length && j < right.length) {
    if (left[i]! <= right[j]!) values[k++] = left[i++]!;
    else {
      // Every item still waiting on the left is larger than right[j]: each is one discordant pair.
      count += left.length - i;
      values[k++] = right[j++]!;
    }
  }
  while (i < left.length) values[k++] = left[i++]!;
  while (j < right.length) values[k++] = right[j++]!;
  return count;
}

/** Pairs ordered differently by `a` and `b`, which must be orderings of the same distinct items. */
export function kendallTauDistance<T>(a: readonly T[], b: readonly T[]): number {
  if (a.length !== b.length) throw new RangeError('orderings differ in length');
  positions(a);
  const posB = positions(b);
  const ranks = a.map((item) => {
    const p = posB.get(item);
    if (p === undefined) throw new RangeError('orderings hold different items');
    return p;
  });
  return countInversions(ranks);
}

/** Distance divided by the number of pairs, n(n−1)/2: 0 = same order, 1 = reversed. */
export function normalisedKendallDistance<T>(a: readonly T[], b: readonly T[]): number {
  const pairs = (a.length * (a.length - 1)) / 2;
  const d = kendallTauDistance(a, b);
  return pairs === 0 ? 0 : d / pairs;
}

export interface NearestExtension {
  order: string[];
  /** Kendall tau distance from the learner's sequence to `order`. */
  distance: number;
  /** 'exact': provably nearest; 'greedy': the search budget ran out and this is an estimate. */
  method: 'exact' | 'greedy';
}

/**
 * States the exact search may memoise before it gives up and falls back to the greedy order.
 * 50k keeps a scrambled answer to a loosely ordered 30-step procedure near 0.15 s of server CPU.
 */
export const DEFAULT_STATE_BUDGET = 50_000;

interface Prepared {
  n: number;
  /** Bit i stands for the step at position i in the learner's sequence. */
  bits: bigint[];
  /** Prerequisites of each position, as a mask of positions. */
  preds: bigint[];
  /** Mask of all positions before i. */
  below: bigint[];
}

function prepare(sequence: readonly string[], steps: readonly PrecedenceNode[]): Prepared {
  const pre = prerequisites(steps);
  if (sequence.length !== pre.size) throw new RangeError('sequence must hold every step exactly once');
  const pos = positions(sequence);
  for (const key of pre.keys()) if (!pos.has(key)) throw new RangeError(`sequence lacks step ${key}`);
  const n = sequence.length;
  const bits = sequence.map((_, i) => 1n << BigInt(i));
  const preds = sequence.map((key) => pre.get(key)!.reduce((m, p) => m | bits[pos.get(p)!]!, 0n));
  const below = bits.map((b) => b - 1n);
  return { n, bits, preds, below };
}

function popcount(mask: bigint): number {
  let count = 0;
  for (let m = mask; m !== 0n; m >>= 32n) {
    let x = Number(m & 0xffffffffn);
    x -= (x >>> 1) & 0x55555555;
    x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
    count += Math.imul((x + (x >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24;
  }
  return count;
}

/**
 * The valid order built by always taking, among the steps whose prerequisites are placed,
 * the one the learner put earliest. Fast, usually near the best, not always the best.
 */
export function greedyLinearExtension(sequence: readonly string[], steps: readonly PrecedenceNode[]): NearestExtension {
  const { n, bits, preds } = prepare(sequence, steps);
  let placed = 0n;
  const order: string[] = [];
  while (order.length < n) {
    const i = bits.findIndex((b, k) => (placed & b) === 0n && (preds[k]! & placed) === preds[k]);
    if (i < 0) throw new Error('steps form a cycle; validate the procedure first');
    placed |= bits[i]!;
    order.push(sequence[i]!);
  }
  return { order, distance: kendallTauDistance(order, sequence), method: 'greedy' };
}

class BudgetExceeded extends Error {}

/**
 * The linear extension of the precedence DAG nearest to the learner's `sequence` in Kendall tau distance.
 *
 * Exact: a DP over downsets (sets of placed steps closed under prerequisites), memoised by bitmask.
 * Appending step x to downset S costs the number of unplaced steps the learner put before x, and those
 * costs sum to the Kendall distance. Procedure DAGs are narrow, so there are few downsets; above
 * `stateBudget` memoised states the search stops and the greedy order is returned instead (method 'greedy').
 * Ties go to the step the learner put earliest, so the answer is deterministic.
 */
export function nearestLinearExtension(
  sequence: readonly string[],
  steps: readonly PrecedenceNode[],
  stateBudget: number = DEFAULT_STATE_BUDGET,
): NearestExtension {
  const { n, bits, preds, below } = prepare(sequence, steps);
  const full = (1n << BigInt(n)) - 1n;
  const memo = new Map<bigint, number>();

  const available = (placed: bigint, i: number) =>
    (placed & bits[i]!) === 0n && (preds[i]! & placed) === preds[i];
  const cost = (placed: bigint, i: number) => i - popcount(placed & below[i]!);
  // The learner's earliest unplaced step, when free to go, is always an optimal next step
  // (moving it to the front only removes discordant pairs), so the search need not branch there.
  const forced = (placed: bigint): number => {
    for (let i = 0; i < n; i++) if ((placed & bits[i]!) === 0n) return available(placed, i) ? i : -1;
    return -1;
  };

  const solve = (placed: bigint): number => {
    if (placed === full) return 0;
    const known = memo.get(placed);
    if (known !== undefined) return known;
    if (memo.size >= stateBudget) throw new BudgetExceeded();
    let best = Infinity;
    const f = forced(placed);
    if (f >= 0) best = solve(placed | bits[f]!);
    else {
      for (let i = 0; i < n; i++) {
        if (!available(placed, i)) continue;
        const c = cost(placed, i) + solve(placed | bits[i]!);
        if (c < best) best = c;
      }
    }
    if (best === Infinity) throw new Error('steps form a cycle; validate the procedure first');
    memo.set(placed, best);
    return best;
  };

  let distance: number;
  try {
    distance = solve(0n);
  } catch (e) {
    if (e instanceof BudgetExceeded) return greedyLinearExtension(sequence, steps);
    throw e;
  }

  // Walk the memo: at each downset take the first step that keeps the optimum.
  const order: string[] = [];
  let placed = 0n;
  while (placed !== full) {
    const target = solve(placed);
    const f = forced(placed);
    let pick = f;
    if (f < 0) {
      for (let i = 0; i < n; i++) {
        if (available(placed, i) && cost(placed, i) + solve(placed | bits[i]!) === target) {
          pick = i;
          break;
        }
      }
    }
    placed |= bits[pick]!;
    order.push(sequence[pick]!);
  }
  return { order, distance, method: 'exact' };
}
