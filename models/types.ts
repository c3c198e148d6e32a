import type { ANCHOR_KINDS, PART_KINDS, Vec3 } from '~/lib/procedure/schema';
import type { PaletteColor } from './palette';

// Our own model format: plain data the browser turns into geometry; the server only reads anchors.
// Units are metres. Engine frame: +Y up along the vertical crankshaft, cylinder along +X, sump below.

export type { Vec3 };
export type Vec2 = [number, number];

export type PartKind = (typeof PART_KINDS)[number];
export type AnchorKind = (typeof ANCHOR_KINDS)[number];

interface ShapeBase {
  /** Centre of the primitive (extrude: the point its outline's origin sits on), in the model's frame. */
  position: Vec3;
  /** Euler angles in radians, applied in X-then-Y-then-Z order as three.js does by default. */
  rotation?: Vec3;
  /** Overrides the part colour for a detail such as a timing mark or an insulator. */
  color?: PaletteColor;
}

/** Box centred on its position. */
export interface BoxShape extends ShapeBase {
  type: 'box';
  size: Vec3;
}

/** Solid cylinder or cone with its axis along local Y, centred on its position; 6 segments draws a hex. */
export interface CylinderShape extends ShapeBase {
  type: 'cylinder';
  radiusTop: number;
  radiusBottom: number;
  height: number;
  segments: number;
}

/** Hollow cylinder (washer, seal, sleeve) with its axis along local Y, centred on its position. */
export interface RingShape extends ShapeBase {
  type: 'ring';
  innerRadius: number;
  outerRadius: number;
  height: number;
  segments: number;
}

/** Torus lying in the local XY plane around local Z, centred on its position. */
export interface TorusShape extends ShapeBase {
  type: 'torus';
  radius: number;
  tube: number;
  radialSegments: number;
  tubularSegments: number;
}

export interface CircleHole {
  center: Vec2;
  radius: number;
}

/** A closed 2D outline in the local XY plane (last point joins the first), extruded from local z = 0 to z = depth. */
export interface ExtrudeShape extends ShapeBase {
  type: 'extrude';
  outline: Vec2[];
  holes?: CircleHole[];
  depth: number;
}

export type Shape = BoxShape | CylinderShape | RingShape | TorusShape | ExtrudeShape;

export interface ModelAnchor {
  key: string;
  kind: AnchorKind;
  /** Position in the assembled engine frame, metres. */
  position: Vec3;
  sizeMm: number;
  /** Unit direction a part travels to go into this anchor, engine frame (lets the trainer orient a pin or bolt). */
  axis: Vec3;
}

/**
 * assembled: shapes already sit where the part sits in the assembled engine.
 * local: shapes are drawn about the model's own origin. For pins, sleeves and bolts the origin is
 * the mouth of the hole the part goes into and the part goes in along local −Y, so the trainer draws
 * one copy per anchor, turning local −Y onto the anchor's axis. Tools and consumables stay on the bench.
 */
export type Placement = 'assembled' | 'local';

export interface PartModel {
  key: string;
  name: string;
  kind: PartKind;
  color: PaletteColor;
  placement: Placement;
  shapes: Shape[];
  anchors: ModelAnchor[];
  /** Unit direction the part moves when the view is exploded (local frame for placement 'local'). */
  assemblyAxis: Vec3;
  /** How far it moves, metres; 0 for the part everything else is built on. */
  explodeDistance: number;
  /** Dowel pins and sleeves: diameter × length in millimetres, so a procedure can take the size from the model. */
  pin?: { diameterMm: number; lengthMm: number };
}
