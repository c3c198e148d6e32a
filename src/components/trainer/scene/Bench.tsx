import type { ThreeEvent } from '@react-three/fiber';
import { useTrainerStore } from '../context';
import { modelGeometry } from './geometry';
import type { RowItem, SceneLayout } from './layout';
import { EMISSIVE, type Tone } from './tones';

interface BenchProps {
  slab: SceneLayout['benchSlab'];
  items: RowItem[];
  toneOf: (key: string) => Tone;
}

/** The bench strip under the tray, with the tools and consumables the procedure lists lying on it. */
export function Bench({ slab, items, toneOf }: BenchProps) {
  const store = useTrainerStore();
  return (
    <>
      {slab && (
        <mesh position={slab.center} quaternion={slab.turn}>
          <boxGeometry args={[slab.size.x, slab.size.y, slab.size.z]} />
          <meshStandardMaterial color="#6f8da2" roughness={0.9} />
        </mesh>
      )}
      {items.map((item) => {
        const glow = EMISSIVE[toneOf(item.part.key)];
        return (
          <mesh
            key={item.part.key}
            geometry={modelGeometry(item.model)}
            position={item.homes[0]}
            quaternion={item.turn}
            name={item.part.key}
            onPointerOver={(e: ThreeEvent<PointerEvent>) => {
              e.stopPropagation();
              store.getState().setHovered(item.part.key);
            }}
            onPointerOut={() => {
              if (store.getState().hovered === item.part.key) store.getState().setHovered(null);
            }}
          >
            <meshStandardMaterial vertexColors roughness={0.6} metalness={0.1} emissive={glow.color} emissiveIntensity={glow.intensity} />
          </mesh>
        );
      })}
    </>
  );
}
