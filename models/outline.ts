import type { Vec2 } from './types';

/** Rounded rectangle as a closed counter-clockwise polygon (last point joins the first). */
export function roundedRect(
  uMin: number,
  uMax: number,
  vMin: number,
  vMax: number,
  radius: number,
  stepsPerCorner = 4,
): Vec2[] {
  const corners: [number, number, number][] = [
    [uMax - radius, vMin + radius, -Math.PI / 2],
    [uMax - radius, vMax - radius, 0],
    [uMin + radius, vMax - radius, Math.PI / 2],
    [uMin + radius, vMin + radius, Math.PI],
  ];
  const points: Vec2[] = [];
  for (const [cu, cv, start] of corners) {
    for (let i = 0; i <= stepsPerCorner; i++) {
      const a = start + (i / stepsPerCorner) * (Math.PI / 2);
      points.push([cu + radius * Math.cos(a), cv + radius * Math.sin(a)]);
    }
  }
  return points;
}
