import { PALETTE } from '@models/palette';
import type { PartModel, Shape } from '@models/types';

// Hole markers drawn the way the models are: shapes at unit hole radius in x–z (scaled per hole),
// real thickness in y, local +Y out of the hole. A threaded hole shows crests and a ring of ridges;
// a locating hole is a plain collar, so the two read differently without colour.

type MarkerModel = Pick<PartModel, 'key' | 'color' | 'shapes'>;

/** The dark mouth of the hole: the part of the marker the pointer lands on at its centre. */
const mouth: Shape = {
  type: 'cylinder', radiusTop: 1, radiusBottom: 1, height: 0.0006, segments: 24, position: [0, 0.0003, 0],
  color: PALETTE.blackPlastic,
};

export const LOCATING_MARKER: MarkerModel = {
  key: 'marker:locating-hole',
  color: PALETTE.markPaint,
  shapes: [mouth, { type: 'ring', innerRadius: 1, outerRadius: 1.5, height: 0.0012, segments: 32, position: [0, 0.0006, 0] }],
};

const RIDGES = 12;

export const THREADED_MARKER: MarkerModel = {
  key: 'marker:threaded-hole',
  color: PALETTE.markPaint,
  shapes: [
    mouth,
    // Two thread crests seen down the hole.
    { type: 'ring', innerRadius: 0.55, outerRadius: 0.65, height: 0.0009, segments: 24, position: [0, 0.0005, 0] },
    { type: 'ring', innerRadius: 0.8, outerRadius: 0.9, height: 0.0009, segments: 24, position: [0, 0.0005, 0] },
    // A dashed ring of short ridges round the mouth.
    ...Array.from({ length: RIDGES }, (_, i): Shape => {
      const angle = (2 * Math.PI * i) / RIDGES;
      return {
        type: 'box', size: [0.45, 0.0014, 0.22], position: [1.35 * Math.cos(angle), 0.0007, 1.35 * Math.sin(angle)],
        rotation: [0, -angle, 0],
      };
    }),
  ],
};

/** Marker radius for a hole: a little wider than the hole so a finger or pointer finds it. */
export function markerRadius(sizeMm: number): number {
  return Math.max(0.004, (sizeMm / 2000) * 1.6);
}
