import { describe, expect, it } from 'vitest';
import { Box3, BufferGeometry, DoubleSide, Mesh, MeshBasicMaterial, Raycaster, Vector3 } from 'three';
import { MODELS, getModel } from '@models/index';
import { PALETTE } from '@models/palette';
import { DEMO_PROCEDURES } from '@models/procedures/index';
import type { Shape } from '@models/types';
import {
  SUMP_BOLT_COUNT, SUMP_COVER_TOP_Y, SUMP_DOWEL_XZ, SUMP_FLANGE_THICKNESS, SUMP_OPENING_RADIUS, sumpBoltXZ,
} from '@models/wren-160-layout';
import { procedureSchema } from '~/lib/procedure/schema';
import { toPublicProcedure, type PublicProcedure } from '~/lib/procedure/public-view';
import { buildModelGeometry, modelGeometry, shapeGeometry } from '~/components/trainer/scene/geometry';
import { buildLayout, homeView, placedParts, screenAxes, trayCopies, viewDirection } from '~/components/trainer/scene/layout';
import { scenePoint } from '~/components/trainer/scene/points';
import { verdicts } from '~/components/trainer/scene/tones';
import { BIND_AT_TURNS, allowedCrankDelta, crankBinds } from '~/components/trainer/scene/crank';
import { LOCATING_MARKER, THREADED_MARKER } from '~/components/trainer/scene/markers';
import type { AttemptResult } from '~/components/trainer/store';

// The scene's geometry is built from the model data (models/*.ts); these checks hold it to those
// numbers and to textbook solid geometry, so a wrong rotation, a lost hole or a flipped face shows.

const models = Object.values(MODELS);

function publicView(slug: string): PublicProcedure {
  const input = DEMO_PROCEDURES.find((p) => p.slug === slug);
  if (!input) throw new Error(`no demo procedure ${slug}`);
  return toPublicProcedure(procedureSchema.parse(input), 'learner-1:test');
}

/** Signed volume by the divergence theorem: Σ v0·(v1×v2)/6 over the triangles; positive when faces point out. */
function signedVolume(geometry: BufferGeometry): number {
  const p = geometry.getAttribute('position');
  const a = new Vector3(), b = new Vector3(), c = new Vector3();
  let sum = 0;
  for (let i = 0; i < p.count; i += 3) {
    a.fromBufferAttribute(p, i);
    b.fromBufferAttribute(p, i + 1);
    c.fromBufferAttribute(p, i + 2);
    sum += a.dot(b.clone().cross(c));
  }
  return sum / 6;
}

/** Area of a regular n-gon with circumradius r: (n/2)·r²·sin(2π/n) (standard plane geometry). */
const polygonArea = (n: number, r: number) => (n / 2) * r * r * Math.sin((2 * Math.PI) / n);

function box(geometry: BufferGeometry): Box3 {
  geometry.computeBoundingBox();
  return geometry.boundingBox!;
}

describe('modelGeometry', () => {
  it('builds one non-empty triangle geometry per model, with normals and vertex colours', () => {
    for (const model of models) {
      const g = modelGeometry(model);
      const position = g.getAttribute('position');
      expect(position.count, model.key).toBeGreaterThan(0);
      expect(position.count % 3, model.key).toBe(0);
      expect(g.getAttribute('normal').count).toBe(position.count);
      expect(g.getAttribute('color').count).toBe(position.count);
      expect(g.index).toBeNull();
      expect([...(position.array as Float32Array)].every(Number.isFinite), model.key).toBe(true);
    }
  });

  it('is built once and shared: the cache hands back the same object', () => {
    const crankcase = getModel('crankcase')!;
    expect(modelGeometry(crankcase)).toBe(modelGeometry(crankcase));
    // A fresh build is a different object with the same vertex count.
    const fresh = buildModelGeometry(crankcase);
    expect(fresh).not.toBe(modelGeometry(crankcase));
    expect(fresh.getAttribute('position').count).toBe(modelGeometry(crankcase).getAttribute('position').count);
  });

  it('gives every closed solid a positive volume: all faces wound outward', () => {
    for (const model of models) {
      for (const shape of model.shapes) {
        expect(signedVolume(shapeGeometry(shape, model.color)), `${model.key} ${shape.type}`).toBeGreaterThan(0);
      }
    }
  });

  it('matches textbook volumes for a box, a cylinder and a ring', () => {
    const boxShape: Shape = { type: 'box', size: [0.02, 0.03, 0.05], position: [0.1, 0.2, 0.3], rotation: [0.3, 0.5, 0.7] };
    expect(signedVolume(shapeGeometry(boxShape, PALETTE.steel)) / (0.02 * 0.03 * 0.05)).toBeCloseTo(1, 6);
    const cylinder: Shape = { type: 'cylinder', radiusTop: 0.01, radiusBottom: 0.01, height: 0.04, segments: 24, position: [0, 0, 0] };
    expect(signedVolume(shapeGeometry(cylinder, PALETTE.steel)) / (polygonArea(24, 0.01) * 0.04)).toBeCloseTo(1, 6);
    const ring: Shape = { type: 'ring', innerRadius: 0.012, outerRadius: 0.02, height: 0.006, segments: 40, position: [0, 0, 0] };
    const expected = (polygonArea(40, 0.02) - polygonArea(40, 0.012)) * 0.006;
    expect(signedVolume(shapeGeometry(ring, PALETTE.steel)) / expected).toBeCloseTo(1, 5);
  });

  it('cuts the holes out of an extruded plate: the sump face keeps plate area minus its openings', () => {
    const crankcase = getModel('crankcase')!;
    const face = crankcase.shapes[0]!;
    if (face.type !== 'extrude') throw new Error('crankcase face is not an extrude');
    // Shoelace formula for the outline's area.
    const outline = face.outline;
    const outlineArea = Math.abs(outline.reduce((s, [u, v], i) => {
      const [u2, v2] = outline[(i + 1) % outline.length]!;
      return s + u * v2 - u2 * v;
    }, 0)) / 2;
    const holesArea = (face.holes ?? []).reduce((s, h) => s + Math.PI * h.radius * h.radius, 0);
    const volume = signedVolume(shapeGeometry(face, crankcase.color));
    // Holes are drawn as polygons, a little smaller than circles: within 1 %.
    expect(volume / ((outlineArea - holesArea) * face.depth)).toBeCloseTo(1, 2);
    // Without the big opening the volume would be about 40 % larger; the check above could not pass.
    expect(holesArea).toBeGreaterThan(Math.PI * SUMP_OPENING_RADIUS ** 2);
  });

  it('leaves a clear path through each dowel and bolt hole of the crankcase face, and metal beside it', () => {
    const mesh = new Mesh(modelGeometry(getModel('crankcase')!), new MeshBasicMaterial({ side: DoubleSide }));
    mesh.updateMatrixWorld();
    const throughFace = (x: number, z: number) => {
      // Straight down from just inside the 12 mm flange's top (under the bolt bosses) to below its face.
      const ray = new Raycaster(new Vector3(x, 0.0115, z), new Vector3(0, -1, 0), 0, 0.02);
      return ray.intersectObject(mesh).length;
    };
    for (const [x, z] of [SUMP_DOWEL_XZ.a, SUMP_DOWEL_XZ.b, ...Array.from({ length: SUMP_BOLT_COUNT }, (_, i) => sumpBoltXZ(i + 1))]) {
      expect(throughFace(x, z), `hole at ${x}, ${z}`).toBe(0);
    }
    expect(throughFace(SUMP_DOWEL_XZ.a[0] + 0.009, SUMP_DOWEL_XZ.a[1])).toBeGreaterThan(0);
  });

  it('places and turns shapes as the model says (bounding boxes from the model numbers)', () => {
    // Sump cover: flange outline ±115 × ±110 mm hanging down from the cover's top face, pan and feet below.
    const sump = box(modelGeometry(getModel('sump-cover')!));
    expect(sump.max.y).toBeCloseTo(SUMP_COVER_TOP_Y, 6);
    expect(sump.min.x).toBeCloseTo(-0.115, 6);
    expect(sump.max.x).toBeCloseTo(0.115, 6);
    expect(sump.max.z).toBeCloseTo(0.11, 6);
    // models/sump-cover.ts: flange 8 mm, pan 30 mm, feet 12 mm below the top.
    expect(sump.min.y).toBeCloseTo(SUMP_COVER_TOP_Y - SUMP_FLANGE_THICKNESS - 0.03 - 0.012, 6);

    // Flange bolt M6 (models/flange-bolt.ts): 12 mm of thread below the hole mouth, 8.8 mm clamp, 1.5 mm flange, 4.5 mm hex.
    const bolt = box(modelGeometry(getModel('flange-bolt')!));
    expect(bolt.min.y).toBeCloseTo(-0.012, 6);
    expect(bolt.max.y).toBeCloseTo(0.0008 + 0.008 + 0.0015 + 0.0045, 6);
    expect(bolt.max.x).toBeCloseTo(0.0075, 6);

    // A cylinder laid along X (rotation about Z by 90°) is as long in x as its height.
    const barrel: Shape = { type: 'cylinder', radiusTop: 0.01, radiusBottom: 0.01, height: 0.08, segments: 24, position: [0.1, 0, 0], rotation: [0, 0, Math.PI / 2] };
    const b = box(shapeGeometry(barrel, PALETTE.steel));
    expect(b.max.x - b.min.x).toBeCloseTo(0.08, 6);
    expect(b.max.y - b.min.y).toBeCloseTo(0.02, 6);

    // The strap wrench's torus is laid flat (models/strap-wrench.ts): 2 × (60 + 4) mm across, 8 mm thick.
    const strap = getModel('strap-wrench')!.shapes[0]!;
    const t = box(shapeGeometry(strap, PALETTE.strapNylon));
    expect(t.max.y - t.min.y).toBeCloseTo(0.008, 6);
    expect(t.max.x - t.min.x).toBeCloseTo(0.128, 6);
  });

  it('draws an M6 flange bolt hex 10 mm across flats', () => {
    // ISO 4162 hexagon flange bolts, M6: s = 10 mm across flats (from memory).
    const hex = getModel('flange-bolt')!.shapes.find((s) => s.type === 'cylinder' && s.segments === 6)!;
    const g = box(shapeGeometry(hex, PALETTE.darkSteel));
    expect(g.max.x - g.min.x).toBeCloseTo(0.01, 6);
  });

  it('colours a detail with its own colour and the rest with the part colour', () => {
    const cam = getModel('cam-gear')!;
    const colors = modelGeometry(cam).getAttribute('color');
    const distinct = new Set<string>();
    for (let i = 0; i < colors.count; i++) distinct.add([colors.getX(i), colors.getY(i), colors.getZ(i)].map((v) => v.toFixed(4)).join(','));
    // gear brass, timing mark paint, steel camshaft.
    expect(distinct.size).toBe(3);
  });

  it('builds the hole markers: a threaded marker has more to it than a plain locating collar', () => {
    const plain = modelGeometry(LOCATING_MARKER).getAttribute('position').count;
    const threaded = modelGeometry(THREADED_MARKER).getAttribute('position').count;
    expect(plain).toBeGreaterThan(0);
    expect(threaded).toBeGreaterThan(plain);
  });
});

describe('scene layout for the sump procedure', () => {
  const procedure = publicView('wren-160-sump');
  const layout = buildLayout(procedure);
  const view = { stage: 'pattern' as const, explode: 1, sequence: [] as string[], placements: [] as { part: string; anchor: string }[] };

  it('draws the procedure parts: assembled ones in place, eight bolts in their holes, pins in the tray', () => {
    expect(layout.assembled.map((d) => d.part.key).sort()).toEqual(
      ['cam-gear', 'crankcase', 'crankshaft', 'oil-seal', 'sump-cover', 'sump-gasket'],
    );
    expect(layout.bolts?.places).toHaveLength(8);
    expect(layout.pins.map((p) => [p.part.key, p.homes.length]).sort()).toEqual([['dowel-pin-10', 1], ['dowel-pin-8', 2]]);
    expect(layout.bench.map((b) => b.part.key)).toEqual(['assembly-lube']);
    expect(layout.holes.map((h) => h.anchor.kind).sort()).toEqual([
      'locating-hole', 'locating-hole', ...Array<string>(8).fill('threaded-hole'),
    ]);
  });

  it('turns each bolt so it goes up into the crankcase, head below the sump, and backs out downward', () => {
    // models/crankcase.ts: sump bolt holes take their bolt travelling +Y.
    for (const place of layout.bolts!.places) {
      const head = new Vector3(0, 1, 0).applyQuaternion(place.turn);
      expect(head.y).toBeCloseTo(-1, 9);
      expect(place.explodeDirection.y).toBeCloseTo(-1, 9);
    }
  });

  it('puts the tray under the engine as the home camera sees it, clear of every part at either end of its travel', () => {
    const { up } = screenAxes(viewDirection(layout.bolts!.group.axis));
    const along = (b: Box3) => {
      const ends = [b.min, b.max].flatMap((p) => [b.min, b.max].flatMap((q) => [b.min, b.max].map((r) => new Vector3(p.x, q.y, r.z).dot(up))));
      return { low: Math.min(...ends), high: Math.max(...ends) };
    };
    const engineLow = Math.min(...layout.assembled.flatMap((d) => [0, 1].map((f) => {
      const b = box(modelGeometry(d.model)).clone().translate(new Vector3(...d.model.assemblyAxis).multiplyScalar(d.model.explodeDistance * f));
      return along(b).low;
    })));
    for (const item of layout.pins) {
      for (const home of item.homes) expect(along(box(modelGeometry(item.model)).clone().translate(home)).high).toBeLessThan(engineLow);
    }
    expect(trayCopies(layout.pins.find((p) => p.part.key === 'dowel-pin-8')!.part, [{ part: 'dowel-pin-8' }])).toBe(1);
  });

  it('moves a bolt by its explode distance and brings it home at explode 0', () => {
    const out = scenePoint(procedure, layout, view, 'bolt-1')!;
    const home = scenePoint(procedure, layout, { ...view, explode: 0 }, 'bolt-1')!;
    expect(out.y - home.y).toBeCloseTo(-getModel('flange-bolt')!.explodeDistance, 9);
    const [x, z] = sumpBoltXZ(1);
    expect(home.x).toBeCloseTo(x, 9);
    expect(home.z).toBeCloseTo(z, 9);
  });

  it('brings home only the parts of placed steps, and only while ordering', () => {
    const placed = placedParts(procedure, ['seat-sump-cover']);
    expect([...placed].sort()).toEqual(['crankcase', 'crankshaft', 'sump-cover']);
    const ordering = scenePoint(procedure, layout, { ...view, stage: 'order', sequence: ['seat-sump-cover'] }, 'sump-cover')!;
    const pinning = scenePoint(procedure, layout, { ...view, stage: 'pins', sequence: ['seat-sump-cover'] }, 'sump-cover')!;
    expect(pinning.y - ordering.y).toBeCloseTo(-getModel('sump-cover')!.explodeDistance, 9);
  });

  it('frames the joint from the side the bolts go in: the camera looks up at the sump face', () => {
    const home = homeView(layout);
    expect(home.position.y).toBeLessThan(home.target.y);
    // Leaned 35° from square toward the bolts' entry side: cos(90° − 35°) = sin 35°.
    for (const axis of [[0, 1, 0], [-1, 0, 0], [0, -1, 0]] as const) {
      expect(viewDirection([...axis]).dot(new Vector3(...axis).negate())).toBeCloseTo(Math.sin((35 * Math.PI) / 180), 9);
    }
    expect(layout.bounds.containsPoint(home.position)).toBe(false);
  });
});

describe('feedback and the crank', () => {
  const procedure = publicView('wren-160-sump');
  const result = (lines: AttemptResult['results'], passed = false): AttemptResult => ({
    id: 'a1', score: 0, maxScore: 1, passed, results: lines, notes: [],
  });

  it('marks the parts of a wrong step, and a part in both a right and a wrong step as wrong', () => {
    const marks = verdicts(procedure, result([
      { key: 'align-timing-marks', ok: true, message: '' },
      { key: 'lube-cam-and-bearings', ok: false, message: '' },
      { key: 'dowel-hole-a', ok: true, message: '' },
    ]));
    expect(marks.get('cam-gear')).toBe('bad');
    expect(marks.get('crankshaft')).toBe('bad');
    expect(marks.get('assembly-lube')).toBe('bad');
    expect(marks.get('dowel-hole-a')).toBe('good');
    expect(marks.has('sump-cover')).toBe(false);
  });

  it('binds after a quarter turn only when the order stage did not pass', () => {
    expect(crankBinds({})).toBe(false);
    expect(crankBinds({ order: result([], true) })).toBe(false);
    expect(crankBinds({ order: result([], false) })).toBe(true);
    expect(allowedCrankDelta(0, 2, false)).toBe(2);
    expect(allowedCrankDelta(0, 2, true)).toBe(BIND_AT_TURNS);
    expect(allowedCrankDelta(0.2, 0.1, true)).toBeCloseTo(0.05, 12);
    expect(allowedCrankDelta(BIND_AT_TURNS, 0.1, true)).toBe(0);
    // Turning back is always allowed.
    expect(allowedCrankDelta(BIND_AT_TURNS, -0.1, true)).toBe(-0.1);
  });
});
