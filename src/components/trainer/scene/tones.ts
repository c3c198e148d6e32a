import type { PublicProcedure } from '~/lib/procedure/public-view';
import type { AttemptResult } from '../store';

// How a drawn thing is marked: hovered, picked up, or judged by the server. The colour always comes
// with a ✓ / ✗ label (Labels.tsx), never alone.

export type Tone = 'plain' | 'hover' | 'selected' | 'bad' | 'good' | 'tapped';
export type Verdict = 'bad' | 'good';

/** Emissive glow for whole meshes (parts, pins on the bench). */
export const EMISSIVE: Record<Tone, { color: string; intensity: number }> = {
  plain: { color: '#000000', intensity: 0 },
  hover: { color: '#e7bc55', intensity: 0.35 },
  selected: { color: '#c9871f', intensity: 0.6 },
  tapped: { color: '#c9871f', intensity: 0.3 },
  bad: { color: '#c8402f', intensity: 0.75 },
  good: { color: '#2f8a4c', intensity: 0.45 },
};

/** Per-instance colours for instanced bolts and hole markers (instancing has no per-instance glow). */
export const INSTANCE_COLOR: Record<Tone, string> = {
  plain: '#ffffff',
  hover: '#fdf8ec',
  selected: '#e7bc55',
  tapped: '#dea633',
  bad: '#c8402f',
  good: '#2f8a4c',
};

/**
 * Which keys the server's answer marks right or wrong. A step's verdict lands on the parts it names;
 * a part named by a wrong step and a right one counts as wrong.
 */
export function verdicts(procedure: PublicProcedure, result: AttemptResult | undefined): Map<string, Verdict> {
  const marks = new Map<string, Verdict>();
  for (const line of result?.results ?? []) {
    const step = procedure.steps.find((s) => s.key === line.key);
    for (const key of step ? step.parts : [line.key]) {
      if (!line.ok) marks.set(key, 'bad');
      else if (!marks.has(key)) marks.set(key, 'good');
    }
  }
  return marks;
}

/** The tone a key shows: a wrong answer outranks a pick, which outranks a hover. */
export function toneFor(key: string, marks: Map<string, Verdict>, hovered: string | null, extra?: Tone): Tone {
  if (marks.get(key) === 'bad') return 'bad';
  if (extra && extra !== 'plain') return extra;
  if (hovered === key) return 'hover';
  if (marks.get(key) === 'good') return 'good';
  return 'plain';
}
