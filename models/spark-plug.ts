import { cylinderHeadAnchors } from './cylinder-head';
import { PALETTE } from './palette';
import { cylinderAlongX } from './shape-helpers';
import type { PartModel } from './types';

// Spark plug in the head's plug hole, lying along X: thread, 16 mm hex, white insulator, terminal.
const [seatX, y, z] = cylinderHeadAnchors.plugHole.position;
const REACH = 0.0127;
const HEX_LENGTH = 0.01;

export const sparkPlug: PartModel = {
  key: 'spark-plug',
  name: 'Spark plug',
  kind: 'spark-plug',
  color: PALETTE.steel,
  placement: 'assembled',
  shapes: [
    cylinderAlongX(seatX - REACH, seatX, 0.007, y, z, 16),
    cylinderAlongX(seatX, seatX + HEX_LENGTH, 0.008 / Math.cos(Math.PI / 6), y, z, 6, PALETTE.darkSteel),
    cylinderAlongX(seatX + HEX_LENGTH, seatX + HEX_LENGTH + 0.027, 0.0055, y, z, 24, PALETTE.porcelain),
    cylinderAlongX(seatX + HEX_LENGTH + 0.027, seatX + HEX_LENGTH + 0.035, 0.003, y, z, 12),
  ],
  anchors: [],
  assemblyAxis: [1, 0, 0],
  explodeDistance: 0.12,
};
