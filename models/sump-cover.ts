import { PALETTE } from './palette';
import type { ModelAnchor, PartModel, Shape } from './types';
import {
  DOWEL_CLEARANCE_RADIUS, SEAL_BORE_RADIUS, SUMP_BOLT_CLEARANCE_RADIUS, SUMP_BOLT_COUNT, SUMP_COVER_TOP_Y,
  SUMP_DOWEL_XZ, SUMP_FACE_OUTLINE, SUMP_FLANGE_THICKNESS, SUMP_PLATE_ROTATION, sumpBoltXZ,
} from './wren-160-layout';

// The sump: a flange matching the crankcase face (bolt and dowel holes at the same places),
// an oil pan below it, and the seal bore the crankshaft's output end passes through.

const PAN_DEPTH = 0.03;
const PAN_RADIUS = 0.083;
const panTopY = SUMP_COVER_TOP_Y - SUMP_FLANGE_THICKNESS;
export const SEAL_Y = panTopY - PAN_DEPTH + 0.004;

const dowelSeat = (key: string, [x, z]: [number, number]): ModelAnchor => ({
  key, kind: 'locating-hole', position: [x, SUMP_COVER_TOP_Y, z], sizeMm: 8, axis: [0, -1, 0],
});

/** Lower main bearing the crankshaft journal turns in. */
const bearing: ModelAnchor = {
  key: 'sump-bearing', kind: 'bearing', position: [0, panTopY, 0], sizeMm: 25, axis: [0, 1, 0],
};
/** Bore the oil seal is pressed into from below. */
const sealBore: ModelAnchor = {
  key: 'sump-seal-bore', kind: 'bearing', position: [0, SEAL_Y, 0], sizeMm: 40, axis: [0, 1, 0],
};

export const sumpCoverAnchors = {
  dowelSeatA: dowelSeat('sump-dowel-seat-a', SUMP_DOWEL_XZ.a),
  dowelSeatB: dowelSeat('sump-dowel-seat-b', SUMP_DOWEL_XZ.b),
  bearing,
  sealBore,
};

const shapes: Shape[] = [
  {
    type: 'extrude',
    outline: SUMP_FACE_OUTLINE,
    holes: [
      { center: [0, 0], radius: SEAL_BORE_RADIUS },
      ...Array.from({ length: SUMP_BOLT_COUNT }, (_, i) => ({
        center: sumpBoltXZ(i + 1),
        radius: SUMP_BOLT_CLEARANCE_RADIUS,
      })),
      { center: SUMP_DOWEL_XZ.a, radius: DOWEL_CLEARANCE_RADIUS },
      { center: SUMP_DOWEL_XZ.b, radius: DOWEL_CLEARANCE_RADIUS },
    ],
    depth: SUMP_FLANGE_THICKNESS,
    position: [0, SUMP_COVER_TOP_Y, 0],
    rotation: SUMP_PLATE_ROTATION,
  },
  // Oil pan, kept inside the bolt heads.
  {
    type: 'ring',
    innerRadius: SEAL_BORE_RADIUS,
    outerRadius: PAN_RADIUS,
    height: PAN_DEPTH,
    segments: 48,
    position: [0, panTopY - PAN_DEPTH / 2, 0],
  },
  // Two mounting feet, so the cover reads as a base rather than a plate.
  { type: 'box', size: [0.2, 0.012, 0.03], position: [0, panTopY - PAN_DEPTH - 0.006, 0.055] },
  { type: 'box', size: [0.2, 0.012, 0.03], position: [0, panTopY - PAN_DEPTH - 0.006, -0.055] },
];

export const sumpCover: PartModel = {
  key: 'sump-cover',
  name: 'Sump cover',
  kind: 'cover',
  color: PALETTE.castAluminiumDark,
  placement: 'assembled',
  shapes,
  anchors: [
    sumpCoverAnchors.dowelSeatA,
    sumpCoverAnchors.dowelSeatB,
    sumpCoverAnchors.bearing,
    sumpCoverAnchors.sealBore,
  ],
  assemblyAxis: [0, -1, 0],
  explodeDistance: 0.12,
};
