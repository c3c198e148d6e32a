import type { PaletteColor } from './palette';
import type { BoxShape, CylinderShape, Vec2, Vec3 } from './types';

/** Boxes spread evenly round a vertical axis, long side radial (gear teeth, flywheel fins). */
export function radialBoxes(
  count: number,
  center: Vec2,
  radius: number,
  y: number,
  size: Vec3,
  color?: PaletteColor,
): BoxShape[] {
  return Array.from({ length: count }, (_, i) => {
    const angle = (2 * Math.PI * i) / count;
    const box: BoxShape = {
      type: 'box',
      size,
      position: [center[0] + radius * Math.cos(angle), y, center[1] + radius * Math.sin(angle)],
      // A turn of −angle about Y points local +X at (cos angle, sin angle) in the x–z plane.
      rotation: [0, -angle, 0],
    };
    return color ? { ...box, color } : box;
  });
}

/** A cylinder lying along X between two x values. */
export function cylinderAlongX(
  xFrom: number,
  xTo: number,
  radius: number,
  y: number,
  z: number,
  segments = 24,
  color?: PaletteColor,
): CylinderShape {
  const shape: CylinderShape = {
    type: 'cylinder',
    radiusTop: radius,
    radiusBottom: radius,
    height: xTo - xFrom,
    segments,
    position: [(xFrom + xTo) / 2, y, z],
    rotation: [0, 0, Math.PI / 2],
  };
  return color ? { ...shape, color } : shape;
}

/** A vertical cylinder between two heights. */
export function cylinderAlongY(
  yFrom: number,
  yTo: number,
  radius: number,
  x = 0,
  z = 0,
  segments = 24,
  color?: PaletteColor,
): CylinderShape {
  const shape: CylinderShape = {
    type: 'cylinder',
    radiusTop: radius,
    radiusBottom: radius,
    height: yTo - yFrom,
    segments,
    position: [x, (yFrom + yTo) / 2, z],
  };
  return color ? { ...shape, color } : shape;
}

/** Solid pin centred on the origin along Y, with small chamfers at both ends (millimetre sizes in). */
export function pinShapes(diameterMm: number, lengthMm: number): CylinderShape[] {
  const r = diameterMm / 2000;
  const length = lengthMm / 1000;
  const chamfer = 0.001;
  const body = length - 2 * chamfer;
  const end = (y: number, top: number, bottom: number): CylinderShape => ({
    type: 'cylinder', radiusTop: top, radiusBottom: bottom, height: chamfer, segments: 24, position: [0, y, 0],
  });
  return [
    { type: 'cylinder', radiusTop: r, radiusBottom: r, height: body, segments: 24, position: [0, 0, 0] },
    end(body / 2 + chamfer / 2, r - chamfer / 2, r),
    end(-body / 2 - chamfer / 2, r, r - chamfer / 2),
  ];
}

/**
 * Hex-head bolt drawn from the hole mouth at the origin: thread below (−Y, into the hole), shank up
 * through the clamped parts, then an optional flange and the hex head. Metres.
 */
export function boltShapes(opts: {
  shankRadius: number;
  threadDepth: number;
  clampThickness: number;
  hexCornerRadius: number;
  hexHeight: number;
  flangeRadius?: number;
  flangeHeight?: number;
}): CylinderShape[] {
  const { shankRadius, threadDepth, clampThickness, hexCornerRadius, hexHeight } = opts;
  const flangeHeight = opts.flangeRadius ? (opts.flangeHeight ?? 0.0015) : 0;
  const shapes: CylinderShape[] = [cylinderAlongY(-threadDepth, clampThickness, shankRadius, 0, 0, 16)];
  if (opts.flangeRadius) {
    shapes.push(cylinderAlongY(clampThickness, clampThickness + flangeHeight, opts.flangeRadius, 0, 0, 24));
  }
  const hexBase = clampThickness + flangeHeight;
  shapes.push(cylinderAlongY(hexBase, hexBase + hexHeight, hexCornerRadius, 0, 0, 6));
  return shapes;
}
