import { PALETTE } from './palette';
import { radialBoxes } from './shape-helpers';
import type { PartModel, Shape } from './types';
import { FLYWHEEL_HUB_BOTTOM_Y, FLYWHEEL_RADIUS, TAPER_TOP_RADIUS, TAPER_TOP_Y } from './wren-160-layout';

// Flywheel: hub on the crank taper, a disc, a ring of cooling fins and the magnet rim.

const DISC_THICKNESS = 0.012;
const FIN_HEIGHT = 0.014;
const discBottomY = FLYWHEEL_HUB_BOTTOM_Y + 0.003;
const finY = discBottomY + DISC_THICKNESS + FIN_HEIGHT / 2;

const shapes: Shape[] = [
  {
    type: 'ring',
    innerRadius: TAPER_TOP_RADIUS,
    outerRadius: 0.025,
    height: TAPER_TOP_Y - FLYWHEEL_HUB_BOTTOM_Y,
    segments: 32,
    position: [0, (TAPER_TOP_Y + FLYWHEEL_HUB_BOTTOM_Y) / 2, 0],
  },
  {
    type: 'cylinder',
    radiusTop: FLYWHEEL_RADIUS,
    radiusBottom: FLYWHEEL_RADIUS,
    height: DISC_THICKNESS,
    segments: 64,
    position: [0, discBottomY + DISC_THICKNESS / 2, 0],
  },
  ...radialBoxes(16, [0, 0], 0.07, finY, [0.05, FIN_HEIGHT, 0.003]),
  {
    type: 'ring',
    innerRadius: FLYWHEEL_RADIUS - 0.018,
    outerRadius: FLYWHEEL_RADIUS,
    height: FIN_HEIGHT,
    segments: 64,
    position: [0, finY, 0],
    color: PALETTE.darkSteel,
  },
];

export const flywheel: PartModel = {
  key: 'flywheel',
  name: 'Flywheel',
  kind: 'flywheel',
  color: PALETTE.castAluminium,
  placement: 'assembled',
  shapes,
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0.1,
};
