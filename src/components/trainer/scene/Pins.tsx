import type { ThreeEvent } from '@react-three/fiber';
import type { Quaternion, Vector3 } from 'three';
import type { PartModel } from '@models/types';
import { useTrainerStore } from '../context';
import { modelGeometry } from './geometry';
import type { RowItem } from './layout';
import { EMISSIVE, type Tone } from './tones';
import { isClick } from './pointer';

export interface Seat {
  position: Vector3;
  turn: Quaternion;
}

interface PinsProps {
  items: RowItem[];
  /** How many copies of each pin part are still in the tray. */
  inTray: Map<string, number>;
  placements: readonly { part: string; anchor: string }[];
  /** Where a pin sits when it is in a hole, by anchor key. */
  seats: Map<string, Seat>;
  toneOf: (key: string, part: string) => Tone;
  onPickTray?: (part: string) => void;
  onPickPlaced?: (anchor: string) => void;
}

/** Dowel pins and sleeves: the copies left in the tray, and the ones the learner put in holes. */
export function Pins({ items, inTray, placements, seats, toneOf, onPickTray, onPickPlaced }: PinsProps) {
  const models = new Map(items.map((item) => [item.part.key, item.model]));
  return (
    <>
      {items.flatMap((item) =>
        item.homes.slice(0, inTray.get(item.part.key) ?? 0).map((home, i) => (
          <PinMesh
            key={`${item.part.key}:${i}`}
            model={item.model}
            hoverKey={item.part.key}
            position={home}
            tone={toneOf(item.part.key, item.part.key)}
            onPick={onPickTray && (() => onPickTray(item.part.key))}
          />
        )),
      )}
      {placements.map(({ part, anchor }) => {
        const model = models.get(part);
        const seat = seats.get(anchor);
        if (!model || !seat) return null;
        return (
          <PinMesh
            key={`seat:${anchor}`}
            model={model}
            hoverKey={anchor}
            position={seat.position}
            quaternion={seat.turn}
            tone={toneOf(anchor, part)}
            onPick={onPickPlaced && (() => onPickPlaced(anchor))}
          />
        );
      })}
    </>
  );
}

interface PinMeshProps {
  model: PartModel;
  hoverKey: string;
  position: Vector3;
  quaternion?: Quaternion;
  tone: Tone;
  onPick?: (() => void) | undefined;
}

function PinMesh({ model, hoverKey, position, quaternion, tone, onPick }: PinMeshProps) {
  const store = useTrainerStore();
  const glow = EMISSIVE[tone];
  return (
    <mesh
      geometry={modelGeometry(model)}
      position={position}
      quaternion={quaternion}
      name={hoverKey}
      onPointerOver={(e: ThreeEvent<PointerEvent>) => {
        e.stopPropagation();
        store.getState().setHovered(hoverKey);
      }}
      onPointerOut={() => {
        if (store.getState().hovered === hoverKey) store.getState().setHovered(null);
      }}
      onClick={
        onPick &&
        ((e: ThreeEvent<MouseEvent>) => {
          if (!isClick(e)) return;
          e.stopPropagation();
          onPick();
        })
      }
    >
      <meshStandardMaterial vertexColors roughness={0.4} metalness={0.3} emissive={glow.color} emissiveIntensity={glow.intensity} />
    </mesh>
  );
}
