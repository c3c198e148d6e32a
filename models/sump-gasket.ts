import { PALETTE } from './palette';
import type { PartModel } from './types';
import {
  DOWEL_CLEARANCE_RADIUS, SUMP_BOLT_CLEARANCE_RADIUS, SUMP_BOLT_COUNT, SUMP_DOWEL_XZ, SUMP_FACE_OUTLINE,
  SUMP_FACE_Y, SUMP_GASKET_THICKNESS, SUMP_OPENING_RADIUS, SUMP_PLATE_ROTATION, sumpBoltXZ,
} from './wren-160-layout';

// Thin fibre gasket: the crankcase face outline with the same bolt and dowel holes and a wide opening.
export const sumpGasket: PartModel = {
  key: 'sump-gasket',
  name: 'Sump gasket',
  kind: 'gasket',
  color: PALETTE.gasketFibre,
  placement: 'assembled',
  shapes: [
    {
      type: 'extrude',
      outline: SUMP_FACE_OUTLINE,
      holes: [
        { center: [0, 0], radius: SUMP_OPENING_RADIUS },
        ...Array.from({ length: SUMP_BOLT_COUNT }, (_, i) => ({
          center: sumpBoltXZ(i + 1),
          radius: SUMP_BOLT_CLEARANCE_RADIUS,
        })),
        { center: SUMP_DOWEL_XZ.a, radius: DOWEL_CLEARANCE_RADIUS },
        { center: SUMP_DOWEL_XZ.b, radius: DOWEL_CLEARANCE_RADIUS },
      ],
      depth: SUMP_GASKET_THICKNESS,
      position: [0, SUMP_FACE_Y, 0],
      rotation: SUMP_PLATE_ROTATION,
    },
  ],
  anchors: [],
  assemblyAxis: [0, -1, 0],
  explodeDistance: 0.06,
};
