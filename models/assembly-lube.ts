import { PALETTE } from './palette';
import { cylinderAlongY } from './shape-helpers';
import type { PartModel } from './types';

// Stand-in for a tube of assembly lube: body, nozzle, crimped end. Sits on the bench.
export const assemblyLube: PartModel = {
  key: 'assembly-lube',
  name: 'Assembly lube',
  kind: 'consumable',
  color: PALETTE.lubeTube,
  placement: 'local',
  shapes: [
    cylinderAlongY(0, 0.07, 0.012),
    {
      type: 'cylinder', radiusTop: 0.002, radiusBottom: 0.006, height: 0.015, segments: 16,
      position: [0, 0.0775, 0], color: PALETTE.blackPlastic,
    },
    { type: 'box', size: [0.026, 0.006, 0.004], position: [0, -0.003, 0] },
  ],
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0,
};
