import {
  BoxGeometry, BufferGeometry, Color, CylinderGeometry, Euler, ExtrudeGeometry, Float32BufferAttribute,
  LatheGeometry, Matrix4, Path, Quaternion, Shape as OutlineShape, TorusGeometry, Vector2, Vector3,
} from 'three';
import { mergeGeometries } from 'three/examples/jsm/utils/BufferGeometryUtils.js';
import type { PartModel, Shape } from '@models/types';

// Turns a part model's shapes into ONE merged geometry (per-shape colours as vertex colours), so each
// model costs one draw call and is built once, however many meshes or instances show it.

/** Segments for the round holes cut into extruded plates. */
const HOLE_SEGMENTS = 20;

/** A ring as four lathed faces (outer wall, top, inner wall, bottom) so its edges stay sharp. */
function ringGeometry(inner: number, outer: number, height: number, segments: number): BufferGeometry {
  const top = height / 2;
  const bottom = -height / 2;
  // Each face runs counter-clockwise round the profile, so LatheGeometry points its normal outward.
  const faces: [Vector2, Vector2][] = [
    [new Vector2(outer, bottom), new Vector2(outer, top)],
    [new Vector2(outer, top), new Vector2(inner, top)],
    [new Vector2(inner, top), new Vector2(inner, bottom)],
    [new Vector2(inner, bottom), new Vector2(outer, bottom)],
  ];
  return mergeOrThrow(faces.map((points) => new LatheGeometry(points, segments)).map(prepare), 'ring');
}

function extrudeGeometry(shape: Extract<Shape, { type: 'extrude' }>): BufferGeometry {
  const outline = new OutlineShape(shape.outline.map(([u, v]) => new Vector2(u, v)));
  for (const hole of shape.holes ?? []) {
    const path = new Path();
    path.absarc(hole.center[0], hole.center[1], hole.radius, 0, Math.PI * 2, false);
    outline.holes.push(path);
  }
  return new ExtrudeGeometry(outline, { depth: shape.depth, bevelEnabled: false, curveSegments: HOLE_SEGMENTS });
}

/** The primitive for one shape, about its own origin (before position and rotation). */
function primitive(shape: Shape): BufferGeometry {
  switch (shape.type) {
    case 'box':
      return new BoxGeometry(...shape.size);
    case 'cylinder':
      return new CylinderGeometry(shape.radiusTop, shape.radiusBottom, shape.height, shape.segments);
    case 'ring':
      return ringGeometry(shape.innerRadius, shape.outerRadius, shape.height, shape.segments);
    case 'torus':
      return new TorusGeometry(shape.radius, shape.tube, shape.radialSegments, shape.tubularSegments);
    case 'extrude':
      return extrudeGeometry(shape);
  }
}

/** Non-indexed, position + normal only, so every piece merges with every other. */
function prepare(geometry: BufferGeometry): BufferGeometry {
  const flat = geometry.index ? geometry.toNonIndexed() : geometry;
  if (flat !== geometry) geometry.dispose();
  for (const name of Object.keys(flat.attributes)) {
    if (name !== 'position' && name !== 'normal') flat.deleteAttribute(name);
  }
  flat.clearGroups();
  return flat;
}

function mergeOrThrow(pieces: BufferGeometry[], what: string): BufferGeometry {
  const merged = mergeGeometries(pieces, false);
  for (const piece of pieces) piece.dispose();
  if (!merged) throw new Error(`could not merge the shapes of ${what}`);
  return merged;
}

/** The shape's placement in the model frame: Euler angles in X-then-Y-then-Z order, as the model format says. */
export function shapeMatrix(shape: Pick<Shape, 'position' | 'rotation'>): Matrix4 {
  const [rx, ry, rz] = shape.rotation ?? [0, 0, 0];
  const quaternion = new Quaternion().setFromEuler(new Euler(rx, ry, rz, 'XYZ'));
  return new Matrix4().compose(new Vector3(...shape.position), quaternion, new Vector3(1, 1, 1));
}

/** One shape, placed in the model frame, with a vertex colour attribute of its colour. */
export function shapeGeometry(shape: Shape, fallbackColor: string): BufferGeometry {
  const geometry = prepare(primitive(shape));
  geometry.applyMatrix4(shapeMatrix(shape));
  // Color converts the sRGB hex into the linear working space vertex colours are read in.
  const color = new Color(shape.color ?? fallbackColor);
  const count = geometry.getAttribute('position').count;
  const colors = new Float32Array(count * 3);
  for (let i = 0; i < count; i++) colors.set([color.r, color.g, color.b], i * 3);
  geometry.setAttribute('color', new Float32BufferAttribute(colors, 3));
  return geometry;
}

/** All of a model's shapes merged into one geometry (not cached; see modelGeometry). */
export function buildModelGeometry(model: Pick<PartModel, 'key' | 'color' | 'shapes'>): BufferGeometry {
  if (model.shapes.length === 0) throw new Error(`model ${model.key} has no shapes`);
  const merged = mergeOrThrow(model.shapes.map((shape) => shapeGeometry(shape, model.color)), model.key);
  merged.computeBoundingBox();
  merged.computeBoundingSphere();
  merged.name = model.key;
  return merged;
}

const cache = new Map<string, BufferGeometry>();

/** The model's merged geometry, built on first use and shared by every mesh that draws the model. */
export function modelGeometry(model: Pick<PartModel, 'key' | 'color' | 'shapes'>): BufferGeometry {
  let geometry = cache.get(model.key);
  if (!geometry) {
    geometry = buildModelGeometry(model);
    cache.set(model.key, geometry);
  }
  return geometry;
}

/** Centre of the model's bounding box in its own frame (where labels and projections point). */
export function modelCenter(model: Pick<PartModel, 'key' | 'color' | 'shapes'>): Vector3 {
  const box = modelGeometry(model).boundingBox!;
  return box.getCenter(new Vector3());
}
