import type { Vec3 } from '../../lib/procedure/schema';

// Bolt positions as the learner sees them from the bolt heads: projected onto the plane normal to the
// group's axis, so the list path can show where each bolt sits (a clock face per bolt, a map per pass).

export interface BoltSpot {
  key: string;
  /** Right of the group's centre, in the same units as the positions. */
  x: number;
  /** Up from the group's centre. */
  y: number;
  /** Clockwise from 12 o'clock, degrees in [0, 360). */
  angle: number;
  /** 1..12 */
  hour: number;
}

const dot = (a: Vec3, b: Vec3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const cross = (a: Vec3, b: Vec3): Vec3 => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
const scale = (a: Vec3, k: number): Vec3 => [a[0] * k, a[1] * k, a[2] * k];
const sub = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const unit = (a: Vec3): Vec3 => scale(a, 1 / Math.hypot(...a));

/**
 * `axis` is the way a bolt travels going in; the viewer looks the same way (standing at the bolt heads).
 * Up on the map is the engine's +Y where that lies in the plane, otherwise the cylinder's +X.
 */
export function boltMap(bolts: readonly { key: string; position: Vec3 }[], axis: Vec3): BoltSpot[] {
  if (bolts.length === 0) return [];
  const look = unit(axis);
  const reference: Vec3 = Math.abs(look[1]) < 0.9 ? [0, 1, 0] : [1, 0, 0];
  const up = unit(sub(reference, scale(look, dot(reference, look))));
  // Screen axes: right × up points at the viewer, i.e. against the look direction.
  const right = cross(up, scale(look, -1));
  const centre = scale(
    bolts.reduce<Vec3>((sum, b) => [sum[0] + b.position[0], sum[1] + b.position[1], sum[2] + b.position[2]], [0, 0, 0]),
    1 / bolts.length,
  );
  return bolts.map((b) => {
    const rel = sub(b.position, centre);
    const x = dot(rel, right);
    const y = dot(rel, up);
    const angle = ((Math.atan2(x, y) * 180) / Math.PI + 360) % 360;
    const hour = Math.round(angle / 30) % 12 || 12;
    return { key: b.key, x, y, angle, hour };
  });
}
