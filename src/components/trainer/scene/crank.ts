import type { Vec3 } from '@models/types';
import { CAM_AXIS_XZ } from '@models/wren-160-layout';
import type { AttemptResult } from '../store';
import type { Stage } from '~/lib/procedure/schema';

// The crank check: what turns with the crankshaft, and when a wrong assembly order makes it bind.

/** A part that turns with the crank: about a vertical axis through `center`, `ratio` turns per crank turn. */
export interface Spin {
  center: Vec3;
  ratio: number;
}

// The Wren 160's crank train: everything on the crank axis turns with it; the cam gear, 2:1 and
// meshing, turns half as fast the other way about its own axis.
const SPINS: Record<string, Spin> = {
  crankshaft: { center: [0, 0, 0], ratio: 1 },
  flywheel: { center: [0, 0, 0], ratio: 1 },
  'flywheel-key': { center: [0, 0, 0], ratio: 1 },
  'flywheel-washer': { center: [0, 0, 0], ratio: 1 },
  'flywheel-nut': { center: [0, 0, 0], ratio: 1 },
  'cam-gear': { center: [CAM_AXIS_XZ[0], 0, CAM_AXIS_XZ[1]], ratio: -0.5 },
};

export function spinOf(modelKey: string): Spin | undefined {
  return Object.hasOwn(SPINS, modelKey) ? SPINS[modelKey] : undefined;
}

/** Models the learner can grab to turn the crank. */
export const CRANK_HANDLES: readonly string[] = ['crankshaft', 'flywheel'];

/** A binding crank stops after this many turns. */
export const BIND_AT_TURNS = 0.25;

/** Pixels of sideways drag per full turn of the crankshaft. */
export const PIXELS_PER_TURN = 240;

export const BINDING_MESSAGE =
  'The crankshaft binds after a quarter turn: a step missed in the assembly order is binding it. Check the Order stage.';

/** The crank binds when the server marked the learner's assembly order as not passed. */
export function crankBinds(results: Partial<Record<Stage, AttemptResult>>): boolean {
  const order = results.order;
  return order !== undefined && !order.passed;
}

/** The part of a requested turn the crank allows: a binding crank goes no further than a quarter turn forward. */
export function allowedCrankDelta(current: number, requested: number, binds: boolean): number {
  if (!binds || requested <= 0) return requested;
  return Math.max(0, Math.min(requested, BIND_AT_TURNS - current));
}
