import { PALETTE } from './palette';
import type { ModelAnchor, PartModel, Shape } from './types';
import {
  BORE_Y, DECK_HALF_V, DECK_OUTLINE, DECK_PLATE_ROTATION, DECK_U, DECK_X, HEAD_BODY_OUTER_X, HEAD_BOLT_CLEARANCE_RADIUS,
  HEAD_BOLT_UV, HEAD_DECK_THICKNESS, HEAD_GASKET_THICKNESS, PLUG_UV, SLEEVE_OUTER_RADIUS, SLEEVE_UV, deckPoint,
} from './wren-160-layout';

// Cylinder head: a deck plate with the bolt and sleeve holes, a solid body, and cooling fins.

const deckOuterX = DECK_X + HEAD_GASKET_THICKNESS + HEAD_DECK_THICKNESS;
const FIN_DEPTH = 0.025;
// The body covers the deck outline (u is engine z).
const bodyZ = DECK_U;
const bodyHalfY = DECK_HALF_V;
// Fins sit between the bolt heads and clear of the spark plug.
const FIN_V = [-0.058, -0.025, 0.058];

const plugHole: ModelAnchor = {
  key: 'plug-hole', kind: 'threaded-hole', position: deckPoint(PLUG_UV, HEAD_BODY_OUTER_X), sizeMm: 14, axis: [-1, 0, 0],
};

export const cylinderHeadAnchors = { plugHole };

const shapes: Shape[] = [
  {
    type: 'extrude',
    outline: DECK_OUTLINE,
    holes: [
      ...HEAD_BOLT_UV.map((center) => ({ center, radius: HEAD_BOLT_CLEARANCE_RADIUS })),
      { center: SLEEVE_UV.a, radius: SLEEVE_OUTER_RADIUS + 0.0002 },
      { center: SLEEVE_UV.b, radius: SLEEVE_OUTER_RADIUS + 0.0002 },
    ],
    depth: HEAD_DECK_THICKNESS,
    position: [deckOuterX, BORE_Y, 0],
    rotation: DECK_PLATE_ROTATION,
  },
  {
    type: 'box',
    size: [HEAD_BODY_OUTER_X - deckOuterX, 2 * bodyHalfY, bodyZ.max - bodyZ.min],
    position: [(HEAD_BODY_OUTER_X + deckOuterX) / 2, BORE_Y, (bodyZ.max + bodyZ.min) / 2],
  },
  ...FIN_V.map((v): Shape => ({
    type: 'box',
    size: [FIN_DEPTH, 0.003, bodyZ.max - bodyZ.min],
    position: [HEAD_BODY_OUTER_X + FIN_DEPTH / 2, BORE_Y + v, (bodyZ.max + bodyZ.min) / 2],
  })),
];

export const cylinderHead: PartModel = {
  key: 'cylinder-head',
  name: 'Cylinder head',
  kind: 'head',
  color: PALETTE.castAluminiumDark,
  placement: 'assembled',
  shapes,
  anchors: [plugHole],
  assemblyAxis: [1, 0, 0],
  explodeDistance: 0.1,
};
