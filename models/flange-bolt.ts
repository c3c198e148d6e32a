import { PALETTE } from './palette';
import { boltShapes } from './shape-helpers';
import type { PartModel } from './types';
import { SUMP_FLANGE_THICKNESS, SUMP_GASKET_THICKNESS } from './wren-160-layout';

// M6 flange bolt for the sump; one model, drawn once per sump bolt hole.
export const flangeBolt: PartModel = {
  key: 'flange-bolt',
  name: 'Flange bolt M6',
  kind: 'bolt',
  color: PALETTE.darkSteel,
  placement: 'local',
  shapes: boltShapes({
    shankRadius: 0.003,
    threadDepth: 0.012,
    clampThickness: SUMP_GASKET_THICKNESS + SUMP_FLANGE_THICKNESS,
    flangeRadius: 0.0075,
    // 10 mm across flats: corner radius = 5 mm / cos 30°.
    hexCornerRadius: 0.005 / Math.cos(Math.PI / 6),
    hexHeight: 0.0045,
  }),
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0.18,
};
