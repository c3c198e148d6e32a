import { PALETTE } from './palette';
import type { PartModel } from './types';
import { TAPER_TOP_Y, THREAD_RADIUS, WASHER_THICKNESS } from './wren-160-layout';

// Flat washer between the flywheel hub and the nut.
export const flywheelWasher: PartModel = {
  key: 'flywheel-washer',
  name: 'Flywheel washer',
  kind: 'washer',
  color: PALETTE.steel,
  placement: 'assembled',
  shapes: [
    {
      type: 'ring',
      innerRadius: THREAD_RADIUS + 0.0005,
      outerRadius: 0.018,
      height: WASHER_THICKNESS,
      segments: 32,
      position: [0, TAPER_TOP_Y + WASHER_THICKNESS / 2, 0],
    },
  ],
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0.14,
};
