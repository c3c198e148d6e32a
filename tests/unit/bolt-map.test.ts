import { describe, expect, it } from 'vitest';
import { boltMap } from '~/components/trainer/bolt-map';
import { boltLabel, holeLabel, readableKey } from '~/components/trainer/labels';
import { toPublicProcedure } from '~/lib/procedure/public-view';
import { demoProcedure } from '../support/demo-procedures';

// Where the Pattern list says each bolt is, seen from the bolt heads.

describe('boltMap', () => {
  it('puts up at 12 and right at 3 when looking straight into the screen', () => {
    // Clock positions by definition: 12 up, 3 right, 6 down, 9 left (viewer looks along −Z).
    const spots = boltMap(
      [
        { key: 'up', position: [0, 1, 0] },
        { key: 'right', position: [1, 0, 0] },
        { key: 'down', position: [0, -1, 0] },
        { key: 'left', position: [-1, 0, 0] },
      ],
      [0, 0, -1],
    );
    expect(spots.map((s) => s.hour)).toEqual([12, 3, 6, 9]);
    expect(spots[1]).toMatchObject({ x: 1, y: 0, angle: 90 });
  });

  it('shows the sump bolts clockwise in their own numbering, as the crankcase model numbers them seen from below', () => {
    const view = toPublicProcedure(demoProcedure('wren-160-sump'), 'seed');
    const group = view.fastenerGroups[0]!;
    const byNumber = boltMap(group.bolts, group.axis).sort((a, b) => Number(a.key.slice(5)) - Number(b.key.slice(5)));
    const steps = byNumber.map((s, i) => (byNumber[(i + 1) % byNumber.length]!.angle - s.angle + 360) % 360);
    // Eight bolts evenly round a circle: 45° apart, always turning clockwise.
    for (const step of steps) expect(step).toBeCloseTo(45, 6);
  });
});

describe('labels', () => {
  it('builds readable names from keys', () => {
    expect(readableKey('dowel-hole-a')).toBe('Dowel hole A');
    expect(boltLabel('sump-bolt-3')).toBe('Bolt 3');
    expect(holeLabel({ key: 'dowel-hole-a', kind: 'locating-hole', sizeMm: 8 })).toBe('Dowel hole A · locating · 8\u00a0mm');
    expect(holeLabel({ key: 'sump-bolt-3', kind: 'threaded-hole', sizeMm: 6 })).toBe('Sump bolt 3 · threaded · 6\u00a0mm');
  });
});
