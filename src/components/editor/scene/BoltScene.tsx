import { useEffect, useMemo, useState } from 'react';
import { useFrame, useThree } from '@react-three/fiber';
import { Box3, Vector3 } from 'three';
import type { BoltSceneView } from '~/lib/editor/bolt-scene';
import type { PublicProcedure } from '~/lib/procedure/public-view';
import { TrainerContext, useTrainer, useTrainerStore } from '../../trainer/context';
import { boltLabel, readableKey } from '../../trainer/labels';
import { Bolts } from '../../trainer/scene/Bolts';
import { Holes } from '../../trainer/scene/Holes';
import { PartMesh } from '../../trainer/scene/PartMesh';
import { buildLayout, viewDirection, type HomeView, type SceneLayout } from '../../trainer/scene/layout';
import { anchorOffset, partFactors, scenePoint, type SceneView } from '../../trainer/scene/points';
import { SceneApiHook } from '../../trainer/scene/SceneApi';
import { SceneTag } from '../../trainer/scene/SceneTag';
import { toneFor, type Tone, type Verdict } from '../../trainer/scene/tones';
import { Viewport } from '../../trainer/scene/Viewport';
import { createTrainerStore, type TrainerStore } from '../../trainer/store';

// The editor's 3D bolt picker for one fastener group, drawn with the trainer's scene pieces: the part the
// group's holes are on, a marker on every threaded hole of it, the group's bolts in their holes numbered in
// the preview's accepted sequence. A click on a hole adds a bolt, a click on a bolt takes it out, through the same form
// change the list makes; the list stays the full way to do it, so this view is optional.

export interface BoltSceneProps {
  scene: BoltSceneView;
  /** Names the view among the page's 3D views (the end-to-end tests' `window.__bwScenes`). */
  name: string;
  label: string;
  /** The list's own change: a bolt in (true) or out of (false) the hole. */
  onToggle: (anchorKey: string, on: boolean) => void;
}

/** Assembled, as the Pattern stage shows it: bolts home in their holes. */
const VIEW: SceneView = { stage: 'pattern', explode: 0, sequence: [], placements: [] };
/** How far the camera leans from the face's edge toward the side bolts go in from: near square, so holes are easy to hit. */
const LEAN = (58 * Math.PI) / 180;
const NO_MARKS = new Map<string, Verdict>();

function pickerStore(procedure: PublicProcedure): TrainerStore {
  const store = createTrainerStore(procedure);
  store.setState({ stage: VIEW.stage, explode: VIEW.explode });
  return store;
}

/** A camera on the focused holes, from the side their bolts go in from. */
function pickerView(scene: BoltSceneView, layout: SceneLayout, fov = 38): HomeView {
  const points = scene.focus.map((key) => scenePoint(scene.procedure, layout, VIEW, key)).filter((p): p is Vector3 => p !== null);
  const box = new Box3().setFromPoints(points);
  if (box.isEmpty()) box.copy(layout.bounds);
  const target = box.getCenter(new Vector3());
  // Close enough that a hole marker is a fair target (the part round the holes may run off the edge), and far
  // enough from a lone hole (a spark plug's) to see the part it is in.
  const radius = Math.max(box.getSize(new Vector3()).length() / 2, 0.07);
  const distance = radius / Math.sin(((fov / 2) * Math.PI) / 180);
  return { position: target.clone().addScaledVector(viewDirection(scene.focusAxis, LEAN), distance), target, fov };
}

export default function BoltScene({ scene, name, label, onToggle }: BoltSceneProps) {
  const { procedure } = scene;
  const [store] = useState(() => pickerStore(procedure));
  const layout = useMemo(() => buildLayout(procedure), [procedure]);
  // Framed as the view opens; the camera stays put while bolts are picked.
  const [home] = useState(() => pickerView(scene, layout));
  // The test hook reads the procedure from the store.
  useEffect(() => store.setState({ procedure }), [store, procedure]);

  return (
    <TrainerContext value={store}>
      <Viewport
        home={home}
        testId={`bolt-scene-${name}`}
        sizeClass="h-[20rem] sm:h-[24rem]"
        label={label}
        fallback={<p className="p-4 text-sm">The 3D view needs WebGL. The list above and the bolt map below do the same.</p>}
        hint={
          <>
            Click a threaded hole to put a bolt in it, or a bolt to take it out; the numbers are the preview&apos;s tightening order. The list
            above does the same.
            {scene.otherParts.length > 0 && ` Holes on ${scene.otherParts.join(', ')} are in the list.`}
            {scene.notDrawn > 0 && ` ${scene.notDrawn === 1 ? 'One bolt is' : `${scene.notDrawn} bolts are`} not drawn here: see the list.`}
          </>
        }
        onPointerMissed={() => store.getState().setHovered(null)}
      >
        <Picker layout={layout} scene={scene} onToggle={onToggle} />
        <PickerLabels layout={layout} scene={scene} />
        <SceneApiHook layout={layout} name={name} />
      </Viewport>
    </TrainerContext>
  );
}

interface DrawnProps {
  layout: SceneLayout;
  scene: BoltSceneView;
}

function Picker({ layout, scene, onToggle }: DrawnProps & Pick<BoltSceneProps, 'onToggle'>) {
  const store = useTrainerStore();
  const hovered = useTrainer((s) => s.hovered);
  const invalidate = useThree((s) => s.invalidate);
  useEffect(() => store.subscribe(() => invalidate()), [store, invalidate]);
  useEffect(() => invalidate(), [layout, invalidate]);

  const { procedure } = scene;
  const bolts = procedure.fastenerGroups[0]!.bolts;
  const chosen = new Set(bolts.map((b) => b.anchor));
  const offsets = useMemo(() => {
    const factors = partFactors(procedure, layout, VIEW);
    return new Map(layout.holes.map((h) => [h.anchor.key, anchorOffset(procedure, layout, factors, h.anchor.key)]));
  }, [procedure, layout]);
  const holeTones = new Map<string, Tone>(
    layout.holes.map((h) => [h.anchor.key, toneFor(h.anchor.key, NO_MARKS, hovered, chosen.has(h.anchor.key) ? 'selected' : 'plain')]),
  );
  const places = layout.bolts?.places ?? [];
  const boltTones = places.map((b) => toneFor(b.key, NO_MARKS, hovered));
  // Bolts on other holes are a new instanced mesh: keyed so it mounts afresh and places every bolt on its first frame.
  const boltsKey = places.map((b) => `${b.key}@${b.anchor}`).join(',');

  return (
    <>
      {layout.assembled.map(({ part, model }) => (
        <PartMesh key={part.key} partKey={part.key} model={model} placed={false} tone="plain" />
      ))}
      {layout.bolts && places.length > 0 && (
        <Bolts
          key={boltsKey}
          bolts={layout.bolts}
          placed={false}
          tones={boltTones}
          onPick={(key) => {
            const anchor = places.find((b) => b.key === key)?.anchor;
            if (anchor) onToggle(anchor, false);
          }}
        />
      )}
      <Holes holes={layout.holes} offsets={offsets} tones={holeTones} onPick={(anchor) => onToggle(anchor.key, !chosen.has(anchor.key))} />
    </>
  );
}

const TAG_STYLE = {
  // Up and to the right of the bolt, so the bolt head stays in sight under its number.
  order: 'bg-brass-400 text-steel-950 rounded-full min-w-[1.4rem] text-center translate-x-[70%] -translate-y-[80%] ring-1 ring-steel-900/40',
  hover: 'bg-steel-900/90 text-white -translate-y-[140%]',
} as const;

/**
 * Words on the model: each bolt's number in the accepted sequence (on the bolt, or on its hole when the group
 * has no bolt model yet), and what a click on the thing under the pointer does. Hidden from screen readers:
 * the list and the bolt map say all of it.
 */
function PickerLabels({ layout, scene }: DrawnProps) {
  const hovered = useTrainer((s) => s.hovered);
  // Mounted after the first frame, as in the trainer: drei's Html mounted with the canvas showed up empty.
  const [drawn, setDrawn] = useState(false);
  useFrame(() => {
    if (!drawn) setDrawn(true);
  });
  if (!drawn) return null;

  const { procedure, order } = scene;
  const bolts = procedure.fastenerGroups[0]!.bolts;
  const at = (key: string) => scenePoint(procedure, layout, VIEW, key);
  const tags: { id: string; kind: keyof typeof TAG_STYLE; text: string; at: Vector3; bolt?: string }[] = [];
  for (const bolt of bolts) {
    const place = order[bolt.key];
    const point = layout.bolts ? at(bolt.key) : at(bolt.anchor);
    if (place !== undefined && point) tags.push({ id: `order:${bolt.key}`, kind: 'order', text: String(place), at: point, bolt: bolt.key });
  }
  if (hovered) {
    const bolt = bolts.find((b) => b.key === hovered || b.anchor === hovered);
    const part = procedure.parts.find((p) => p.key === hovered);
    const text = bolt
      ? `${boltLabel(bolt.key)}: click to take it out`
      : scene.holes.includes(hovered)
        ? `${readableKey(hovered)}: click to put a bolt in`
        : part?.name;
    const point = at(hovered);
    if (text && point) tags.push({ id: `hover:${hovered}`, kind: 'hover', text, at: point });
  }

  // Kept under the editor's sticky bar (z-20) when the page scrolls the view beneath it.
  return (
    <>
      {tags.map((tag) => (
        <SceneTag key={tag.id} at={tag.at} kind={tag.kind} tone={TAG_STYLE[tag.kind]} zIndex={tag.kind === 'hover' ? 15 : 10} bolt={tag.bolt}>
          {tag.text}
        </SceneTag>
      ))}
    </>
  );
}
