import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ANCHOR_KINDS, PART_KINDS } from '~/lib/procedure/schema';
import { crankcase, crankcaseAnchors } from '@models/crankcase';
import { camGear } from '@models/cam-gear';
import { crankshaft } from '@models/crankshaft';
import { cylinderHead } from '@models/cylinder-head';
import { DOWEL_PIN_10_SIZE, dowelPin10 } from '@models/dowel-pin-10';
import { DOWEL_PIN_8_SIZE, dowelPin8 } from '@models/dowel-pin-8';
import { flangeBolt } from '@models/flange-bolt';
import { headBolt } from '@models/head-bolt';
import { headGasket } from '@models/head-gasket';
import { MODELS, anchorPositions, findAnchor, getModel } from '@models/index';
import { LOCATING_SLEEVE_SIZE, locatingSleeve } from '@models/locating-sleeve';
import { PALETTE } from '@models/palette';
import { sumpCover } from '@models/sump-cover';
import { sumpGasket } from '@models/sump-gasket';
import { outlinePointToModel, rotateXYZ, shapePointToModel } from '@models/transform';
import type { CylinderShape, ExtrudeShape, PartModel, Shape, Vec2, Vec3 } from '@models/types';

// Geometry checks on the Wren 160 models: mating holes line up, outlines are drawable, anchors are unique.

const MM = 0.001;
const models = Object.values(MODELS);
const sub = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const dot = (a: Vec3, b: Vec3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const cross = (a: Vec3, b: Vec3): Vec3 => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
const length = (a: Vec3) => Math.hypot(a[0], a[1], a[2]);
/** Distance between two points seen along an axis (the offset left after removing the axial part). */
const offAxis = (a: Vec3, b: Vec3, axis: Vec3) => {
  const d = sub(a, b);
  const along = dot(d, axis);
  return length([d[0] - along * axis[0], d[1] - along * axis[1], d[2] - along * axis[2]]);
};

const extrudes = (m: PartModel) => m.shapes.filter((s): s is ExtrudeShape => s.type === 'extrude');
const cylinders = (m: PartModel) => m.shapes.filter((s): s is CylinderShape => s.type === 'cylinder');

/** Engine-frame centres of an extrude's holes on its start face, with their radii. */
function holesInEngine(shape: ExtrudeShape) {
  return (shape.holes ?? []).map((h) => ({ at: outlinePointToModel(shape, h.center), radius: h.radius }));
}

/** The one extrude hole lying on the given anchor's axis (within 0.5 mm); fails if none or several. */
function holeOnAnchor(shape: ExtrudeShape, anchor: { position: Vec3; axis: Vec3 }) {
  const found = holesInEngine(shape).filter((h) => offAxis(h.at, anchor.position, anchor.axis) < 0.5 * MM);
  expect(found).toHaveLength(1);
  return found[0]!;
}

// Plane geometry for outlines.
const cross2 = (o: Vec2, a: Vec2, b: Vec2) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
function segmentsCross(p1: Vec2, p2: Vec2, q1: Vec2, q2: Vec2): boolean {
  const d1 = cross2(q1, q2, p1);
  const d2 = cross2(q1, q2, p2);
  const d3 = cross2(p1, p2, q1);
  const d4 = cross2(p1, p2, q2);
  return d1 * d2 < 0 && d3 * d4 < 0;
}
function pointInPolygon([x, y]: Vec2, poly: Vec2[]): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = poly[i]!;
    const [xj, yj] = poly[j]!;
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}
function distanceToSegment(p: Vec2, a: Vec2, b: Vec2): number {
  const ab: Vec2 = [b[0] - a[0], b[1] - a[1]];
  const t = Math.max(0, Math.min(1, ((p[0] - a[0]) * ab[0] + (p[1] - a[1]) * ab[1]) / (ab[0] ** 2 + ab[1] ** 2)));
  return Math.hypot(p[0] - a[0] - t * ab[0], p[1] - a[1] - t * ab[1]);
}
const edges = (poly: Vec2[]) => poly.map((p, i): [Vec2, Vec2] => [p, poly[(i + 1) % poly.length]!]);

/** Circle through three points in a plane given as 2D coordinates (perpendicular bisectors meet at the centre). */
function circleThrough(a: Vec2, b: Vec2, c: Vec2): { center: Vec2; radius: number } {
  const d = 2 * (a[0] * (b[1] - c[1]) + b[0] * (c[1] - a[1]) + c[0] * (a[1] - b[1]));
  const sq = (p: Vec2) => p[0] ** 2 + p[1] ** 2;
  const ux = (sq(a) * (b[1] - c[1]) + sq(b) * (c[1] - a[1]) + sq(c) * (a[1] - b[1])) / d;
  const uy = (sq(a) * (c[0] - b[0]) + sq(b) * (a[0] - c[0]) + sq(c) * (b[0] - a[0])) / d;
  return { center: [ux, uy], radius: Math.hypot(a[0] - ux, a[1] - uy) };
}

describe('rotation convention', () => {
  // Right-hand rule: a quarter turn about +X takes +Y to +Z, about +Y takes +Z to +X, about +Z takes +X to +Y.
  // Common practice, no source.
  it.each([
    [[0, 1, 0], [Math.PI / 2, 0, 0], [0, 0, 1]],
    [[0, 0, 1], [0, Math.PI / 2, 0], [1, 0, 0]],
    [[1, 0, 0], [0, 0, Math.PI / 2], [0, 1, 0]],
  ] as [Vec3, Vec3, Vec3][])('turns %j by %j to %j', (v, r, expected) => {
    rotateXYZ(v, r).forEach((c, i) => expect(c).toBeCloseTo(expected[i]!, 12));
  });

  it("matches three.js's rotation matrix for Euler order 'XYZ'", () => {
    // three.js src/math/Matrix4.js, makeRotationFromEuler, order 'XYZ' (matrix entries written out there).
    const threeMatrix = ([x, y, z]: Vec3) => {
      const a = Math.cos(x), b = Math.sin(x), c = Math.cos(y), d = Math.sin(y), e = Math.cos(z), f = Math.sin(z);
      const ae = a * e, af = a * f, be = b * e, bf = b * f;
      return [
        [c * e, -c * f, d],
        [af + be * d, ae - bf * d, -b * c],
        [bf - ae * d, be + af * d, a * c],
      ];
    };
    const angle = fc.double({ min: -Math.PI, max: Math.PI, noNaN: true });
    const coord = fc.double({ min: -1, max: 1, noNaN: true });
    fc.assert(
      fc.property(fc.tuple(angle, angle, angle), fc.tuple(coord, coord, coord), (r, v) => {
        const m = threeMatrix(r);
        const got = rotateXYZ(v, r);
        m.forEach((row, i) => expect(got[i]).toBeCloseTo(row[0]! * v[0] + row[1]! * v[1] + row[2]! * v[2], 12));
      }),
    );
  });

  it('places a shape point by rotating, then moving', () => {
    expect(shapePointToModel({ position: [1, 2, 3], rotation: [Math.PI / 2, 0, 0] }, [0, 1, 0]).map((c) => +c.toFixed(12)))
      .toEqual([1, 2, 4]);
  });
});

describe('every model', () => {
  it('has the expected keys in the registry and getModel finds them', () => {
    expect(Object.keys(MODELS).sort()).toEqual(
      [
        'assembly-lube', 'cam-gear', 'crankcase', 'crankshaft', 'cylinder-head', 'dowel-pin-10', 'dowel-pin-8',
        'feeler-gauge', 'flange-bolt', 'flywheel', 'flywheel-key', 'flywheel-nut', 'flywheel-washer', 'head-bolt',
        'head-gasket', 'locating-sleeve', 'oil-seal', 'spark-plug', 'strap-wrench', 'sump-cover', 'sump-gasket',
      ].sort(),
    );
    for (const m of models) expect(getModel(m.key)).toBe(m);
    expect(getModel('toString')).toBeUndefined();
    expect(getModel('no-such-part')).toBeUndefined();
  });

  it.each(models.map((m) => [m.key, m] as const))('%s has shapes, a known kind, palette colours, a unit axis', (_, m) => {
    expect(m.shapes.length).toBeGreaterThanOrEqual(1);
    expect(PART_KINDS).toContain(m.kind);
    const palette: string[] = Object.values(PALETTE);
    expect(palette).toContain(m.color);
    for (const s of m.shapes) if (s.color) expect(palette).toContain(s.color);
    expect(length(m.assemblyAxis)).toBeCloseTo(1, 9);
    expect(m.explodeDistance).toBeGreaterThanOrEqual(0);
  });

  it.each(models.map((m) => [m.key, m] as const))('%s has positive, finite sizes', (_, m) => {
    const sizes = (s: Shape): number[] => {
      switch (s.type) {
        case 'box': return [...s.size];
        case 'cylinder': return [s.radiusTop, s.radiusBottom, s.height, s.segments];
        case 'ring': return [s.innerRadius, s.outerRadius - s.innerRadius, s.height, s.segments];
        case 'torus': return [s.radius, s.tube, s.radialSegments, s.tubularSegments];
        case 'extrude': return [s.depth, ...(s.holes ?? []).map((h) => h.radius)];
      }
    };
    for (const s of m.shapes) {
      for (const n of [...sizes(s), ...s.position, ...(s.rotation ?? [])]) expect(Number.isFinite(n)).toBe(true);
      for (const n of sizes(s)) expect(n).toBeGreaterThan(0);
    }
  });
});

describe('anchors', () => {
  const all = models.flatMap((m) => m.anchors);

  it('have keys unique across all models, and anchorPositions lists each once', () => {
    const keys = all.map((a) => a.key);
    expect(new Set(keys).size).toBe(keys.length);
    const positions = anchorPositions();
    expect(Object.keys(positions).sort()).toEqual([...keys].sort());
    for (const a of all) expect(positions[a.key]).toEqual(a.position);
    expect(findAnchor('plug-hole')?.model).toBe(cylinderHead);
  });

  it('have a known kind, a positive size and a unit insertion axis', () => {
    for (const a of all) {
      expect(ANCHOR_KINDS).toContain(a.kind);
      expect(a.sizeMm).toBeGreaterThan(0);
      expect(length(a.axis)).toBeCloseTo(1, 9);
    }
  });

  it('include the named anchors each part needs', () => {
    const keysOf = (m: PartModel) => m.anchors.map((a) => a.key);
    expect(keysOf(crankcase)).toEqual([
      ...[1, 2, 3, 4, 5, 6, 7, 8].map((n) => `sump-bolt-${n}`),
      'dowel-hole-a', 'dowel-hole-b', 'crank-bearing',
      ...[1, 2, 3, 4, 5].map((n) => `head-bolt-${n}`),
      'sleeve-hole-a', 'sleeve-hole-b',
    ]);
    expect(keysOf(crankshaft)).toEqual(expect.arrayContaining(['flywheel-keyway']));
    expect(crankshaft.anchors.some((a) => a.kind === 'shaft-end')).toBe(true);
    expect(keysOf(cylinderHead)).toEqual(['plug-hole']);
    expect(crankcaseAnchors.dowelHoleA.sizeMm).toBe(8);
    expect(crankcaseAnchors.dowelHoleB.kind).toBe('locating-hole');
  });
});

describe('sump joint', () => {
  const bolts = crankcaseAnchors.sumpBolts;
  const axis: Vec3 = [0, 1, 0];
  const xz = (p: Vec3): Vec2 => [p[0], p[2]];

  it('has eight sump bolt holes on one circle round the crankshaft', () => {
    expect(bolts).toHaveLength(8);
    const circle = circleThrough(xz(bolts[0]!.position), xz(bolts[2]!.position), xz(bolts[5]!.position));
    for (const b of bolts) {
      expect(Math.abs(Math.hypot(b.position[0] - circle.center[0], b.position[2] - circle.center[1]) - circle.radius))
        .toBeLessThan(0.5 * MM);
      expect(b.axis).toEqual(axis);
    }
    // The crankshaft runs along the Y axis, so the circle is centred on x = z = 0.
    expect(Math.hypot(...circle.center)).toBeLessThan(0.5 * MM);
  });

  it('numbers the sump bolts clockwise seen from below, evenly spaced', () => {
    // Looking up (+Y) from below, a clockwise step is a positive turn about +Y by the right-hand rule.
    // Common practice, no source.
    bolts.forEach((b, i) => {
      const next = bolts[(i + 1) % bolts.length]!;
      const turn = cross(b.position, next.position)[1];
      expect(turn).toBeGreaterThan(0);
      const cos = dot(b.position, next.position) / (length(b.position) * length(next.position));
      expect(Math.acos(cos)).toBeCloseTo(Math.PI / 4, 9);
    });
  });

  it.each([
    ['sump cover', sumpCover],
    ['sump gasket', sumpGasket],
  ] as const)('%s has a clearance hole on every sump bolt and dowel hole', (_, model) => {
    const [plate] = extrudes(model);
    expect(plate).toBeDefined();
    for (const b of bolts) expect(holeOnAnchor(plate!, b).radius * 2).toBeGreaterThan(b.sizeMm * MM);
    for (const d of [crankcaseAnchors.dowelHoleA, crankcaseAnchors.dowelHoleB]) {
      expect(holeOnAnchor(plate!, d).radius * 2).toBeGreaterThanOrEqual(d.sizeMm * MM);
    }
  });

  it('stacks crankcase face, gasket and cover with no gap', () => {
    const [gasket] = extrudes(sumpGasket);
    const [cover] = extrudes(sumpCover);
    const top = (s: ExtrudeShape) => shapePointToModel(s, [0, 0, 0])[1];
    const bottom = (s: ExtrudeShape) => shapePointToModel(s, [0, 0, s.depth])[1];
    expect(top(gasket!)).toBeCloseTo(bolts[0]!.position[1], 9);
    expect(top(cover!)).toBeCloseTo(bottom(gasket!), 9);
    expect(bottom(cover!)).toBeLessThan(top(cover!));
    // The flange bolt's head sits on the cover's underside.
    const underHead = Math.max(...cylinders(flangeBolt).filter((c) => c.segments !== 6).map((c) => c.position[1] - c.height / 2));
    expect(bolts[0]!.position[1] - underHead).toBeCloseTo(bottom(cover!), 9);
  });
});

describe('cylinder deck joint', () => {
  const bolts = crankcaseAnchors.headBolts;
  const yz = (p: Vec3): Vec2 => [p[1], p[2]];

  it('has five head bolts that do not share a circle', () => {
    expect(bolts).toHaveLength(5);
    const pts = bolts.map((b) => yz(b.position));
    for (let i = 0; i < 5; i++) {
      for (let j = i + 1; j < 5; j++) {
        for (let k = j + 1; k < 5; k++) {
          const c = circleThrough(pts[i]!, pts[j]!, pts[k]!);
          const worst = Math.max(...pts.map((p) => Math.abs(Math.hypot(p[0] - c.center[0], p[1] - c.center[1]) - c.radius)));
          expect(worst).toBeGreaterThan(1 * MM);
        }
      }
    }
  });

  it.each([
    ['head gasket', headGasket],
    ['cylinder head', cylinderHead],
  ] as const)('%s has a hole on every head bolt and locating sleeve', (_, model) => {
    const [plate] = extrudes(model);
    expect(plate).toBeDefined();
    for (const b of bolts) expect(holeOnAnchor(plate!, b).radius * 2).toBeGreaterThan(b.sizeMm * MM);
    for (const s of [crankcaseAnchors.sleeveHoleA, crankcaseAnchors.sleeveHoleB]) {
      expect(holeOnAnchor(plate!, s).radius * 2).toBeGreaterThanOrEqual(s.sizeMm * MM);
    }
  });

  it("lets the head bolt's head sit on the head's outer face", () => {
    const underHead = Math.max(...cylinders(headBolt).filter((c) => c.segments !== 6).map((c) => c.position[1] - c.height / 2));
    const plug = cylinderHead.anchors[0]!;
    expect(bolts[0]!.position[0] + underHead).toBeCloseTo(plug.position[0], 9);
  });
});

describe('extrude outlines', () => {
  const all = models.flatMap((m) => extrudes(m).map((s, i) => [`${m.key} #${i}`, s] as const));

  it('exist on the covers, gaskets, crankcase and head', () => {
    expect(all.map(([name]) => name.split(' ')[0])).toEqual(
      expect.arrayContaining(['crankcase', 'sump-cover', 'sump-gasket', 'cylinder-head', 'head-gasket']),
    );
  });

  it.each(all)('%s is a simple closed polygon with its holes inside and apart', (_, s) => {
    const poly = s.outline;
    expect(poly.length).toBeGreaterThanOrEqual(3);
    // Closed implicitly: the last point joins the first, so it must not repeat it.
    expect(poly[poly.length - 1]).not.toEqual(poly[0]);
    for (const [a, b] of edges(poly)) expect(Math.hypot(b[0] - a[0], b[1] - a[1])).toBeGreaterThan(0);
    const es = edges(poly);
    es.forEach(([a, b], i) =>
      es.forEach(([c, d], j) => {
        const adjacent = Math.abs(i - j) <= 1 || Math.abs(i - j) === es.length - 1;
        if (!adjacent) expect(segmentsCross(a, b, c, d)).toBe(false);
      }),
    );
    // Shoelace area (Wikipedia "Shoelace formula"): non-zero for a polygon that encloses something.
    const area = es.reduce((sum, [a, b]) => sum + (a[0] * b[1] - b[0] * a[1]), 0) / 2;
    expect(Math.abs(area)).toBeGreaterThan(0);

    const holes = s.holes ?? [];
    for (const h of holes) {
      expect(pointInPolygon(h.center, poly)).toBe(true);
      for (const [a, b] of es) expect(distanceToSegment(h.center, a, b)).toBeGreaterThan(h.radius);
    }
    holes.forEach((h, i) =>
      holes.slice(i + 1).forEach((k) =>
        expect(Math.hypot(h.center[0] - k.center[0], h.center[1] - k.center[1])).toBeGreaterThan(h.radius + k.radius),
      ),
    );
  });

  it('catches a self-crossing outline and a hole poking out (the checks can fail)', () => {
    const bowtie: Vec2[] = [[0, 0], [1, 1], [1, 0], [0, 1]];
    const es = edges(bowtie);
    expect(segmentsCross(es[0]![0], es[0]![1], es[2]![0], es[2]![1])).toBe(true);
    const square: Vec2[] = [[0, 0], [1, 0], [1, 1], [0, 1]];
    expect(Math.min(...edges(square).map(([a, b]) => distanceToSegment([0.9, 0.5], a, b)))).toBeCloseTo(0.1, 12);
    expect(pointInPolygon([1.5, 0.5], square)).toBe(false);
  });
});

describe('pins and sleeves', () => {
  const lengthAlongY = (m: PartModel) => {
    const ends = cylinders(m).flatMap((c) => [c.position[1] - c.height / 2, c.position[1] + c.height / 2]);
    return Math.max(...ends) - Math.min(...ends);
  };
  const diameter = (m: PartModel) => 2 * Math.max(...cylinders(m).map((c) => Math.max(c.radiusTop, c.radiusBottom)));

  it('draws each pin at its stated size', () => {
    expect(diameter(dowelPin8)).toBeCloseTo(DOWEL_PIN_8_SIZE.diameterMm * MM, 9);
    expect(lengthAlongY(dowelPin8)).toBeCloseTo(DOWEL_PIN_8_SIZE.lengthMm * MM, 9);
    expect(diameter(dowelPin10)).toBeCloseTo(DOWEL_PIN_10_SIZE.diameterMm * MM, 9);
    expect(lengthAlongY(dowelPin10)).toBeCloseTo(DOWEL_PIN_10_SIZE.lengthMm * MM, 9);
    const ring = locatingSleeve.shapes[0]!;
    expect(ring.type === 'ring' && ring.outerRadius * 2).toBeCloseTo(LOCATING_SLEEVE_SIZE.diameterMm * MM, 9);
  });

  it('makes the 8 mm pin fit the dowel holes and the decoy longer and thicker', () => {
    expect(DOWEL_PIN_8_SIZE.diameterMm).toBe(crankcaseAnchors.dowelHoleA.sizeMm);
    expect(LOCATING_SLEEVE_SIZE.diameterMm).toBe(crankcaseAnchors.sleeveHoleA.sizeMm);
    expect(DOWEL_PIN_10_SIZE.diameterMm).toBeGreaterThan(DOWEL_PIN_8_SIZE.diameterMm);
    expect(DOWEL_PIN_10_SIZE.lengthMm).toBeGreaterThan(DOWEL_PIN_8_SIZE.lengthMm);
  });
});

describe('timing marks', () => {
  const marks = (m: PartModel) => m.shapes.filter((s) => s.color === PALETTE.markPaint);

  it('sit on the line between the crank and cam axes, facing each other', () => {
    const [crankMark] = marks(crankshaft);
    const [camMark] = marks(camGear);
    expect(crankMark).toBeDefined();
    expect(camMark).toBeDefined();
    const camAxis = cylinders(camGear)[0]!.position;
    const toCam: Vec3 = [camAxis[0], 0, camAxis[2]];
    const flat = (p: Vec3): Vec3 => [p[0], 0, p[2]];
    // Both marks lie on the segment from the crank axis (origin) to the cam axis.
    for (const mark of [crankMark!, camMark!]) {
      expect(length(cross(toCam, flat(mark.position)))).toBeLessThan(1e-9);
      const t = dot(flat(mark.position), toCam) / dot(toCam, toCam);
      expect(t).toBeGreaterThan(0);
      expect(t).toBeLessThan(1);
    }
  });
});
