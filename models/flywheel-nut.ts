import { PALETTE } from './palette';
import type { PartModel } from './types';
import { NUT_HEIGHT, TAPER_TOP_Y, WASHER_THICKNESS } from './wren-160-layout';

// Hex nut on the crankshaft thread, 24 mm across flats.
const bottomY = TAPER_TOP_Y + WASHER_THICKNESS;

export const flywheelNut: PartModel = {
  key: 'flywheel-nut',
  name: 'Flywheel nut',
  kind: 'nut',
  color: PALETTE.darkSteel,
  placement: 'assembled',
  shapes: [
    {
      type: 'cylinder',
      radiusTop: 0.012 / Math.cos(Math.PI / 6),
      radiusBottom: 0.012 / Math.cos(Math.PI / 6),
      height: NUT_HEIGHT,
      segments: 6,
      position: [0, bottomY + NUT_HEIGHT / 2, 0],
    },
  ],
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0.17,
};
