import { PALETTE } from './palette';
import type { PartModel } from './types';
import {
  BORE_RADIUS, BORE_Y, DECK_OUTLINE, DECK_PLATE_ROTATION, DECK_X, HEAD_BOLT_CLEARANCE_RADIUS, HEAD_BOLT_UV,
  HEAD_GASKET_THICKNESS, SLEEVE_OUTER_RADIUS, SLEEVE_UV,
} from './wren-160-layout';

// Thin head gasket: the deck outline with the bore, five bolt holes and the two sleeve holes.
export const headGasket: PartModel = {
  key: 'head-gasket',
  name: 'Head gasket',
  kind: 'gasket',
  color: PALETTE.gasketFibre,
  placement: 'assembled',
  shapes: [
    {
      type: 'extrude',
      outline: DECK_OUTLINE,
      holes: [
        { center: [0, 0], radius: BORE_RADIUS + 0.001 },
        ...HEAD_BOLT_UV.map((center) => ({ center, radius: HEAD_BOLT_CLEARANCE_RADIUS })),
        { center: SLEEVE_UV.a, radius: SLEEVE_OUTER_RADIUS + 0.0002 },
        { center: SLEEVE_UV.b, radius: SLEEVE_OUTER_RADIUS + 0.0002 },
      ],
      depth: HEAD_GASKET_THICKNESS,
      position: [DECK_X + HEAD_GASKET_THICKNESS, BORE_Y, 0],
      rotation: DECK_PLATE_ROTATION,
    },
  ],
  anchors: [],
  assemblyAxis: [1, 0, 0],
  explodeDistance: 0.05,
};
