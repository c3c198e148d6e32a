import { PALETTE } from './palette';
import { cylinderAlongY } from './shape-helpers';
import type { PartModel, Shape } from './types';

// Stand-in for a feeler gauge: thin blades fanned out from a pivot. Sits on the bench.
const BLADE_ANGLES = [0, 0.18, 0.36, 0.54, 0.72];

export const feelerGauge: PartModel = {
  key: 'feeler-gauge',
  name: 'Feeler gauge',
  kind: 'tool',
  color: PALETTE.steel,
  placement: 'local',
  shapes: [
    ...BLADE_ANGLES.map((angle, i): Shape => ({
      type: 'box',
      size: [0.075, 0.0004, 0.012],
      // Each blade turns about the pivot at the origin; its centre sits half a blade out.
      position: [0.0375 * Math.cos(angle), i * 0.0005, -0.0375 * Math.sin(angle)],
      rotation: [0, angle, 0],
    })),
    cylinderAlongY(-0.001, 0.004, 0.005, 0, 0, 16, PALETTE.darkSteel),
  ],
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0,
};
