import { Vector3 } from 'three';
import type { PublicProcedure } from '~/lib/procedure/public-view';
import type { Stage } from '~/lib/procedure/schema';
import { modelCenter } from './geometry';
import { type SceneLayout, anchorAxis, assembledOffset, explodeFactor, placedParts, trayCopies, turnOnto } from './layout';

// Where a bolt, hole or part is right now (its resting target, not mid-animation), in the engine frame:
// labels float there and the test hook projects it to the screen.

export interface SceneView {
  stage: Stage;
  explode: number;
  sequence: readonly string[];
  placements: readonly { part: string; anchor: string }[];
}

/** Factor of each drawn part for the current view (0 home, 1 fully exploded). */
export function partFactors(procedure: PublicProcedure, layout: SceneLayout, view: SceneView): Map<string, number> {
  const placed = placedParts(procedure, view.sequence);
  const factors = new Map<string, number>();
  for (const { part } of layout.assembled) factors.set(part.key, explodeFactor(view.stage, placed.has(part.key), view.explode));
  if (layout.bolts) {
    const key = layout.bolts.group.part;
    factors.set(key, explodeFactor(view.stage, placed.has(key), view.explode));
  }
  return factors;
}

/** Offset of the part an anchor sits on (holes move with an exploded cover). */
export function anchorOffset(
  procedure: PublicProcedure, layout: SceneLayout, factors: Map<string, number>, anchorKey: string, out = new Vector3(),
): Vector3 {
  const owner = procedure.anchors.find((a) => a.key === anchorKey)?.part;
  const drawn = layout.assembled.find((d) => d.part.key === owner);
  return drawn ? assembledOffset(drawn.model, factors.get(drawn.part.key) ?? 0, out) : out.set(0, 0, 0);
}

export function scenePoint(procedure: PublicProcedure, layout: SceneLayout, view: SceneView, key: string): Vector3 | null {
  const factors = partFactors(procedure, layout, view);

  const bolt = layout.bolts?.places.find((b) => b.key === key);
  if (layout.bolts && bolt) {
    const { model, group } = layout.bolts;
    const shift = model.explodeDistance * (factors.get(group.part) ?? 0);
    return modelCenter(model).applyQuaternion(bolt.turn).add(bolt.position).addScaledVector(bolt.explodeDirection, shift);
  }
  const fastener = layout.assembledFastener;
  if (fastener && fastener.group.bolts.some((b) => b.key === key)) return scenePoint(procedure, layout, view, fastener.part);

  const anchor = procedure.anchors.find((a) => a.key === key);
  if (anchor) return new Vector3(...anchor.position).add(anchorOffset(procedure, layout, factors, key));

  const assembled = layout.assembled.find((d) => d.part.key === key);
  if (assembled) return modelCenter(assembled.model).add(assembledOffset(assembled.model, factors.get(key) ?? 0));

  const row = [...layout.pins, ...layout.bench].find((item) => item.part.key === key);
  if (row) {
    const inTray = layout.pins.includes(row) ? trayCopies(row.part, view.placements) : row.homes.length;
    if (inTray > 0) return modelCenter(row.model).applyQuaternion(row.turn).add(row.homes[0]!);
    const placement = view.placements.find((p) => p.part === key);
    if (!placement) return null;
    const seat = anchorPoint(procedure, layout, factors, placement.anchor);
    return seat && modelCenter(row.model).applyQuaternion(turnOnto(anchorAxis(placement.anchor))).add(seat);
  }

  if (layout.bolts && key === layout.bolts.group.part) return scenePoint(procedure, layout, view, layout.bolts.places[0]!.key);
  return null;
}

function anchorPoint(procedure: PublicProcedure, layout: SceneLayout, factors: Map<string, number>, key: string): Vector3 | null {
  const anchor = procedure.anchors.find((a) => a.key === key);
  return anchor ? new Vector3(...anchor.position).add(anchorOffset(procedure, layout, factors, key)) : null;
}
