import { useLayoutEffect, useMemo, useRef } from 'react';
import type { ThreeEvent } from '@react-three/fiber';
import { Color, Matrix4, Vector3, type InstancedMesh } from 'three';
import type { PublicAnchor } from '~/lib/procedure/public-view';
import { useTrainerStore } from '../context';
import { modelGeometry } from './geometry';
import type { HolePlace } from './layout';
import { LOCATING_MARKER, THREADED_MARKER, markerRadius } from './markers';
import { INSTANCE_COLOR, type Tone } from './tones';
import { isClick } from './pointer';

/** Markers sit this far out of the face so they never flicker against it (metres). */
const LIFT = 0.0006;

const BASE: Record<'locating-hole' | 'threaded-hole', string> = {
  'locating-hole': '#e7bc55',
  'threaded-hole': '#c5d3dc',
};

interface HolesProps {
  holes: HolePlace[];
  /** Offset of each hole's part from home (a hole moves with an exploded cover), by anchor key. */
  offsets: Map<string, Vector3>;
  tones: Map<string, Tone>;
  onPick: (anchor: PublicAnchor) => void;
}

/** Clickable markers on the locating and threaded holes: one instanced mesh per kind. */
export function Holes({ holes, offsets, tones, onPick }: HolesProps) {
  const locating = holes.filter((h) => h.anchor.kind === 'locating-hole');
  const threaded = holes.filter((h) => h.anchor.kind === 'threaded-hole');
  return (
    <>
      {locating.length > 0 && <HoleSet holes={locating} kind="locating-hole" offsets={offsets} tones={tones} onPick={onPick} />}
      {threaded.length > 0 && <HoleSet holes={threaded} kind="threaded-hole" offsets={offsets} tones={tones} onPick={onPick} />}
    </>
  );
}

function HoleSet({ holes, kind, offsets, tones, onPick }: HolesProps & { kind: 'locating-hole' | 'threaded-hole' }) {
  const store = useTrainerStore();
  const mesh = useRef<InstancedMesh>(null);
  const geometry = modelGeometry(kind === 'locating-hole' ? LOCATING_MARKER : THREADED_MARKER);
  const scratch = useMemo(() => ({ matrix: new Matrix4(), position: new Vector3(), scale: new Vector3(), color: new Color() }), []);

  useLayoutEffect(() => {
    const m = mesh.current;
    if (!m) return;
    holes.forEach((hole, i) => {
      const r = markerRadius(hole.anchor.sizeMm);
      scratch.position.set(...hole.anchor.position).addScaledVector(hole.axis, -LIFT);
      const offset = offsets.get(hole.anchor.key);
      if (offset) scratch.position.add(offset);
      m.setMatrixAt(i, scratch.matrix.compose(scratch.position, hole.turn, scratch.scale.set(r, 1, r)));
      const tone = tones.get(hole.anchor.key) ?? 'plain';
      m.setColorAt(i, scratch.color.set(tone === 'plain' ? BASE[kind] : INSTANCE_COLOR[tone]));
    });
    m.instanceMatrix.needsUpdate = true;
    if (m.instanceColor) m.instanceColor.needsUpdate = true;
    m.computeBoundingSphere();
  }, [holes, offsets, tones, kind, scratch]);

  const anchorOf = (e: ThreeEvent<PointerEvent | MouseEvent>) => (e.instanceId === undefined ? undefined : holes[e.instanceId]?.anchor);
  return (
    <instancedMesh
      ref={mesh}
      args={[geometry, undefined, holes.length]}
      name={kind}
      onPointerOver={(e) => {
        const anchor = anchorOf(e);
        if (!anchor) return;
        e.stopPropagation();
        store.getState().setHovered(anchor.key);
      }}
      onPointerOut={(e) => {
        const anchor = anchorOf(e);
        if (anchor && store.getState().hovered === anchor.key) store.getState().setHovered(null);
      }}
      onClick={(e) => {
        const anchor = anchorOf(e);
        if (!anchor || !isClick(e)) return;
        e.stopPropagation();
        onPick(anchor);
      }}
    >
      <meshStandardMaterial vertexColors roughness={0.5} metalness={0.1} polygonOffset polygonOffsetFactor={-2} />
    </instancedMesh>
  );
}
