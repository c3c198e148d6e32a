import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useThree } from '@react-three/fiber';
import { useCursor } from '@react-three/drei';
import { Vector3 } from 'three';
import { useTrainer, useTrainerStore } from '../context';
import { Bench } from './Bench';
import { Bolts } from './Bolts';
import { CRANK_HANDLES } from './crank';
import { Crank } from './Crank';
import { Holes } from './Holes';
import { Labels } from './Labels';
import { type SceneLayout, assembledOffset, placedParts, trayCopies } from './layout';
import { PartMesh } from './PartMesh';
import { Pins, type Seat } from './Pins';
import { StepChooser, unplacedStepsFor } from './StepChooser';
import { anchorOffset, partFactors } from './points';
import { type Tone, type Verdict, toneFor, verdicts } from './tones';

/** Re-draws on every store change: the canvas only renders on demand. */
function InvalidateOnChange() {
  const store = useTrainerStore();
  const invalidate = useThree((s) => s.invalidate);
  useEffect(() => store.subscribe(() => invalidate()), [store, invalidate]);
  return null;
}

/**
 * Everything drawn for the procedure, and what a pointer does in each stage: Order picks a part and places its steps,
 * Pins takes a pin from the tray to a hole, Pattern taps bolts, Final check turns the crank.
 */
export function Assembly({ layout }: { layout: SceneLayout }) {
  const store = useTrainerStore();
  const procedure = useTrainer((s) => s.procedure);
  const stage = useTrainer((s) => s.stage);
  const explode = useTrainer((s) => s.explode);
  const sequence = useTrainer((s) => s.drafts.order.sequence);
  const placements = useTrainer((s) => s.drafts.pins.placements);
  const pattern = useTrainer((s) => s.drafts.pattern);
  const selectedPin = useTrainer((s) => s.selectedPin);
  const hovered = useTrainer((s) => s.hovered);
  const result = useTrainer((s) => s.results[s.stage]);
  const actions = store.getState();

  // Order: the part whose step chooser is open, and where it was clicked; `id` reopens it fresh on each click.
  const [chooser, setChooser] = useState<{ part: string; at: string; id: number } | null>(null);
  const opened = useRef(0);
  const closeChooser = useCallback(() => setChooser(null), []);
  useEffect(() => setChooser(null), [stage]);

  /** A part clicked while ordering: one step left on it is placed at once; several are offered to choose from. */
  const pickPart = (part: string, at: string = part) => {
    const state = store.getState();
    state.setHovered(at);
    const open = unplacedStepsFor(state.procedure, state.drafts.order.sequence, part);
    if (open.length === 1) {
      state.placeStep(open[0]!.key);
      setChooser(null);
    } else {
      opened.current += 1;
      setChooser({ part, at, id: opened.current });
    }
  };
  const placeChosen = (stepKey: string) => {
    store.getState().placeStep(stepKey);
    setChooser(null);
  };

  const placed = useMemo(() => placedParts(procedure, sequence), [procedure, sequence]);
  const marks = useMemo(() => verdicts(procedure, result), [procedure, result]);
  // Whole parts only glow red: a ✓ on a part would come without a label, and colour alone is not enough.
  const badOnly = useMemo(() => new Map([...marks].filter(([, v]) => v === 'bad')) as Map<string, Verdict>, [marks]);
  const factors = useMemo(
    () => partFactors(procedure, layout, { stage, explode, sequence, placements }),
    [procedure, layout, stage, explode, sequence, placements],
  );

  const holeOffsets = useMemo(() => {
    const offsets = new Map<string, Vector3>();
    for (const hole of layout.holes) offsets.set(hole.anchor.key, anchorOffset(procedure, layout, factors, hole.anchor.key));
    return offsets;
  }, [procedure, layout, factors]);

  const seats = useMemo(() => {
    const out = new Map<string, Seat>();
    for (const hole of layout.holes) {
      const position = new Vector3(...hole.anchor.position).add(holeOffsets.get(hole.anchor.key)!);
      out.set(hole.anchor.key, { position, turn: hole.turn });
    }
    return out;
  }, [layout, holeOffsets]);

  const inTray = useMemo(
    () => new Map(layout.pins.map((item) => [item.part.key, trayCopies(item.part, placements)])),
    [layout, placements],
  );

  const activeSequence = pattern.passes[pattern.activePass]?.sequence ?? [];
  const boltTones = useMemo(
    () => layout.bolts?.places.map((b) => toneFor(b.key, marks, hovered, activeSequence.includes(b.key) && stage === 'pattern' ? 'tapped' : 'plain')) ?? [],
    [layout, marks, hovered, activeSequence, stage],
  );
  const holeTones = useMemo(
    () => new Map<string, Tone>(layout.holes.map((h) => [h.anchor.key, toneFor(h.anchor.key, marks, hovered)])),
    [layout, marks, hovered],
  );

  // The fastener drawn as a whole part (a nut, a plug) takes the taps itself.
  const fastener = layout.assembledFastener;
  const tapFastener = () => {
    if (!fastener) return;
    const next = fastener.group.bolts.find((b) => !activeSequence.includes(b.key)) ?? fastener.group.bolts[0];
    if (next) actions.tapBolt(next.key);
  };

  const interactive =
    hovered !== null &&
    ((stage === 'order' &&
      (layout.assembled.some((d) => d.part.key === hovered) || inTray.has(hovered) || layout.bolts?.places.some((b) => b.key === hovered))) ||
      (stage === 'pins' && (inTray.has(hovered) || seats.has(hovered))) ||
      (stage === 'pattern' && (layout.bolts?.places.some((b) => b.key === hovered) || hovered === fastener?.part)));
  useCursor(interactive);

  const crankHandles = layout.assembled
    .filter((d) => CRANK_HANDLES.includes(d.model.key))
    .map((d) => ({ partKey: d.part.key, model: d.model, offset: assembledOffset(d.model, factors.get(d.part.key) ?? 0) }));

  const pickHole = (anchorKey: string) => {
    const state = store.getState();
    if (state.selectedPin) state.placePin(anchorKey);
    else if (state.drafts.pins.placements.some((p) => p.anchor === anchorKey)) state.removePin(anchorKey);
    else state.announce('Pick a pin or sleeve from the tray first, then choose a hole.');
  };

  return (
    <>
      <InvalidateOnChange />
      {layout.assembled.map(({ part, model }) => {
        const tapped = stage === 'pattern' && fastener?.part === part.key && activeSequence.length > 0;
        return (
          <PartMesh
            key={part.key}
            partKey={part.key}
            model={model}
            placed={placed.has(part.key)}
            tone={toneFor(part.key, badOnly, hovered, tapped ? 'tapped' : 'plain')}
            onPick={
              stage === 'order'
                ? () => pickPart(part.key)
                : stage === 'pattern' && fastener?.part === part.key
                  ? tapFastener
                  : undefined
            }
          />
        );
      })}
      {layout.bolts && (
        <Bolts
          bolts={layout.bolts}
          placed={placed.has(layout.bolts.group.part)}
          tones={badOnly.has(layout.bolts.group.part) ? boltTones.map((): Tone => 'bad') : boltTones}
          onPick={
            stage === 'pattern'
              ? (key) => actions.tapBolt(key)
              : stage === 'order'
                ? (key) => pickPart(layout.bolts!.group.part, key)
                : undefined
          }
        />
      )}
      {stage === 'pins' && (
        <Holes holes={layout.holes} offsets={holeOffsets} tones={holeTones} onPick={(anchor) => pickHole(anchor.key)} />
      )}
      <Pins
        items={layout.pins}
        inTray={inTray}
        placements={placements}
        seats={seats}
        toneOf={(key, part) =>
          // In the tray the key is the part (a decoy gets its ✗ here); in a hole it is the hole.
          key === part ? toneFor(key, badOnly, hovered, selectedPin === part ? 'selected' : 'plain') : toneFor(key, marks, hovered)
        }
        onPickTray={
          stage === 'pins'
            ? (part) => actions.selectPin(store.getState().selectedPin === part ? null : part)
            : stage === 'order'
              ? (part) => pickPart(part)
              : undefined
        }
        onPickPlaced={stage === 'pins' ? pickHole : undefined}
      />
      <Bench slab={layout.benchSlab} items={layout.bench} toneOf={(key) => toneFor(key, badOnly, hovered)} />
      {stage === 'final-check' && crankHandles.length > 0 && <Crank handles={crankHandles} />}
      <Labels layout={layout} marks={marks} />
      {stage === 'order' && chooser && (
        <StepChooser key={chooser.id} layout={layout} part={chooser.part} at={chooser.at} onPlace={placeChosen} onClose={closeChooser} />
      )}
    </>
  );
}
