import { PALETTE } from './palette';
import { pinShapes } from './shape-helpers';
import type { PartModel } from './types';

// The right pin for the sump's dowel holes; half its length sits in the crankcase (origin at the hole mouth).
export const DOWEL_PIN_8_SIZE = { diameterMm: 8, lengthMm: 14 };

export const dowelPin8: PartModel = {
  key: 'dowel-pin-8',
  name: '8 mm dowel pin',
  kind: 'dowel-pin',
  color: PALETTE.steel,
  placement: 'local',
  shapes: pinShapes(DOWEL_PIN_8_SIZE.diameterMm, DOWEL_PIN_8_SIZE.lengthMm),
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0.03,
  pin: DOWEL_PIN_8_SIZE,
};
