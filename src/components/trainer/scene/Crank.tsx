import { useEffect, useMemo, useRef, useState } from 'react';
import { useThree, type ThreeEvent } from '@react-three/fiber';
import { Html, useCursor } from '@react-three/drei';
import { CylinderGeometry, Vector3 } from 'three';
import type { PartModel } from '@models/types';
import { useTrainer, useTrainerStore } from '../context';
import { modelGeometry } from './geometry';
import { BINDING_MESSAGE, BIND_AT_TURNS, PIXELS_PER_TURN, allowedCrankDelta, crankBinds } from './crank';

interface CrankHandle {
  partKey: string;
  model: PartModel;
  /** Where the part sits now (its explode offset). */
  offset: Vector3;
}

/**
 * Final check: dragging sideways on the crankshaft or flywheel turns the crank (store.addCrankTurn).
 * When the server did not pass the assembly order, the crank stops after a quarter turn and says why.
 */
export function Crank({ handles }: { handles: CrankHandle[] }) {
  const store = useTrainerStore();
  const controls = useThree((s) => s.controls) as unknown as { enabled: boolean } | null;
  const [over, setOver] = useState(false);
  const [dragging, setDragging] = useState(false);
  useCursor(over || dragging, dragging ? 'grabbing' : 'grab', 'auto');
  const stop = useRef<(() => void) | null>(null);
  useEffect(() => () => stop.current?.(), []);

  const turns = useTrainer((s) => s.drafts['final-check'].crankTurns);
  const binds = useTrainer((s) => crankBinds(s.results));
  const stuck = binds && turns >= BIND_AT_TURNS - 1e-6;

  const onPointerDown = (e: ThreeEvent<PointerEvent>) => {
    e.stopPropagation();
    stop.current?.();
    let lastX = e.nativeEvent.clientX;
    let warned = false;
    if (controls) controls.enabled = false;
    setDragging(true);
    const move = (ev: PointerEvent) => {
      const requested = (ev.clientX - lastX) / PIXELS_PER_TURN;
      lastX = ev.clientX;
      const state = store.getState();
      const bound = crankBinds(state.results);
      const allowed = allowedCrankDelta(state.drafts['final-check'].crankTurns, requested, bound);
      if (allowed !== 0) state.addCrankTurn(allowed);
      if (bound && requested > 0 && allowed < requested && !warned) {
        warned = true;
        state.announce(BINDING_MESSAGE);
      }
    };
    const end = () => {
      window.removeEventListener('pointermove', move);
      window.removeEventListener('pointerup', end);
      window.removeEventListener('pointercancel', end);
      if (controls) controls.enabled = true;
      setDragging(false);
      stop.current = null;
    };
    window.addEventListener('pointermove', move);
    window.addEventListener('pointerup', end);
    window.addEventListener('pointercancel', end);
    stop.current = end;
  };

  const top = handles[0];
  const hintAt = useMemo(() => {
    if (!top) return null;
    const box = modelGeometry(top.model).boundingBox!;
    return new Vector3((box.min.x + box.max.x) / 2, box.max.y + 0.02, (box.min.z + box.max.z) / 2).add(top.offset);
  }, [top]);

  return (
    <>
      {handles.map((handle) => (
        <Handle key={handle.partKey} handle={handle} onPointerDown={onPointerDown} onOver={setOver} />
      ))}
      {hintAt && (
        <Html position={hintAt} center zIndexRange={[30, 0]} style={{ pointerEvents: 'none' }}>
          <div
            aria-hidden="true"
            className={`whitespace-nowrap rounded-md px-2 py-1 text-xs font-semibold shadow ${
              stuck ? 'bg-signal-600 text-white' : 'bg-steel-900/85 text-white'
            }`}
            data-testid="crank-hint"
          >
            {stuck ? '⚠ Binding: a missed step stops the crank' : `⟲ Drag sideways to turn · ${turns.toFixed(2)} turns`}
          </div>
        </Html>
      )}
    </>
  );
}

/** An invisible cylinder round the part, wider than the shaft so it is easy to grab. */
function Handle({
  handle,
  onPointerDown,
  onOver,
}: {
  handle: CrankHandle;
  onPointerDown: (e: ThreeEvent<PointerEvent>) => void;
  onOver: (over: boolean) => void;
}) {
  const geometry = useMemo(() => {
    const box = modelGeometry(handle.model).boundingBox!;
    const radius = Math.max(box.max.x - box.min.x, box.max.z - box.min.z) / 2 + 0.01;
    const shape = new CylinderGeometry(radius, radius, box.max.y - box.min.y, 24);
    // The crank turns about the vertical axis through the engine's origin.
    shape.translate(0, (box.min.y + box.max.y) / 2, 0);
    return shape;
  }, [handle.model]);
  useEffect(() => () => geometry.dispose(), [geometry]);
  return (
    <mesh
      geometry={geometry}
      position={handle.offset}
      name={`crank-handle:${handle.partKey}`}
      onPointerDown={onPointerDown}
      onPointerOver={() => onOver(true)}
      onPointerOut={() => onOver(false)}
    >
      <meshBasicMaterial visible={false} />
    </mesh>
  );
}
