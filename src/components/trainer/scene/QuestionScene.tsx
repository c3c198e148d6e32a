import { useEffect, useMemo, useState } from 'react';
import { useFrame, useThree } from '@react-three/fiber';
import { Box3, Vector3 } from 'three';
import type { PublicProcedure } from '~/lib/procedure/public-view';
import type { QuestionModel } from '~/lib/rework/questions';
import { TrainerContext, useTrainer, useTrainerStore } from '../context';
import { createTrainerStore, type TrainerStore } from '../store';
import { Bolts } from './Bolts';
import { Holes } from './Holes';
import { PartMesh } from './PartMesh';
import { anchorAxis, buildLayout, viewDirection, type HomeView, type SceneLayout } from './layout';
import { SceneApiHook } from './SceneApi';
import { SceneTag } from './SceneTag';
import { Viewport } from './Viewport';
import { anchorOffset, partFactors, scenePoint, type SceneView } from './points';
import { type Tone, type Verdict, toneFor } from './tones';
import { boltLabel, readableKey } from '../labels';

// The trainer's 3D view cut down to one rework question: the engine with the bolts or holes asked
// about, the bolts already tightened numbered in order, and the choices clickable. The list of choices
// beside it does the same, so this view is optional.

export interface QuestionSceneProps {
  procedure: PublicProcedure;
  model: QuestionModel;
  /** Keys the learner may pick here (the question's choices). */
  choices: string[];
  selected: string | null;
  /** After the answer: right choices 'good', a wrong pick 'bad'. */
  marks: Map<string, Verdict>;
  onPick: (key: string) => void;
}

/** A trainer store set up to show the question: assembled for bolts (they sit in their holes), exploded for holes (the cover is off). */
function questionStore(procedure: PublicProcedure, model: QuestionModel): TrainerStore {
  const store = createTrainerStore(procedure);
  store.setState(model.kind === 'bolts' ? { stage: 'pattern', explode: 0 } : { stage: 'pins', explode: 1 });
  return store;
}

/** The view the question's points need (stage, explode), as the store holds it. */
function viewOf(state: { stage: SceneView['stage']; explode: number }): SceneView {
  return { stage: state.stage, explode: state.explode, sequence: [], placements: [] };
}

/** The keys the question is about: the group's bolts, or every hole. */
function focusKeys(layout: SceneLayout, model: QuestionModel): string[] {
  return model.kind === 'bolts' ? (layout.bolts?.places.map((b) => b.key) ?? []) : layout.holes.map((h) => h.anchor.key);
}

/** A camera close on the bolts or holes asked about, from the side they are worked from. */
function focusView(procedure: PublicProcedure, layout: SceneLayout, state: { stage: SceneView['stage']; explode: number }, model: QuestionModel, fov = 38): HomeView {
  const points = focusKeys(layout, model)
    .map((key) => scenePoint(procedure, layout, viewOf(state), key))
    .filter((p): p is Vector3 => p !== null);
  const box = new Box3().setFromPoints(points);
  if (box.isEmpty()) box.copy(layout.bounds);
  const target = box.getCenter(new Vector3());
  // Room round the bolt circle or the holes for the part they are on.
  const radius = Math.max(box.getSize(new Vector3()).length() / 2, 0.03) * 1.6;
  const axis =
    model.kind === 'bolts' ? layout.bolts?.group.axis : model.focus ? anchorAxis(model.focus).toArray() : layout.holes[0]?.axis.toArray();
  const distance = radius / Math.sin(((fov / 2) * Math.PI) / 180);
  return { position: target.clone().addScaledVector(viewDirection(axis), distance), target, fov };
}

export default function QuestionScene(props: QuestionSceneProps) {
  const { procedure, model } = props;
  const [store] = useState(() => questionStore(procedure, model));
  const layout = useMemo(() => buildLayout(procedure), [procedure]);
  const home = useMemo(() => focusView(procedure, layout, store.getState(), model), [procedure, layout, store, model]);

  return (
    <TrainerContext value={store}>
      <Viewport
        home={home}
        testId="question-scene"
        sizeClass="h-[20rem] sm:h-[24rem]"
        label={`3D view of ${procedure.engine.name} for this question`}
        hint={model.kind === 'bolts' ? 'Click a bolt to choose it; numbers show the order so far.' : model.pickHoles ? 'Click a hole to choose it.' : 'The hole asked about is picked out in brass.'}
        onPointerMissed={() => store.getState().setHovered(null)}
      >
        <Drawn layout={layout} {...props} />
        <QuestionLabels layout={layout} {...props} />
        <SceneApiHook layout={layout} />
      </Viewport>
    </TrainerContext>
  );
}

function Drawn({ layout, model, choices, selected, marks, onPick }: QuestionSceneProps & { layout: SceneLayout }) {
  const store = useTrainerStore();
  const hovered = useTrainer((s) => s.hovered);
  const invalidate = useThree((s) => s.invalidate);
  useEffect(() => store.subscribe(() => invalidate()), [store, invalidate]);
  useEffect(() => invalidate(), [selected, marks, invalidate]);

  const pickable = new Set(choices);
  const done = model.kind === 'bolts' ? model.done : [];
  const extra = (key: string): Tone => (key === selected ? 'selected' : done.includes(key) ? 'tapped' : 'plain');
  const boltTones = layout.bolts?.places.map((b) => toneFor(b.key, marks, hovered, extra(b.key))) ?? [];
  const focus = model.kind === 'holes' ? model.focus : null;
  const holeTones = new Map<string, Tone>(
    layout.holes.map((h) => [h.anchor.key, toneFor(h.anchor.key, marks, hovered, h.anchor.key === focus ? 'selected' : extra(h.anchor.key))]),
  );
  const procedure = useTrainer((s) => s.procedure);
  const explode = useTrainer((s) => s.explode);
  const stage = useTrainer((s) => s.stage);
  // Holes move with the part they are on, as in the trainer.
  const offsets = useMemo(() => {
    const factors = partFactors(procedure, layout, { stage, explode, sequence: [], placements: [] });
    return new Map(layout.holes.map((h) => [h.anchor.key, anchorOffset(procedure, layout, factors, h.anchor.key)]));
  }, [procedure, layout, stage, explode]);
  const pick = (key: string) => {
    if (pickable.has(key)) onPick(key);
  };

  return (
    <>
      {layout.assembled.map(({ part, model: drawn }) => (
        <PartMesh key={part.key} partKey={part.key} model={drawn} placed={false} tone="plain" />
      ))}
      {layout.bolts && (
        <Bolts bolts={layout.bolts} placed={false} tones={boltTones} onPick={model.kind === 'bolts' ? pick : undefined} />
      )}
      {model.kind === 'holes' && (
        <Holes holes={layout.holes} offsets={offsets} tones={holeTones} onPick={(anchor) => model.pickHoles && pick(anchor.key)} />
      )}
    </>
  );
}

type TagKind = 'order' | 'choice' | 'selected' | 'focus' | 'good' | 'bad' | 'hover';

const TAG_STYLE: Record<TagKind, string> = {
  order: 'bg-brass-400 text-steel-950 rounded-full min-w-[1.4rem] text-center',
  choice: 'bg-white/90 text-steel-900 border border-steel-300',
  selected: 'bg-brass-500 text-steel-950',
  focus: 'bg-brass-500 text-steel-950',
  good: 'bg-go-600 text-white',
  bad: 'bg-signal-600 text-white',
  hover: 'bg-steel-900/90 text-white -translate-y-[140%]',
};

/**
 * Words on the model: the order the bolts already tightened went in (brass numbers), the name of each bolt
 * to choose from, the hole asked about, and after the answer ✓ on the right choices and ✗ on a wrong pick.
 * Hidden from screen readers: the question's text and list say all of it.
 */
function QuestionLabels({ layout, model, choices, selected, marks }: QuestionSceneProps & { layout: SceneLayout }) {
  const procedure = useTrainer((s) => s.procedure);
  const stage = useTrainer((s) => s.stage);
  const explode = useTrainer((s) => s.explode);
  const hovered = useTrainer((s) => s.hovered);
  // Tags are mounted after the first frame: mounted in the same commit as the canvas, drei's Html
  // wrappers showed up empty until something re-rendered them.
  const [drawn, setDrawn] = useState(false);
  useFrame(() => {
    if (!drawn) setDrawn(true);
  });
  const name = (key: string) => (model.kind === 'bolts' ? boltLabel(key) : readableKey(key));

  const tags: { id: string; kind: TagKind; text: string; at: Vector3 }[] = [];
  const add = (key: string, kind: TagKind, text: string) => {
    const at = scenePoint(procedure, layout, { stage, explode, sequence: [], placements: [] }, key);
    if (at) tags.push({ id: `${kind}:${key}`, kind, text, at });
  };
  if (model.kind === 'bolts') model.done.forEach((key, i) => add(key, 'order', String(i + 1)));
  if (model.kind === 'holes' && model.focus) add(model.focus, 'focus', `? ${name(model.focus)}`);
  for (const key of choices) {
    const mark = marks.get(key);
    if (mark) add(key, mark, `${mark === 'good' ? '✓' : '✗'} ${name(key)}`);
    else if (key === selected) add(key, 'selected', name(key));
    // Every bolt to choose from is named; holes only when hovered or picked (there can be many).
    else if (model.kind === 'bolts') add(key, 'choice', name(key));
  }
  if (hovered && (choices.includes(hovered) || hovered === (model.kind === 'holes' ? model.focus : null))) add(hovered, 'hover', name(hovered));

  if (!drawn) return null;
  return (
    <>
      {tags.map((tag) => (
        <SceneTag key={tag.id} at={tag.at} kind={tag.kind} tone={TAG_STYLE[tag.kind]} zIndex={tag.kind === 'hover' ? 40 : 20}>
          {tag.text}
        </SceneTag>
      ))}
    </>
  );
}
