import { PALETTE } from './palette';
import { SEAL_Y } from './sump-cover';
import type { PartModel } from './types';
import { CRANK_JOURNAL_RADIUS, SEAL_BORE_RADIUS } from './wren-160-layout';

// Lip seal in the sump cover's bore: rubber ring with its garter spring showing.
export const oilSeal: PartModel = {
  key: 'oil-seal',
  name: 'Oil seal',
  kind: 'seal',
  color: PALETTE.sealRubber,
  placement: 'assembled',
  shapes: [
    {
      type: 'ring',
      innerRadius: CRANK_JOURNAL_RADIUS,
      outerRadius: SEAL_BORE_RADIUS,
      height: 0.006,
      segments: 40,
      position: [0, SEAL_Y, 0],
    },
    {
      type: 'torus',
      radius: CRANK_JOURNAL_RADIUS + 0.0015,
      tube: 0.0008,
      radialSegments: 8,
      tubularSegments: 40,
      position: [0, SEAL_Y + 0.003, 0],
      // Lay the torus flat, round the vertical shaft.
      rotation: [Math.PI / 2, 0, 0],
      color: PALETTE.steel,
    },
  ],
  anchors: [],
  assemblyAxis: [0, -1, 0],
  explodeDistance: 0.17,
};
