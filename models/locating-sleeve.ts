import { PALETTE } from './palette';
import type { PartModel } from './types';
import { SLEEVE_OUTER_RADIUS } from './wren-160-layout';

// Hollow locating sleeve for the head joint; half in the deck, half in the head (origin at the hole mouth).
export const LOCATING_SLEEVE_SIZE = { diameterMm: 10, lengthMm: 12 };

export const locatingSleeve: PartModel = {
  key: 'locating-sleeve',
  name: 'Locating sleeve',
  kind: 'sleeve',
  color: PALETTE.steel,
  placement: 'local',
  shapes: [
    {
      type: 'ring',
      innerRadius: SLEEVE_OUTER_RADIUS - 0.001,
      outerRadius: SLEEVE_OUTER_RADIUS,
      height: LOCATING_SLEEVE_SIZE.lengthMm / 1000,
      segments: 24,
      position: [0, 0, 0],
    },
  ],
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0.025,
  pin: LOCATING_SLEEVE_SIZE,
};
