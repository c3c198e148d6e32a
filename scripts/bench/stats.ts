// Nearest-rank percentiles: the reported value is one that was actually measured.

export interface Summary {
  count: number;
  median: number;
  p99: number;
  max: number;
}

export function summarize(values: ArrayLike<number>): Summary {
  const sorted = Float64Array.from(values).sort();
  if (sorted.length === 0) return { count: 0, median: Number.NaN, p99: Number.NaN, max: Number.NaN };
  const at = (p: number) => sorted[Math.max(1, Math.ceil((p / 100) * sorted.length)) - 1]!;
  return { count: sorted.length, median: at(50), p99: at(99), max: sorted[sorted.length - 1]! };
}
