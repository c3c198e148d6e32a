import { useMemo } from 'react';
import type { Vector3 } from 'three';
import type { PublicProcedure } from '~/lib/procedure/public-view';
import { boltLabel, holeLabel, pinSize, readableKey } from '../labels';
import { useTrainer } from '../context';
import type { SceneLayout } from './layout';
import { type SceneView, scenePoint } from './points';
import { SceneTag } from './SceneTag';
import type { Verdict } from './tones';

// Words floating in the scene: the name of what is hovered or focused, ✗ / ✓ on what the server
// judged, and the tapping order on the bolts. DOM overlays, so they cost no draw calls; the panel
// beside the canvas says the same for screen readers, so these are hidden from them.

type LabelKind = 'hover' | 'bad' | 'good' | 'number';

interface Label {
  id: string;
  kind: LabelKind;
  text: string;
  at: Vector3;
}

/** Full name of a bolt, hole or part, as a learner reads it. */
export function describeKey(procedure: PublicProcedure, key: string, placements: readonly { part: string; anchor: string }[]): string {
  for (const group of procedure.fastenerGroups) {
    if (group.bolts.some((b) => b.key === key)) {
      const part = procedure.parts.find((p) => p.key === group.part);
      return part ? `${boltLabel(key)} · ${part.name}` : boltLabel(key);
    }
  }
  const anchor = procedure.anchors.find((a) => a.key === key);
  if (anchor) {
    const pin = placements.find((p) => p.anchor === key);
    const held = pin && procedure.parts.find((p) => p.key === pin.part);
    return held ? `${holeLabel(anchor)} · holds ${held.name}` : holeLabel(anchor);
  }
  const part = procedure.parts.find((p) => p.key === key);
  if (part) return pinSize(part) ? `${part.name} · ${pinSize(part)}` : part.name;
  return readableKey(key);
}

/** Short name for a ✗ / ✓ tag. */
function shortName(procedure: PublicProcedure, key: string): string {
  if (procedure.fastenerGroups.some((g) => g.bolts.some((b) => b.key === key))) return boltLabel(key);
  if (procedure.anchors.some((a) => a.key === key)) return readableKey(key);
  return procedure.parts.find((p) => p.key === key)?.name ?? readableKey(key);
}

/** Two tags of one kind on one spot (a wrong pin in a wrong hole) become one tag, so neither hides the other. */
function mergeSameSpot(labels: Label[]): Label[] {
  const out: Label[] = [];
  for (const label of labels) {
    const twin = out.find((o) => o.kind === label.kind && o.kind !== 'number' && o.at.distanceTo(label.at) < 0.002);
    if (twin) twin.text = `${twin.text} · ${label.text.replace(/^[✗✓] (Fix: )?/, '')}`;
    else out.push({ ...label });
  }
  return out;
}

const STYLE: Record<LabelKind, string> = {
  hover: 'bg-steel-900/90 text-white -translate-y-[140%]',
  bad: 'bg-signal-600 text-white translate-y-[70%]',
  good: 'bg-go-600 text-white translate-y-[70%]',
  number: 'bg-brass-400 text-steel-950 rounded-full min-w-[1.4rem] text-center',
};

export function Labels({ layout, marks }: { layout: SceneLayout; marks: Map<string, Verdict> }) {
  const procedure = useTrainer((s) => s.procedure);
  const stage = useTrainer((s) => s.stage);
  const explode = useTrainer((s) => s.explode);
  const sequence = useTrainer((s) => s.drafts.order.sequence);
  const placements = useTrainer((s) => s.drafts.pins.placements);
  const pattern = useTrainer((s) => s.drafts.pattern);
  const hovered = useTrainer((s) => s.hovered);

  const labels = useMemo(() => {
    const view: SceneView = { stage, explode, sequence, placements };
    const out: Label[] = [];
    const add = (id: string, kind: LabelKind, text: string, key: string) => {
      const at = scenePoint(procedure, layout, view, key);
      if (at) out.push({ id, kind, text, at });
    };
    const anchorsAndBolts = new Set([
      ...procedure.anchors.map((a) => a.key),
      ...procedure.fastenerGroups.flatMap((g) => g.bolts.map((b) => b.key)),
    ]);
    for (const [key, verdict] of marks) {
      if (verdict === 'bad') add(`bad:${key}`, 'bad', `✗ Fix: ${shortName(procedure, key)}`, key);
      else if (anchorsAndBolts.has(key)) add(`good:${key}`, 'good', `✓ ${shortName(procedure, key)}`, key);
    }
    if (stage === 'pattern') {
      const pass = pattern.passes[pattern.activePass];
      pass?.sequence.forEach((bolt, i) => add(`number:${bolt}`, 'number', String(i + 1), bolt));
    }
    if (hovered) add(`hover:${hovered}`, 'hover', describeKey(procedure, hovered, placements), hovered);
    return mergeSameSpot(out);
  }, [procedure, layout, stage, explode, sequence, placements, pattern, hovered, marks]);

  return (
    <>
      {labels.map((label) => (
        <SceneTag key={label.id} at={label.at} kind={label.kind} tone={STYLE[label.kind]} zIndex={label.kind === 'hover' ? 40 : 20}>
          {label.text}
        </SceneTag>
      ))}
    </>
  );
}
