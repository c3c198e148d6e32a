import { useRef, useState } from 'react';
import { useFrame, type ThreeEvent } from '@react-three/fiber';
import { Vector3, type Group } from 'three';
import type { PartModel } from '@models/types';
import { useTrainerStore } from '../context';
import { modelGeometry } from './geometry';
import { assembledOffset, explodeFactor } from './layout';
import { EMISSIVE, type Tone } from './tones';
import { spinOf } from './crank';
import { isClick } from './pointer';

/** Per-second rate of the move toward the target (exponential approach). */
const SETTLE_RATE = 9;
const EPSILON = 1e-5;

interface PartMeshProps {
  partKey: string;
  model: PartModel;
  /** Named by a placed step: goes home while the learner is ordering. */
  placed: boolean;
  tone: Tone;
  onPick?: () => void;
}

/** One assembled model, moved along its assembly axis by the explode amount and turned with the crank. */
export function PartMesh({ partKey, model, placed, tone, onPick }: PartMeshProps) {
  const store = useTrainerStore();
  const moving = useRef<Group>(null);
  const spinning = useRef<Group>(null);
  // Scratch vector made once: the frame loop mutates it instead of allocating.
  const [target] = useState(() => new Vector3());
  const placedOnce = useRef(false);
  const spin = spinOf(model.key);

  useFrame((state, delta) => {
    const group = moving.current;
    if (!group) return;
    const { stage, explode, drafts } = store.getState();
    assembledOffset(model, explodeFactor(stage, placed, explode), target);
    // The first frame shows the part where it belongs; later changes glide there.
    const alpha = placedOnce.current ? Math.min(1, delta * SETTLE_RATE) : 1;
    placedOnce.current = true;
    group.position.lerp(target, alpha);
    if (group.position.distanceToSquared(target) > EPSILON * EPSILON) state.invalidate();
    else group.position.copy(target);
    if (spin && spinning.current) spinning.current.rotation.y = -spin.ratio * drafts['final-check'].crankTurns * Math.PI * 2;
  });

  const setHovered = (key: string | null) => store.getState().setHovered(key);
  const onOver = (e: ThreeEvent<PointerEvent>) => {
    e.stopPropagation();
    setHovered(partKey);
  };
  const onOut = () => {
    if (store.getState().hovered === partKey) setHovered(null);
  };
  const onClick = onPick
    ? (e: ThreeEvent<MouseEvent>) => {
        if (!isClick(e)) return;
        e.stopPropagation();
        onPick();
      }
    : undefined;

  const glow = EMISSIVE[tone];
  const pivot = spin?.center ?? [0, 0, 0];
  return (
    <group ref={moving}>
      <group position={pivot}>
        <group ref={spinning}>
          <mesh
            geometry={modelGeometry(model)}
            position={[-pivot[0], -pivot[1], -pivot[2]]}
            onPointerOver={onOver}
            onPointerOut={onOut}
            onClick={onClick}
            name={partKey}
          >
            <meshStandardMaterial vertexColors roughness={0.55} metalness={0.15} emissive={glow.color} emissiveIntensity={glow.intensity} />
          </mesh>
        </group>
      </group>
    </group>
  );
}
