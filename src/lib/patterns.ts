import type { PATTERN_RULES } from './procedure/schema';

// Tightening-sequence rules, judged on bolt positions projected onto the plane normal to the bolt
// axis. Both rules are written as "which bolts may come next", so a checker, a hint and an example
// sequence all come from the same definition and any sequence the rule allows is accepted.

export type PatternRule = (typeof PATTERN_RULES)[number];
export type Point2 = readonly [number, number];
type Point3 = readonly [number, number, number];

export interface BoltPosition {
  key: string;
  position: Point3;
}

export type SequenceCheck =
  | { ok: true }
  | { ok: false; index: number; key: string; message: string };

export const RULE_DESCRIPTIONS: Record<PatternRule, string> = {
  cross:
    'Tighten in pairs across the circle: the second bolt of each pair opposite the first, and each new pair as far as possible from the bolts already tightened.',
  opposite:
    'Start with a bolt near the middle; each next bolt goes roughly opposite the last one across the part, working from the middle out.',
};

const DEGREE = Math.PI / 180;
// Bolt circles drawn by hand or rounded to the millimetre are never exact; 5° still separates 16 bolts (22.5° apart).
const MAX_ANGLE_TIE = 5 * DEGREE;
// "Nearest the middle" and "not farther out than needed" compare radii to a tenth of the part's size.
const RADIUS_TIE_SHARE = 0.1;
// A strict "more than 90°" that float noise on an exact right angle cannot flip.
const ACROSS_COS = -1e-9;

// ---------- geometry ----------

function sub(a: Point3, b: Point3): Point3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}
function dot(a: Point3, b: Point3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}
function cross3(a: Point3, b: Point3): Point3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}
function scale(a: Point3, k: number): Point3 {
  return [a[0] * k, a[1] * k, a[2] * k];
}
function normalize(a: Point3): Point3 {
  const length = Math.hypot(a[0], a[1], a[2]);
  if (!(length > 0) || !Number.isFinite(length)) throw new RangeError('the bolt axis must be a non-zero vector');
  return scale(a, 1 / length);
}

/** Bolt positions as 2D points in the plane normal to `axis` (same order as `positions`). */
export function projectOntoPlane(positions: readonly Point3[], axis: Point3): Point2[] {
  const n = normalize(axis);
  // Start the in-plane basis from the coordinate axis least aligned with n, so it never degenerates.
  const abs = n.map(Math.abs);
  const seed: Point3 = abs[0] <= abs[1] && abs[0] <= abs[2] ? [1, 0, 0] : abs[1] <= abs[2] ? [0, 1, 0] : [0, 0, 1];
  const u = normalize(sub(seed, scale(n, dot(seed, n))));
  const v = cross3(n, u);
  return positions.map((p) => [dot(p, u), dot(p, v)] as const);
}

function centroid(points: readonly Point2[]): Point2 {
  let x = 0;
  let y = 0;
  for (const p of points) {
    x += p[0];
    y += p[1];
  }
  return points.length === 0 ? [0, 0] : [x / points.length, y / points.length];
}

/** Least-squares circle through the points (algebraic fit), or null when they are (nearly) on a line. */
export function fitCircle(points: readonly Point2[]): { center: Point2; radius: number } | null {
  const n = points.length;
  if (n < 3) return null;
  const [mx, my] = centroid(points);
  // Centre and scale the data first so metres and millimetres fit equally well.
  const spread = Math.sqrt(points.reduce((sum, p) => sum + (p[0] - mx) ** 2 + (p[1] - my) ** 2, 0) / n);
  if (!(spread > 0)) return null;
  let sxx = 0, sxy = 0, syy = 0, sxz = 0, syz = 0, sz = 0;
  for (const p of points) {
    const x = (p[0] - mx) / spread;
    const y = (p[1] - my) / spread;
    const z = x * x + y * y;
    sxx += x * x;
    sxy += x * y;
    syy += y * y;
    sxz += x * z;
    syz += y * z;
    sz += z;
  }
  const det = sxx * syy - sxy * sxy;
  if (det < 1e-9 * n * n) return null;
  // x² + y² + Dx + Ey + F = 0 with the centred sums; F follows from Σx = Σy = 0.
  const D = (-sxz * syy + syz * sxy) / det;
  const E = (-syz * sxx + sxz * sxy) / det;
  const F = -sz / n;
  const r2 = (D * D + E * E) / 4 - F;
  if (!(r2 > 0)) return null;
  return { center: [mx - (D / 2) * spread, my - (E / 2) * spread], radius: Math.sqrt(r2) * spread };
}

/**
 * True when every point lies within `tolerance` (a share of the radius) of one circle.
 * Two distinct points always do (centre between them); one point does not make a circle.
 */
export function isOnCircle(points: readonly Point2[], tolerance = 0.05): boolean {
  if (points.length < 2) return false;
  if (points.length === 2) return points[0][0] !== points[1][0] || points[0][1] !== points[1][1];
  const circle = fitCircle(points);
  if (!circle) return false;
  return points.every(
    (p) => Math.abs(Math.hypot(p[0] - circle.center[0], p[1] - circle.center[1]) - circle.radius) <= tolerance * circle.radius,
  );
}

function angularDistance(a: number, b: number): number {
  const d = Math.abs(a - b) % (2 * Math.PI);
  return d > Math.PI ? 2 * Math.PI - d : d;
}

// ---------- canonical cross pattern ----------

/**
 * The usual cross (star) order for n bolts numbered clockwise 1…n on a circle.
 * Each pair: the bolt farthest from those already tightened (ties: farthest from the last pair,
 * then the lowest number), then the bolt opposite it. Gives 1-3-2-4, 1-5-3-7-2-6-4-8 and so on.
 */
export function crossPattern(n: number): number[] {
  if (!Number.isInteger(n) || n < 1) throw new RangeError('the bolt count must be a whole number of at least 1');
  // Integer steps around the circle keep the ties exact.
  const gap = (i: number, j: number) => {
    const d = Math.abs(i - j) % n;
    return Math.min(d, n - d);
  };
  const done: number[] = [];
  const left = new Set(Array.from({ length: n }, (_, i) => i));
  const take = (i: number) => {
    done.push(i);
    left.delete(i);
  };
  while (left.size > 0) {
    if (done.length % 2 === 1) {
      const first = done[done.length - 1]!;
      // Opposite: the step count closest to n/2, compared doubled to stay in integers.
      let best = -1;
      let bestOff = Infinity;
      for (const i of left) {
        const off = Math.abs(2 * gap(i, first) - n);
        if (off < bestOff) [best, bestOff] = [i, off];
      }
      take(best);
      continue;
    }
    const lastPair = done.slice(-2);
    let best = -1;
    let bestFar = -1;
    let bestFromPair = -1;
    for (const i of left) {
      const far = done.length === 0 ? 0 : Math.min(...done.map((d) => gap(i, d)));
      const fromPair = lastPair.length === 0 ? 0 : Math.min(...lastPair.map((d) => gap(i, d)));
      if (far > bestFar || (far === bestFar && fromPair > bestFromPair)) {
        [best, bestFar, bestFromPair] = [i, far, fromPair];
      }
    }
    take(best);
  }
  return done.map((i) => i + 1);
}

// ---------- rules as "which bolts may come next" ----------

type StepKind = 'pair-start' | 'pair-partner' | 'start' | 'across' | 'most-opposite';

interface Step {
  kind: StepKind;
  /** Bolt indexes the rule allows next. Never empty while bolts remain. */
  allowed: number[];
  /** The bolt the step is judged against (the previous one), if any. */
  ref: number | null;
  /** Opposite rule: the remaining bolts across from `ref` (before the middle-out filter). */
  across?: number[];
}

interface Layout {
  keys: string[];
  points: Point2[];
  next(done: readonly number[], remaining: readonly number[]): Step;
  /** Allowed bolts, best example first (for hints and previews). */
  preferred(step: Step, done: readonly number[]): number[];
}

function withinOf(values: Map<number, number>, best: number, tie: number, keep: 'min' | 'max'): number[] {
  return [...values]
    .filter(([, v]) => (keep === 'min' ? v <= best + tie : v >= best - tie))
    .map(([i]) => i)
    .sort((a, b) => a - b);
}

/**
 * Cross: bolts go in pairs. A pair starts at any untightened bolt whose smallest angle to the
 * tightened bolts is largest (within a small tie); its partner is the untightened bolt nearest to
 * diametrically opposite. Angles are taken about the fitted circle's centre.
 */
function crossLayout(keys: string[], points: Point2[]): Layout {
  const fit = points.length >= 3 && isOnCircle(points) ? fitCircle(points) : null;
  // Off a circle the centroid is the best stand-in for the centre; the rule stays satisfiable.
  const [cx, cy] = fit ? fit.center : centroid(points);
  const angle = points.map((p) => Math.atan2(p[1] - cy, p[0] - cx));
  const tie = Math.min(MAX_ANGLE_TIE, Math.PI / (2 * Math.max(1, points.length)));
  const farFrom = (i: number, set: readonly number[]) => Math.min(...set.map((d) => angularDistance(angle[i]!, angle[d]!)));

  return {
    keys,
    points,
    next(done, remaining) {
      if (done.length % 2 === 1) {
        const ref = done[done.length - 1]!;
        const off = new Map(remaining.map((i) => [i, angularDistance(angle[i]!, angle[ref]! + Math.PI)]));
        return { kind: 'pair-partner', ref, allowed: withinOf(off, Math.min(...off.values()), tie, 'min') };
      }
      if (done.length === 0) return { kind: 'pair-start', ref: null, allowed: [...remaining].sort((a, b) => a - b) };
      const far = new Map(remaining.map((i) => [i, farFrom(i, done)]));
      return {
        kind: 'pair-start',
        ref: done[done.length - 1]!,
        allowed: withinOf(far, Math.max(...far.values()), tie, 'max'),
      };
    },
    preferred(step, done) {
      if (step.kind !== 'pair-start' || done.length < 2) return step.allowed;
      // Among equals, start the pair away from the last pair too: this reproduces the usual star order.
      const lastPair = done.slice(-2);
      const fromPair = new Map(step.allowed.map((i) => [i, farFrom(i, lastPair)]));
      return withinOf(fromPair, Math.max(...fromPair.values()), tie, 'max');
    },
  };
}

/**
 * Opposite: start at a bolt nearest the centroid (within a tenth of the part's size). Each next bolt
 * is either one of the most nearly opposite the last bolt (largest angle about the centroid), or,
 * among the bolts more than 90° from it, one of those nearest the middle.
 */
function oppositeLayout(keys: string[], points: Point2[]): Layout {
  const [cx, cy] = centroid(points);
  const vec = points.map((p) => [p[0] - cx, p[1] - cy] as const);
  const radius = vec.map((v) => Math.hypot(v[0], v[1]));
  const maxRadius = Math.max(0, ...radius);
  const radiusTie = RADIUS_TIE_SHARE * maxRadius;
  // Unit directions, normalised one vector at a time so tiny layouts cannot underflow to 0/0.
  // A bolt on the centroid has no direction (null): it counts as across from every bolt.
  const direction = vec.map((v, i) => {
    const r = radius[i]!;
    if (!(r > 1e-9 * maxRadius)) return null;
    const d = [v[0] / r, v[1] / r] as const;
    return Number.isFinite(d[0]) && Number.isFinite(d[1]) ? d : null;
  });
  const cosBetween = (i: number, j: number) => {
    const a = direction[i];
    const b = direction[j];
    return a && b ? Math.max(-1, Math.min(1, a[0] * b[0] + a[1] * b[1])) : -1;
  };
  const nearestMiddle = (set: readonly number[]) => {
    const r = new Map(set.map((i) => [i, radius[i]!]));
    return withinOf(r, Math.min(...r.values()), radiusTie, 'min');
  };

  return {
    keys,
    points,
    next(done, remaining) {
      if (done.length === 0) return { kind: 'start', ref: null, allowed: nearestMiddle(remaining) };
      const ref = done[done.length - 1]!;
      const across = remaining.filter((i) => cosBetween(ref, i) < ACROSS_COS);
      const apart = new Map(remaining.map((i) => [i, Math.acos(cosBetween(ref, i))]));
      // Straight across is always right; so is crossing to the bolt nearest the middle (middle out).
      // With nothing left across, the most nearly opposite bolts are the best there is.
      const mostOpposite = withinOf(apart, Math.max(...apart.values()), MAX_ANGLE_TIE, 'max');
      const inward = across.length > 0 ? nearestMiddle(across) : [];
      const allowed = [...new Set([...mostOpposite, ...inward])].sort((a, b) => a - b);
      return { kind: across.length > 0 ? 'across' : 'most-opposite', ref, across, allowed };
    },
    preferred(step) {
      if (step.ref === null) return step.allowed;
      const ref = step.ref;
      // Example sequences go straight across when they can: the most opposite first.
      return [...step.allowed].sort((a, b) => cosBetween(ref, a) - cosBetween(ref, b) || a - b);
    },
  };
}

function buildLayout(bolts: readonly BoltPosition[], axis: Point3, rule: PatternRule): Layout {
  const keys = bolts.map((b) => b.key);
  if (new Set(keys).size !== keys.length) throw new RangeError('bolt keys in a group must be unique');
  const points = bolts.length === 0 ? [] : projectOntoPlane(bolts.map((b) => b.position), axis);
  return rule === 'cross' ? crossLayout(keys, points) : oppositeLayout(keys, points);
}

// ---------- messages ----------

/** 'bolt-3' → 'bolt 3', '3' → 'bolt 3', 'b3' → 'bolt b3'. */
export function boltLabel(key: string): string {
  const rest = key.replace(/^bolt[-_ ]?/i, '');
  return `bolt ${rest === '' ? key : rest}`;
}

function listLabels(keys: readonly string[]): string {
  const names = keys.slice(0, 3).map(boltLabel);
  if (keys.length > 3) return `${names.join(', ')} …`;
  if (names.length <= 1) return names.join('');
  return `${names.slice(0, -1).join(', ')} or ${names[names.length - 1]}`;
}

function explain(layout: Layout, step: Step, chosen: number, done: readonly number[]): string {
  const name = boltLabel(layout.keys[chosen]!);
  const ref = step.ref === null ? '' : boltLabel(layout.keys[step.ref]!);
  const such = `such as ${listLabels(step.allowed.map((i) => layout.keys[i]!))}`;
  const distance = (i: number, j: number) =>
    Math.hypot(layout.points[i]![0] - layout.points[j]![0], layout.points[i]![1] - layout.points[j]![1]);
  switch (step.kind) {
    case 'pair-partner':
      return `${name} is not across the circle from ${ref}; the second bolt of each pair goes opposite the first, ${such}`;
    case 'pair-start': {
      const nearest = [...done].sort((a, b) => distance(chosen, a) - distance(chosen, b))[0]!;
      return `${name} is close to ${boltLabel(layout.keys[nearest]!)}, already tightened; start the next pair as far as possible from the tightened bolts, ${such}`;
    }
    case 'start':
      return `${name} is out toward the edge; start with a bolt nearest the middle of the part, ${such}`;
    case 'across':
      if (step.across?.includes(chosen)) {
        return `${name} is across from ${ref} but neither straight across nor the nearest to the middle; work from the middle out, ${such}`;
      }
      return `${name} follows ${ref} on the same side; the next bolt should be across the part, roughly opposite ${ref}, ${such}`;
    case 'most-opposite':
      return `no bolt left is across from ${ref}; take the one most nearly opposite it, ${such}`;
  }
}

// ---------- public checks ----------

/**
 * Checks one pass's tightening sequence against the rule. Reports the first bolt that breaks it:
 * a key not in the group, a bolt tightened twice, a bolt the rule does not allow next, or bolts left out.
 */
export function checkSequence(
  bolts: readonly BoltPosition[],
  axis: Point3,
  rule: PatternRule,
  sequence: readonly unknown[],
): SequenceCheck {
  const layout = buildLayout(bolts, axis, rule);
  const indexOf = new Map(layout.keys.map((k, i) => [k, i]));
  const seenAt = new Map<number, number>();
  const done: number[] = [];
  let remaining = layout.keys.map((_, i) => i);

  for (let position = 0; position < sequence.length; position++) {
    const entry = sequence[position];
    const key = typeof entry === 'string' ? entry : String(entry);
    // Only strings name bolts: a number 3 from a client is not bolt '3'.
    const index = typeof entry === 'string' ? indexOf.get(entry) : undefined;
    if (index === undefined) {
      return { ok: false, index: position, key, message: `"${key}" is not a bolt in this group` };
    }
    const earlier = seenAt.get(index);
    if (earlier !== undefined) {
      return {
        ok: false,
        index: position,
        key,
        message: `${boltLabel(key)} appears twice (positions ${earlier + 1} and ${position + 1}); each bolt is tightened once per pass`,
      };
    }
    const step = layout.next(done, remaining);
    if (!step.allowed.includes(index)) {
      return { ok: false, index: position, key, message: explain(layout, step, index, done) };
    }
    seenAt.set(index, position);
    done.push(index);
    remaining = remaining.filter((i) => i !== index);
  }

  if (remaining.length > 0) {
    const missing = remaining.map((i) => layout.keys[i]!);
    const names = missing.map(boltLabel);
    return {
      ok: false,
      index: sequence.length,
      key: missing[0]!,
      message: `the sequence leaves out ${names.length === 1 ? names[0] : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`}; every bolt is tightened once per pass`,
    };
  }
  return { ok: true };
}

/** Keys the rule allows next after `done` (unknown or repeated keys in `done` are ignored). */
export function nextBolts(
  bolts: readonly BoltPosition[],
  axis: Point3,
  rule: PatternRule,
  done: readonly string[],
): string[] {
  const layout = buildLayout(bolts, axis, rule);
  const indexOf = new Map(layout.keys.map((k, i) => [k, i]));
  const doneIdx = [...new Set(done.map((k) => indexOf.get(k)).filter((i): i is number => i !== undefined))];
  const remaining = layout.keys.map((_, i) => i).filter((i) => !doneIdx.includes(i));
  if (remaining.length === 0) return [];
  return layout.next(doneIdx, remaining).allowed.map((i) => layout.keys[i]!);
}

/** One sequence the rule accepts, chosen to read well (the usual star order on an even circle). */
export function exampleSequence(bolts: readonly BoltPosition[], axis: Point3, rule: PatternRule): string[] {
  const layout = buildLayout(bolts, axis, rule);
  const done: number[] = [];
  let remaining = layout.keys.map((_, i) => i);
  while (remaining.length > 0) {
    const step = layout.next(done, remaining);
    const pick = layout.preferred(step, done)[0]!;
    done.push(pick);
    remaining = remaining.filter((i) => i !== pick);
  }
  return done.map((i) => layout.keys[i]!);
}
