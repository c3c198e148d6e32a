import { Box3, Matrix4, Quaternion, Vector3 } from 'three';
import { findAnchor, getModel } from '@models/index';
import type { PartModel, Vec3 } from '@models/types';
import type { PublicAnchor, PublicFastenerGroup, PublicPart, PublicProcedure } from '~/lib/procedure/public-view';
import type { Stage } from '~/lib/procedure/schema';
import { modelGeometry } from './geometry';

// Where everything sits: which parts are drawn how, the tray and bench row, hole and bolt placement,
// and the home camera. Pure (no React), so the scene, the labels and the tests agree on every position.

export const PIN_KINDS: readonly PublicPart['kind'][] = ['dowel-pin', 'sleeve'];
export const HOLE_KINDS: readonly PublicAnchor['kind'][] = ['locating-hole', 'threaded-hole'];

const DOWN = new Vector3(0, -1, 0);
const ONE = new Vector3(1, 1, 1);
/** Gap between items in the tray row, metres. */
const ROW_GAP = 0.03;

export interface DrawnPart {
  part: PublicPart;
  model: PartModel;
}

export interface BoltPlace {
  key: string;
  anchor: string;
  /** Hole mouth, engine frame. */
  position: Vector3;
  /** Turns the model's local −Y onto the hole's axis. */
  turn: Quaternion;
  /** Unit direction the bolt backs out when exploded (its assembly axis, turned). */
  explodeDirection: Vector3;
}

export interface HolePlace {
  anchor: PublicAnchor;
  turn: Quaternion;
  /** Unit direction a part travels to go into the hole. */
  axis: Vector3;
}

export interface RowItem {
  part: PublicPart;
  model: PartModel;
  /** Where the model's origin sits for each copy on the bench. */
  homes: Vector3[];
  /** How the model lies on the bench: tall tools and tubes are laid down so they hide nothing. */
  turn: Quaternion;
}

export interface SceneLayout {
  /** 'assembled' models, drawn where they sit in the engine. */
  assembled: DrawnPart[];
  /** The fastener group whose bolts are one instanced 'local' model, or null. */
  bolts: { group: PublicFastenerGroup; model: PartModel; places: BoltPlace[] } | null;
  /** The group drawn by an assembled part (a nut, a plug): bolt keys resolve to that part. */
  assembledFastener: { group: PublicFastenerGroup; part: string } | null;
  pins: RowItem[];
  bench: RowItem[];
  holes: HolePlace[];
  /** The board behind the row, facing the home camera: centre, size (x across, y up the screen) and turn. */
  benchSlab: { center: Vector3; size: Vector3; turn: Quaternion } | null;
  /** Everything drawn, fully exploded. */
  bounds: Box3;
}

/** Quaternion turning local −Y onto the given direction. */
export function turnOnto(axis: Vec3 | Vector3): Quaternion {
  const to = (axis instanceof Vector3 ? axis.clone() : new Vector3(...axis)).normalize();
  return new Quaternion().setFromUnitVectors(DOWN, to);
}

/**
 * The direction a part travels into an anchor. The public view carries no axes, so it comes from the
 * model that owns the anchor; failing that, the fastener group's bolt axis.
 */
export function anchorAxis(anchorKey: string, fallback: Vec3 = [0, 1, 0]): Vector3 {
  const axis = findAnchor(anchorKey)?.anchor.axis ?? fallback;
  return new Vector3(...axis).normalize();
}

/** Parts named by the steps placed so far (they go home in the Order stage). */
export function placedParts(procedure: PublicProcedure, sequence: readonly string[]): Set<string> {
  const placed = new Set<string>();
  for (const key of sequence) {
    for (const part of procedure.steps.find((s) => s.key === key)?.parts ?? []) placed.add(part);
  }
  return placed;
}

/** How far along its explode path a part sits: 0 home, 1 fully out. Placed steps bring parts home only while ordering. */
export function explodeFactor(stage: Stage, placed: boolean, explode: number): number {
  return stage === 'order' && placed ? 0 : explode;
}

/** Offset of an assembled model from its home at the given factor. */
export function assembledOffset(model: PartModel, factor: number, out = new Vector3()): Vector3 {
  return out.set(...model.assemblyAxis).multiplyScalar(model.explodeDistance * factor);
}

/** Copies of each pin part still in the tray (count minus those placed in holes). */
export function trayCopies(part: PublicPart, placements: readonly { part: string }[]): number {
  return Math.max(0, part.count - placements.filter((p) => p.part === part.key).length);
}

function modelBox(model: PartModel): Box3 {
  return modelGeometry(model).boundingBox!.clone();
}

export function buildLayout(procedure: PublicProcedure): SceneLayout {
  const drawn = procedure.parts
    .map((part) => ({ part, model: getModel(part.model) }))
    .filter((d): d is DrawnPart => d.model !== undefined);

  const group = procedure.fastenerGroups[0];
  const groupModel = group ? drawn.find((d) => d.part.key === group.part)?.model : undefined;
  const localGroup = group && groupModel?.placement === 'local' ? group : undefined;

  const assembled = drawn.filter((d) => d.model.placement === 'assembled');
  const pins = drawn.filter((d) => d.model.placement === 'local' && PIN_KINDS.includes(d.part.kind));
  const benchParts = drawn.filter(
    (d) => d.model.placement === 'local' && !PIN_KINDS.includes(d.part.kind) && d.part.key !== localGroup?.part,
  );

  const bolts = localGroup && groupModel
    ? {
        group: localGroup,
        model: groupModel,
        places: localGroup.bolts.map((bolt): BoltPlace => {
          const axis = anchorAxis(bolt.anchor, localGroup.axis);
          const turn = turnOnto(axis);
          return {
            key: bolt.key,
            anchor: bolt.anchor,
            position: new Vector3(...bolt.position),
            turn,
            explodeDirection: new Vector3(...groupModel.assemblyAxis).normalize().applyQuaternion(turn),
          };
        }),
      }
    : null;

  const holes = procedure.anchors
    .filter((a) => HOLE_KINDS.includes(a.kind))
    .map((anchor): HolePlace => {
      const axis = anchorAxis(anchor.key);
      return { anchor, axis, turn: turnOnto(axis) };
    });

  // The engine fully exploded, so the bench row clears everything that moves.
  const engine = new Box3();
  for (const { model } of assembled) {
    const box = modelBox(model);
    engine.union(box.clone().translate(assembledOffset(model, 1)));
    engine.union(box);
  }
  if (bolts) {
    const box = modelBox(bolts.model);
    for (const place of bolts.places) {
      for (const factor of [0, 1]) {
        const shift = place.explodeDirection.clone().multiplyScalar(bolts.model.explodeDistance * factor).add(place.position);
        engine.union(box.clone().applyMatrix4(matrixOf(place.turn, shift)));
      }
    }
  }
  if (engine.isEmpty()) engine.set(new Vector3(-0.1, -0.1, -0.1), new Vector3(0.1, 0.1, 0.1));

  // One row just under the engine as the home camera sees it (pins first, then tools and consumables),
  // on a board facing that camera, so the row never hides a part and a part never hides the row.
  const view = viewDirection(group?.axis);
  const { right, up: screenUp } = screenAxes(view);
  const center = engine.getCenter(new Vector3());
  const rowItems = [
    ...pins.map((d) => ({ ...d, copies: d.part.count, turn: new Quaternion() })),
    ...benchParts.map((d) => ({ ...d, copies: 1, turn: benchTurn(modelBox(d.model)) })),
  ];
  const boxes = rowItems.map((item) => modelBox(item.model).applyMatrix4(matrixOf(item.turn, new Vector3())));
  const extent = (box: Box3, axis: Vector3) => {
    const size = box.getSize(new Vector3());
    return Math.abs(size.x * axis.x) + Math.abs(size.y * axis.y) + Math.abs(size.z * axis.z);
  };
  const rowHeight = Math.max(0, ...boxes.map((box) => extent(box, screenUp)));
  const lowest = Math.min(...corners(engine).map((c) => c.sub(center).dot(screenUp)));
  const rowCenter = center.clone().addScaledVector(screenUp, lowest - ROW_GAP - rowHeight / 2);
  const width = boxes.reduce((sum, box, i) => sum + (extent(box, right) + ROW_GAP) * rowItems[i]!.copies, -ROW_GAP);
  let cursor = -width / 2;
  const items: RowItem[] = rowItems.map((item, i) => {
    const box = boxes[i]!;
    const footprint = extent(box, right);
    const homes: Vector3[] = [];
    for (let copy = 0; copy < item.copies; copy++) {
      // The copy's box centre sits on the row line; home is where the model's origin goes for that.
      const slot = rowCenter.clone().addScaledVector(right, cursor + footprint / 2);
      homes.push(slot.sub(box.getCenter(new Vector3())));
      cursor += footprint + ROW_GAP;
    }
    return { part: item.part, model: item.model, homes, turn: item.turn };
  });

  const bounds = engine.clone();
  let benchSlab: SceneLayout['benchSlab'] = null;
  if (items.length > 0) {
    const row = new Box3();
    items.forEach((item) => item.homes.forEach((home) => row.union(modelBox(item.model).applyMatrix4(matrixOf(item.turn, home)))));
    const depth = Math.max(...boxes.map((box) => extent(box, view)));
    const turn = new Quaternion().setFromRotationMatrix(new Matrix4().makeBasis(right, screenUp, view));
    benchSlab = {
      center: rowCenter.clone().addScaledVector(view, -(depth / 2 + 0.01)),
      // Set back behind the row, the board looks smaller in perspective: grow it by the row's depth.
      size: new Vector3(width + 2 * ROW_GAP + depth, rowHeight + 2 * ROW_GAP + depth, 0.006),
      turn,
    };
    bounds.union(row);
  }

  return {
    assembled,
    bolts,
    assembledFastener: group && !localGroup && groupModel ? { group, part: group.part } : null,
    pins: items.slice(0, pins.length),
    bench: items.slice(pins.length),
    holes,
    benchSlab,
    bounds,
  };
}

/** A tool taller than it is wide lies on its side (its local +Y turned to +X). */
function benchTurn(box: Box3): Quaternion {
  const size = box.getSize(new Vector3());
  return size.y > 1.5 * Math.max(size.x, size.z) ? new Quaternion().setFromAxisAngle(new Vector3(0, 0, 1), -Math.PI / 2) : new Quaternion();
}

/** Rotation then translation as one matrix (local model frame → engine frame). */
export function matrixOf(turn: Quaternion, position: Vector3, out = new Matrix4()): Matrix4 {
  return out.compose(position, turn, ONE);
}

/** The eight corners of a box. */
function corners(box: Box3): Vector3[] {
  const out: Vector3[] = [];
  for (const x of [box.min.x, box.max.x]) for (const y of [box.min.y, box.max.y]) for (const z of [box.min.z, box.max.z]) out.push(new Vector3(x, y, z));
  return out;
}

/** How far the home camera leans toward the side the fasteners go in from. */
const LEAN = (35 * Math.PI) / 180;

/**
 * Unit direction from the scene's centre to the home camera: from the front right, square to the bolt
 * axis so the exploded gap shows, then leaned 35° toward the side the fasteners go in from, so the
 * holes and bolt heads face the learner. A larger `lean` (radians) looks more squarely onto the holes.
 */
export function viewDirection(boltAxis: Vec3 = [0, -1, 0], lean = LEAN): Vector3 {
  const axis = new Vector3(...boltAxis).normalize();
  const square = new Vector3(0.55, 0.35, 1);
  square.addScaledVector(axis, -square.dot(axis)).normalize();
  return square.multiplyScalar(Math.cos(lean)).addScaledVector(axis, -Math.sin(lean)).normalize();
}

/** Screen right and screen up for a camera looking back along `view` with world +Y up. */
export function screenAxes(view: Vector3): { right: Vector3; up: Vector3 } {
  const forward = view.clone().negate();
  const right = new Vector3().crossVectors(forward, new Vector3(0, 1, 0));
  if (right.lengthSq() < 1e-9) right.set(1, 0, 0);
  right.normalize();
  return { right, up: new Vector3().crossVectors(right, forward).normalize() };
}

export interface HomeView {
  position: Vector3;
  target: Vector3;
  fov: number;
}

/** Camera that frames the whole exploded scene from `viewDirection`. */
export function homeView(layout: SceneLayout, fov = 38): HomeView {
  const target = layout.bounds.getCenter(new Vector3());
  const radius = layout.bounds.getSize(new Vector3()).length() / 2;
  const along = layout.bolts?.group.axis ?? layout.assembledFastener?.group.axis;
  const distance = (radius / Math.sin(((fov / 2) * Math.PI) / 180)) * 0.92;
  return { position: target.clone().addScaledVector(viewDirection(along), distance), target, fov };
}
