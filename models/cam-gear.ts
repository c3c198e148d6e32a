import { PALETTE } from './palette';
import { cylinderAlongY, radialBoxes } from './shape-helpers';
import type { PartModel, Shape } from './types';
import { CAM_AXIS_XZ, CAM_GEAR_RADIUS, GEAR_THICKNESS, GEAR_Y } from './wren-160-layout';

// Camshaft gear (2:1 to the crank gear) with its timing mark facing the crankshaft.

const [cx, cz] = CAM_AXIS_XZ;
const distance = Math.hypot(cx, cz);
const toCrank = [-cx / distance, -cz / distance] as const;

const shapes: Shape[] = [
  cylinderAlongY(GEAR_Y - GEAR_THICKNESS / 2, GEAR_Y + GEAR_THICKNESS / 2, CAM_GEAR_RADIUS - 0.0015, cx, cz, 48),
  ...radialBoxes(32, CAM_AXIS_XZ, CAM_GEAR_RADIUS, GEAR_Y, [0.003, GEAR_THICKNESS, 0.0025]),
  {
    type: 'box',
    size: [0.008, 0.0006, 0.002],
    position: [cx + toCrank[0] * 0.022, GEAR_Y + GEAR_THICKNESS / 2 + 0.0003, cz + toCrank[1] * 0.022],
    rotation: [0, -Math.atan2(toCrank[1], toCrank[0]), 0],
    color: PALETTE.markPaint,
  },
  // Short camshaft with its two lobes, kept below the crank webs so nothing clashes as the crank turns.
  cylinderAlongY(-0.006, 0.048, 0.007, cx, cz, 16, PALETTE.steel),
  cylinderAlongY(0.029, 0.037, 0.011, cx + 0.004, cz, 24, PALETTE.steel),
  cylinderAlongY(0.039, 0.047, 0.011, cx, cz + 0.004, 24, PALETTE.steel),
];

export const camGear: PartModel = {
  key: 'cam-gear',
  name: 'Cam gear',
  kind: 'gear',
  color: PALETTE.gearBrass,
  placement: 'assembled',
  shapes,
  anchors: [],
  assemblyAxis: [0, -1, 0],
  explodeDistance: 0,
};
