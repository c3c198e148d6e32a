import type { Anchor, LengthUnit, Part, Procedure, Stage, TorqueSpec, TorqueUnit, Vec3 } from './schema';
import { convertTorque } from '../torque';

// What a learner's browser may see of a procedure: enough to draw the scene and pose each stage,
// none of the answers (no `after`, no pin seats, no decoy flags, no pass fractions, no final count).

export type PublicPart = Pick<Part, 'key' | 'name' | 'kind' | 'model' | 'count' | 'pin'>;
export type PublicAnchor = Pick<Anchor, 'key' | 'part' | 'kind' | 'position' | 'sizeMm'>;

export interface PublicStep {
  key: string;
  text: string;
  parts: string[];
  /** Safety note for the step; it says what can hurt, not when the step comes. */
  caution?: string;
}

export interface PublicFastenerGroup {
  key: string;
  name: string;
  part: string;
  axis: Vec3;
  bolts: { key: string; anchor: string; position: Vec3 }[];
  passCount: number;
  /** Left out when the Wrench stage asks the learner to work the setting out for this group. */
  torque?: TorqueSpec;
}

export interface PublicWrenchTask {
  group: string;
  dialUnit: TorqueUnit;
  wrenchLength: number;
  extension: number;
  lengthUnit: LengthUnit;
  direction: 'forward' | 'back';
  specShownIn: TorqueUnit;
  /** The group's torque spec converted to `specShownIn`, as the learner is given it. */
  spec: TorqueSpec;
}

export interface PublicProcedure {
  slug: string;
  title: string;
  version: number;
  engine: { key: string; name: string };
  summary: string;
  cautions: string[];
  demoValues: boolean;
  stages: Stage[];
  parts: PublicPart[];
  anchors: PublicAnchor[];
  steps: PublicStep[];
  fastenerGroups: PublicFastenerGroup[];
  wrench?: PublicWrenchTask;
}

/** 32-bit FNV-1a hash of a string: turns a seed text into PRNG state. */
export function hashString(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193);
  return h >>> 0;
}

/** mulberry32: a tiny PRNG, uniform in [0, 1), the same sequence everywhere for the same state. */
export function mulberry32(state: number): () => number {
  let a = state >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Fisher–Yates over a copy, driven by a seeded PRNG: same seed, same order. */
export function seededShuffle<T>(items: readonly T[], seed: string): T[] {
  const out = [...items];
  const random = mulberry32(hashString(seed));
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
}

export function toPublicProcedure(procedure: Procedure, seed: string): PublicProcedure {
  const positions = new Map(procedure.anchors.map((a) => [a.key, a.position] as const));
  // The spec is hidden from its group when the Wrench stage asks the learner to turn it into a setting.
  const wrenchGroup = procedure.stages.includes('wrench') ? procedure.wrench?.group : undefined;
  // Each list gets its own stream so shuffling one does not shift another.
  const shuffle = <T>(items: readonly T[], list: string) => seededShuffle(items, `${seed}:${list}`);

  const view: PublicProcedure = {
    slug: procedure.slug,
    title: procedure.title,
    version: procedure.version,
    engine: { key: procedure.engine.key, name: procedure.engine.name },
    summary: procedure.summary,
    cautions: [...procedure.cautions],
    demoValues: procedure.demoValues,
    stages: [...procedure.stages],
    parts: shuffle(procedure.parts, 'parts').map((p) => ({
      key: p.key,
      name: p.name,
      kind: p.kind,
      model: p.model,
      count: p.count,
      ...(p.pin ? { pin: { diameterMm: p.pin.diameterMm, lengthMm: p.pin.lengthMm } } : {}),
    })),
    anchors: procedure.anchors.map((a) => ({
      key: a.key,
      part: a.part,
      kind: a.kind,
      position: [...a.position] as Vec3,
      sizeMm: a.sizeMm,
    })),
    steps: shuffle(procedure.steps, 'steps').map((s) => ({
      key: s.key,
      text: s.text,
      parts: [...s.parts],
      ...(s.caution ? { caution: s.caution } : {}),
    })),
    // Bolts are shuffled too: a stored list in tightening order would give the Pattern stage away.
    fastenerGroups: procedure.fastenerGroups.map((g) => ({
      key: g.key,
      name: g.name,
      part: g.part,
      axis: [...g.axis] as Vec3,
      bolts: shuffle(g.bolts, `bolts:${g.key}`).map((b) => ({
        key: b.key,
        anchor: b.anchor,
        position: [...(positions.get(b.anchor) ?? [0, 0, 0])] as Vec3,
      })),
      passCount: g.passes.length,
      ...(g.key === wrenchGroup ? {} : { torque: { ...g.torque } }),
    })),
  };

  const task = procedure.wrench;
  const group = task && procedure.fastenerGroups.find((g) => g.key === task.group);
  if (task && group) {
    view.wrench = {
      group: task.group,
      dialUnit: task.dialUnit,
      wrenchLength: task.wrenchLength,
      extension: task.extension,
      lengthUnit: task.lengthUnit,
      direction: task.direction,
      specShownIn: task.specShownIn,
      spec: {
        value: convertTorque(group.torque.value, group.torque.unit, task.specShownIn),
        unit: task.specShownIn,
        tolerancePct: group.torque.tolerancePct,
      },
    };
  }
  return view;
}
