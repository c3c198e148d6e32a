import { PALETTE } from './palette';
import type { PartModel } from './types';

// Stand-in for a strap wrench: a flat strap loop and a handle. Sits on the bench.
export const strapWrench: PartModel = {
  key: 'strap-wrench',
  name: 'Strap wrench',
  kind: 'tool',
  color: PALETTE.strapNylon,
  placement: 'local',
  shapes: [
    // Torus laid flat (its default plane is XY).
    {
      type: 'torus', radius: 0.06, tube: 0.004, radialSegments: 8, tubularSegments: 48,
      position: [0, 0, 0], rotation: [Math.PI / 2, 0, 0],
    },
    { type: 'box', size: [0.03, 0.014, 0.02], position: [0.07, 0, 0], color: PALETTE.darkSteel },
    { type: 'box', size: [0.18, 0.016, 0.022], position: [0.175, 0, 0], color: PALETTE.blackPlastic },
  ],
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0,
};
