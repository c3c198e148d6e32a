import { PALETTE } from './palette';
import { cylinderAlongY, radialBoxes } from './shape-helpers';
import type { ModelAnchor, PartModel, Shape } from './types';
import {
  BEARING_BOSS_TOP_Y, CAM_AXIS_XZ, CRANK_GEAR_RADIUS, CRANK_JOURNAL_RADIUS, CRANK_PTO_END_Y, GEAR_THICKNESS,
  GEAR_Y, KEYWAY_Y, TAPER_TOP_RADIUS, TAPER_TOP_Y, THREAD_RADIUS, THREAD_TOP_Y, taperRadiusAt,
} from './wren-160-layout';

// Vertical crankshaft: output end below the sump, flywheel taper and thread on top.

const LOWER_WEB_Y = 0.056;
const UPPER_WEB_Y = 0.114;
const WEB_THICKNESS = 0.012;
const CRANKPIN_OFFSET = 0.022;
const camDistance = Math.hypot(CAM_AXIS_XZ[0], CAM_AXIS_XZ[1]);
const toCam = [CAM_AXIS_XZ[0] / camDistance, CAM_AXIS_XZ[1] / camDistance] as const;

const flywheelKeyway: ModelAnchor = {
  key: 'flywheel-keyway', kind: 'keyway', position: [taperRadiusAt(KEYWAY_Y), KEYWAY_Y, 0], sizeMm: 5, axis: [-1, 0, 0],
};
/** Threaded top end the flywheel nut runs onto. */
const threadEnd: ModelAnchor = {
  key: 'crank-thread-end', kind: 'shaft-end', position: [0, THREAD_TOP_Y, 0], sizeMm: 16, axis: [0, -1, 0],
};
/** Output end below the sump, through the oil seal. */
const outputEnd: ModelAnchor = {
  key: 'crank-pto-end', kind: 'shaft-end', position: [0, CRANK_PTO_END_Y, 0], sizeMm: 25, axis: [0, 1, 0],
};

export const crankshaftAnchors = { flywheelKeyway, threadEnd, outputEnd };

const shapes: Shape[] = [
  // Output end and lower journal.
  cylinderAlongY(CRANK_PTO_END_Y, LOWER_WEB_Y - WEB_THICKNESS / 2, CRANK_JOURNAL_RADIUS),
  // Crank gear with teeth and its timing mark facing the cam gear.
  cylinderAlongY(GEAR_Y - GEAR_THICKNESS / 2, GEAR_Y + GEAR_THICKNESS / 2, CRANK_GEAR_RADIUS - 0.0015, 0, 0, 32),
  ...radialBoxes(16, [0, 0], CRANK_GEAR_RADIUS, GEAR_Y, [0.003, GEAR_THICKNESS, 0.0025]),
  {
    type: 'box',
    size: [0.006, 0.0006, 0.0015],
    position: [toCam[0] * 0.01, GEAR_Y + GEAR_THICKNESS / 2 + 0.0003, toCam[1] * 0.01],
    rotation: [0, -Math.atan2(toCam[1], toCam[0]), 0],
    color: PALETTE.markPaint,
  },
  // Webs with counterweights toward −X, and the crankpin toward +X.
  { type: 'box', size: [0.07, WEB_THICKNESS, 0.05], position: [-0.005, LOWER_WEB_Y, 0] },
  { type: 'box', size: [0.07, WEB_THICKNESS, 0.05], position: [-0.005, UPPER_WEB_Y, 0] },
  cylinderAlongY(LOWER_WEB_Y + WEB_THICKNESS / 2, UPPER_WEB_Y - WEB_THICKNESS / 2, 0.012, CRANKPIN_OFFSET, 0),
  // Upper journal through the bearing boss, then the flywheel taper and the thread.
  cylinderAlongY(UPPER_WEB_Y + WEB_THICKNESS / 2, BEARING_BOSS_TOP_Y, CRANK_JOURNAL_RADIUS),
  {
    type: 'cylinder',
    radiusTop: TAPER_TOP_RADIUS,
    radiusBottom: CRANK_JOURNAL_RADIUS,
    height: TAPER_TOP_Y - BEARING_BOSS_TOP_Y,
    segments: 24,
    position: [0, (TAPER_TOP_Y + BEARING_BOSS_TOP_Y) / 2, 0],
  },
  cylinderAlongY(TAPER_TOP_Y, THREAD_TOP_Y, THREAD_RADIUS, 0, 0, 16, PALETTE.darkSteel),
];

export const crankshaft: PartModel = {
  key: 'crankshaft',
  name: 'Crankshaft',
  kind: 'shaft',
  color: PALETTE.steel,
  placement: 'assembled',
  shapes,
  anchors: [flywheelKeyway, threadEnd, outputEnd],
  assemblyAxis: [0, 1, 0],
  explodeDistance: 0,
};
