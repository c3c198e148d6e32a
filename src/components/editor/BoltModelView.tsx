import { Suspense, lazy, type ReactNode } from 'react';
import type { BoltScene } from '../../lib/editor/bolt-scene';
import { SceneBoundary } from '../SceneBoundary';

// Where a fastener group's 3D bolt picker goes in the editor. three.js loads only when a group has something
// to draw (the picker is its own chunk); until then, and without WebGL, a line of text says why.

const BoltScene = lazy(() => import('./scene/BoltScene'));

interface Props {
  index: number;
  groupName: string;
  scene: BoltScene;
  onToggle: (anchorKey: string, on: boolean) => void;
}

export function BoltModelView({ index, groupName, scene, onToggle }: Props) {
  if (!scene.ok) return <p className="text-sm text-steel-600">{scene.message}</p>;
  // Another part to draw (the group's first bolt went onto another part) is a different view: it opens afresh, framed on its holes.
  const host = scene.procedure.parts[0]!.key;
  return (
    <SceneBoundary fallback={<SceneNote>The 3D view could not start on this device. The list above does the same.</SceneNote>}>
      <Suspense fallback={<SceneNote>Loading the 3D view…</SceneNote>}>
        <BoltScene
          key={host}
          scene={scene}
          name={`group-${index + 1}`}
          label={`3D view of the threaded holes for ${groupName.trim() || `fastener group ${index + 1}`}`}
          onToggle={onToggle}
        />
      </Suspense>
    </SceneBoundary>
  );
}

function SceneNote({ children }: { children: ReactNode }) {
  // The canvas's height, so nothing jumps when it arrives.
  return <div className="flex h-[20rem] items-center justify-center rounded-xl border border-steel-200 bg-steel-100 p-6 text-center text-steel-700 sm:h-[24rem]">{children}</div>;
}
