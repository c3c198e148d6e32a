import { PALETTE } from './palette';
import { pinShapes } from './shape-helpers';
import type { PartModel } from './types';

// The decoy in the sump kit: longer and thicker than the 8 mm pin, it fits no hole on this joint.
export const DOWEL_PIN_10_SIZE = { diameterMm: 10, lengthMm: 20 };

export const dowelPin10: PartModel = {
  key: 'dowel-pin-10',
  name: '10 mm dowel pin',
  kind: 'dowel-pin',
  color: PALETTE.steel,
  placement: 'local',
  shapes: pinShapes(DOWEL_PIN_10_SIZE.diameterMm, DOWEL_PIN_10_SIZE.lengthMm),
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0.03,
  pin: DOWEL_PIN_10_SIZE,
};
