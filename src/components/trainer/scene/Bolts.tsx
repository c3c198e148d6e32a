import { useLayoutEffect, useMemo, useRef } from 'react';
import { useFrame, type ThreeEvent } from '@react-three/fiber';
import { Color, CylinderGeometry, Matrix4, Vector3, type InstancedMesh } from 'three';
import { useTrainerStore } from '../context';
import { modelCenter, modelGeometry } from './geometry';
import { type SceneLayout, explodeFactor, matrixOf } from './layout';
import { INSTANCE_COLOR, type Tone } from './tones';
import { isClick } from './pointer';

const SETTLE_RATE = 9;
/** Bolts are thin: the invisible grab cylinder round each is at least this wide (metres). */
const MIN_HIT_RADIUS = 0.008;

interface BoltsProps {
  bolts: NonNullable<SceneLayout['bolts']>;
  placed: boolean;
  /** One tone per bolt, in `bolts.places` order. */
  tones: Tone[];
  onPick?: (boltKey: string) => void;
}

/** Every bolt of the fastener group as one instanced mesh (one draw call), each in its threaded hole. */
export function Bolts({ bolts, placed, tones, onPick }: BoltsProps) {
  const store = useTrainerStore();
  const { model, places } = bolts;
  const visible = useRef<InstancedMesh>(null);
  const hit = useRef<InstancedMesh>(null);
  const factor = useRef<number | null>(null);
  // Scratch objects made once for the per-frame matrix updates.
  const scratch = useMemo(() => ({ matrix: new Matrix4(), position: new Vector3(), color: new Color() }), []);
  const geometry = modelGeometry(model);
  const center = useMemo(() => modelCenter(model), [model]);
  // Models with coloured details keep their vertex colours; plain ones are tinted per instance.
  const vertexColors = model.shapes.some((s) => s.color !== undefined);

  const hitGeometry = useMemo(() => {
    const box = geometry.boundingBox!;
    const radius = Math.max(MIN_HIT_RADIUS, (Math.max(box.max.x - box.min.x, box.max.z - box.min.z) / 2) * 1.3);
    const shape = new CylinderGeometry(radius, radius, box.max.y - box.min.y, 12);
    shape.translate(0, (box.max.y + box.min.y) / 2, 0);
    return shape;
  }, [geometry]);
  useLayoutEffect(() => () => hitGeometry.dispose(), [hitGeometry]);

  const place = (f: number) => {
    for (const mesh of [visible.current, hit.current]) {
      if (!mesh) continue;
      places.forEach((bolt, i) => {
        scratch.position.copy(bolt.position).addScaledVector(bolt.explodeDirection, model.explodeDistance * f);
        mesh.setMatrixAt(i, matrixOf(bolt.turn, scratch.position, scratch.matrix));
      });
      mesh.instanceMatrix.needsUpdate = true;
      // Raycasting tests the cached bounding sphere first; it must follow the bolts.
      mesh.computeBoundingSphere();
    }
  };

  useLayoutEffect(() => {
    const mesh = visible.current;
    if (!mesh) return;
    tones.forEach((tone, i) => {
      scratch.color.set(tone === 'plain' && !vertexColors ? model.color : INSTANCE_COLOR[tone]);
      mesh.setColorAt(i, scratch.color);
    });
    if (mesh.instanceColor) mesh.instanceColor.needsUpdate = true;
  }, [tones, vertexColors, model.color, scratch]);

  useFrame((state, delta) => {
    const { stage, explode } = store.getState();
    const target = explodeFactor(stage, placed, explode);
    const current = factor.current;
    if (current === target) return;
    const next = current === null ? target : current + (target - current) * Math.min(1, delta * SETTLE_RATE);
    factor.current = Math.abs(next - target) < 1e-4 ? target : next;
    place(factor.current);
    state.invalidate();
  });

  // The grab cylinders are wider than the bolts and overlap on screen: the bolt whose centre lies
  // nearest the pointer's ray wins, not the first cylinder the ray meets.
  const keyOf = (e: ThreeEvent<PointerEvent | MouseEvent>) => {
    const shift = model.explodeDistance * (factor.current ?? 0);
    let best: string | undefined;
    let bestDistance = Infinity;
    for (const hitAt of e.intersections) {
      if (hitAt.object !== hit.current || hitAt.instanceId === undefined) continue;
      const bolt = places[hitAt.instanceId];
      if (!bolt) continue;
      scratch.position.copy(center).applyQuaternion(bolt.turn).add(bolt.position).addScaledVector(bolt.explodeDirection, shift);
      const distance = e.ray.distanceSqToPoint(scratch.position);
      if (distance < bestDistance) {
        bestDistance = distance;
        best = bolt.key;
      }
    }
    return best;
  };
  const onMove = (e: ThreeEvent<PointerEvent>) => {
    const key = keyOf(e);
    if (!key) return;
    e.stopPropagation();
    if (store.getState().hovered !== key) store.getState().setHovered(key);
  };
  const onOut = (e: ThreeEvent<PointerEvent>) => {
    const hovered = store.getState().hovered;
    if (!keyOf(e) && places.some((b) => b.key === hovered)) store.getState().setHovered(null);
  };
  const onClick = onPick
    ? (e: ThreeEvent<MouseEvent>) => {
        const key = keyOf(e);
        if (!key || !isClick(e)) return;
        e.stopPropagation();
        onPick(key);
      }
    : undefined;

  return (
    <>
      <instancedMesh ref={visible} args={[geometry, undefined, places.length]} name="bolts">
        <meshStandardMaterial vertexColors={vertexColors} roughness={0.45} metalness={0.3} />
      </instancedMesh>
      {/* Invisible, wider stand-in that takes the pointer, so a thin bolt is easy to hit. */}
      <instancedMesh
        ref={hit}
        args={[hitGeometry, undefined, places.length]}
        onPointerMove={onMove}
        onPointerOut={onOut}
        onClick={onClick}
      >
        <meshBasicMaterial visible={false} />
      </instancedMesh>
    </>
  );
}
