import { crankshaftAnchors } from './crankshaft';
import { PALETTE } from './palette';
import type { PartModel } from './types';

// Soft key sitting half in the crankshaft keyway, half in the flywheel hub.
const [x, y, z] = crankshaftAnchors.flywheelKeyway.position;

export const flywheelKey: PartModel = {
  key: 'flywheel-key',
  name: 'Flywheel key',
  kind: 'key',
  color: PALETTE.gearBrass,
  placement: 'assembled',
  shapes: [{ type: 'box', size: [0.0035, 0.016, 0.005], position: [x, y, z] }],
  anchors: [],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0.06,
};
