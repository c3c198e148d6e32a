import { PALETTE } from './palette';
import { boltShapes } from './shape-helpers';
import type { PartModel } from './types';
import { DECK_X, HEAD_BODY_OUTER_X } from './wren-160-layout';

// M8 head bolt: through the gasket and the head into the deck; drawn once per head bolt hole.
export const headBolt: PartModel = {
  key: 'head-bolt',
  name: 'Head bolt M8',
  kind: 'bolt',
  color: PALETTE.darkSteel,
  placement: 'local',
  shapes: boltShapes({
    shankRadius: 0.004,
    threadDepth: 0.016,
    clampThickness: HEAD_BODY_OUTER_X - DECK_X,
    flangeRadius: 0.0085,
    flangeHeight: 0.001,
    // 13 mm across flats.
    hexCornerRadius: 0.0065 / Math.cos(Math.PI / 6),
    hexHeight: 0.0055,
  }),
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0.15,
};
