import { PALETTE } from './palette';
import { cylinderAlongX, cylinderAlongY } from './shape-helpers';
import type { ModelAnchor, PartModel, Shape } from './types';
import {
  BEARING_BOSS_TOP_Y, BORE_RADIUS, BORE_Y, CRANKCASE_TOP_Y, DECK_OUTLINE, DECK_PLATE_ROTATION, DECK_X,
  DOWEL_8_RADIUS, HEAD_BOLT_UV, SLEEVE_OUTER_RADIUS, SLEEVE_UV, SUMP_BOLT_COUNT, SUMP_DOWEL_XZ,
  SUMP_FACE_OUTLINE, SUMP_FACE_Y, SUMP_OPENING_RADIUS, SUMP_PLATE_ROTATION, deckPoint, sumpBoltXZ,
} from './wren-160-layout';

// The block everything else is built on: open at the bottom for the sump, cylinder barrel toward +X.

const FLANGE_THICKNESS = 0.012;
const WALL = 0.008;
const HALF_X = 0.095;
const HALF_Z = 0.09;
const DECK_THICKNESS = 0.012;
const BARREL_START_X = 0.09;
const SUMP_TAP_RADIUS = 0.0025;
const HEAD_TAP_RADIUS = 0.0034;

const sumpBoltNumbers = Array.from({ length: SUMP_BOLT_COUNT }, (_, i) => i + 1);

/** Threaded holes on the lower face, numbered clockwise seen from below. */
const sumpBolts = sumpBoltNumbers.map((n): ModelAnchor => {
  const [x, z] = sumpBoltXZ(n);
  return { key: `sump-bolt-${n}`, kind: 'threaded-hole', position: [x, SUMP_FACE_Y, z], sizeMm: 6, axis: [0, 1, 0] };
});

const dowelHole = (key: string, [x, z]: [number, number]): ModelAnchor => ({
  key, kind: 'locating-hole', position: [x, SUMP_FACE_Y, z], sizeMm: 8, axis: [0, 1, 0],
});

/** Threaded holes in the cylinder deck: four round the bore, the fifth off to the side. */
const headBolts = HEAD_BOLT_UV.map((uv, i): ModelAnchor => ({
  key: `head-bolt-${i + 1}`, kind: 'threaded-hole', position: deckPoint(uv), sizeMm: 8, axis: [-1, 0, 0],
}));

const sleeveHole = (key: string, uv: [number, number]): ModelAnchor => ({
  key, kind: 'locating-hole', position: deckPoint(uv), sizeMm: 10, axis: [-1, 0, 0],
});

/** Upper main bearing, where the crankshaft leaves the top of the block. */
const crankBearing: ModelAnchor = {
  key: 'crank-bearing', kind: 'bearing', position: [0, CRANKCASE_TOP_Y, 0], sizeMm: 25, axis: [0, -1, 0],
};

export const crankcaseAnchors = {
  sumpBolts,
  dowelHoleA: dowelHole('dowel-hole-a', SUMP_DOWEL_XZ.a),
  dowelHoleB: dowelHole('dowel-hole-b', SUMP_DOWEL_XZ.b),
  crankBearing,
  headBolts,
  sleeveHoleA: sleeveHole('sleeve-hole-a', SLEEVE_UV.a),
  sleeveHoleB: sleeveHole('sleeve-hole-b', SLEEVE_UV.b),
};

const wallHeight = CRANKCASE_TOP_Y - WALL - FLANGE_THICKNESS;
const wallY = FLANGE_THICKNESS + wallHeight / 2;

const shapes: Shape[] = [
  // Lower flange: the sump face, with the big opening, tapped bolt holes and dowel holes.
  {
    type: 'extrude',
    outline: SUMP_FACE_OUTLINE,
    holes: [
      { center: [0, 0], radius: SUMP_OPENING_RADIUS },
      ...sumpBoltNumbers.map((n) => ({ center: sumpBoltXZ(n), radius: SUMP_TAP_RADIUS })),
      { center: SUMP_DOWEL_XZ.a, radius: DOWEL_8_RADIUS },
      { center: SUMP_DOWEL_XZ.b, radius: DOWEL_8_RADIUS },
    ],
    depth: FLANGE_THICKNESS,
    position: [0, SUMP_FACE_Y + FLANGE_THICKNESS, 0],
    rotation: SUMP_PLATE_ROTATION,
  },
  // Four walls and a top plate: a hollow box, so the gears show from below.
  { type: 'box', size: [WALL, wallHeight, 2 * HALF_Z], position: [HALF_X - WALL / 2, wallY, 0] },
  { type: 'box', size: [WALL, wallHeight, 2 * HALF_Z], position: [-HALF_X + WALL / 2, wallY, 0] },
  { type: 'box', size: [2 * (HALF_X - WALL), wallHeight, WALL], position: [0, wallY, HALF_Z - WALL / 2] },
  { type: 'box', size: [2 * (HALF_X - WALL), wallHeight, WALL], position: [0, wallY, -HALF_Z + WALL / 2] },
  { type: 'box', size: [2 * HALF_X, WALL, 2 * HALF_Z], position: [0, CRANKCASE_TOP_Y - WALL / 2, 0] },
  // Upper main bearing boss under the flywheel.
  cylinderAlongY(CRANKCASE_TOP_Y, BEARING_BOSS_TOP_Y, 0.03, 0, 0, 32),
  // Bolt bosses above each sump bolt hole.
  ...sumpBoltNumbers.map((n) => cylinderAlongY(FLANGE_THICKNESS, FLANGE_THICKNESS + 0.018, 0.008, ...sumpBoltXZ(n), 16)),
  // Cylinder barrel with cooling fins, ending at the deck.
  cylinderAlongX(BARREL_START_X, DECK_X - DECK_THICKNESS, BORE_RADIUS + 0.011, BORE_Y, 0, 32),
  ...[0.105, 0.12, 0.135, 0.15, 0.165].map((x): Shape => ({
    type: 'box', size: [0.003, 0.13, 0.14], position: [x, BORE_Y, -0.014],
  })),
  // Deck face: bore, tapped head bolt holes, locating sleeve holes.
  {
    type: 'extrude',
    outline: DECK_OUTLINE,
    holes: [
      { center: [0, 0], radius: BORE_RADIUS },
      ...HEAD_BOLT_UV.map((center) => ({ center, radius: HEAD_TAP_RADIUS })),
      { center: SLEEVE_UV.a, radius: SLEEVE_OUTER_RADIUS },
      { center: SLEEVE_UV.b, radius: SLEEVE_OUTER_RADIUS },
    ],
    depth: DECK_THICKNESS,
    position: [DECK_X, BORE_Y, 0],
    rotation: DECK_PLATE_ROTATION,
  },
];

export const crankcase: PartModel = {
  key: 'crankcase',
  name: 'Crankcase',
  kind: 'block',
  color: PALETTE.castAluminium,
  placement: 'assembled',
  shapes,
  anchors: [
    ...crankcaseAnchors.sumpBolts,
    crankcaseAnchors.dowelHoleA,
    crankcaseAnchors.dowelHoleB,
    crankcaseAnchors.crankBearing,
    ...crankcaseAnchors.headBolts,
    crankcaseAnchors.sleeveHoleA,
    crankcaseAnchors.sleeveHoleB,
  ],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0,
};
