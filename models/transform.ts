import type { ExtrudeShape, Vec2, Vec3 } from './types';

// The same rotation three.js applies for Euler order 'XYZ' (matrix Rx·Ry·Rz), so tests can check
// where a hole drawn in a local outline ends up in the engine frame.
export function rotateXYZ([x, y, z]: Vec3, [a, b, c]: Vec3): Vec3 {
  // Rz first
  const x1 = x * Math.cos(c) - y * Math.sin(c);
  const y1 = x * Math.sin(c) + y * Math.cos(c);
  const z1 = z;
  // then Ry
  const x2 = x1 * Math.cos(b) + z1 * Math.sin(b);
  const y2 = y1;
  const z2 = -x1 * Math.sin(b) + z1 * Math.cos(b);
  // then Rx
  return [x2, y2 * Math.cos(a) - z2 * Math.sin(a), y2 * Math.sin(a) + z2 * Math.cos(a)];
}

/** A point given in a shape's local frame, placed in the model's frame. */
export function shapePointToModel(shape: { position: Vec3; rotation?: Vec3 }, local: Vec3): Vec3 {
  const r = rotateXYZ(local, shape.rotation ?? [0, 0, 0]);
  return [r[0] + shape.position[0], r[1] + shape.position[1], r[2] + shape.position[2]];
}

/** Where an outline point of an extrude lies on the extrude's start face (local z = 0). */
export function outlinePointToModel(shape: ExtrudeShape, [u, v]: Vec2): Vec3 {
  return shapePointToModel(shape, [u, v, 0]);
}
