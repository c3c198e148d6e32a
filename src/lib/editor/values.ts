import { marksFromSteps } from './ordering';
import {
  LENGTH_UNIT_IDS, PART_KINDS, PATTERN_RULES, STAGES, TORQUE_UNIT_IDS, ANCHOR_KINDS,
  type Anchor, type FastenerGroup, type Part, type PinSeat, type Stage, type WrenchTask,
} from '../procedure/schema';

// The editor's form values and the draft document they are saved as. A draft may be anything the
// instructor has typed so far, so reading one is lenient: missing or mistyped fields get blanks (a number
// left empty stays NaN, which the schema then reports next to its field). Writing one back gives the
// document shape the schema checks, so a valid document survives the round trip unchanged.

export interface EditorStep {
  key: string;
  text: string;
  parts: string[];
  /** '' for none. */
  caution: string;
  after: string[];
}

export interface EditorValues {
  /** '' until the first publish picks one from the title. */
  slug: string;
  title: string;
  engine: { key: string; name: string };
  summary: string;
  cautions: string[];
  demoValues: boolean;
  stages: Stage[];
  parts: Part[];
  anchors: Anchor[];
  steps: EditorStep[];
  /** Editor only: anyOrder[i] marks step i as "may come in any order with the previous step". */
  anyOrder: boolean[];
  /**
   * Editor only: true while the steps keep constraints the list and marks cannot say (an imported or
   * hand-written document); they stay as they are until the instructor reorders or changes a mark.
   */
  customOrder: boolean;
  pinSeats: PinSeat[];
  fastenerGroups: FastenerGroup[];
  /** Whether the document has a wrench task (the form keeps the fields either way). */
  hasWrench: boolean;
  wrench: WrenchTask;
  hasFinalCheck: boolean;
  finalCheck: { fastenerCount: number; crankTurns: number };
}

type Json = Record<string, unknown>;

const obj = (x: unknown): Json => (x && typeof x === 'object' && !Array.isArray(x) ? (x as Json) : {});
const list = (x: unknown): unknown[] => (Array.isArray(x) ? x : []);
const str = (x: unknown, fallback = ''): string => (typeof x === 'string' ? x : fallback);
const num = (x: unknown, fallback = Number.NaN): number => (typeof x === 'number' ? x : fallback);
const bool = (x: unknown, fallback = false): boolean => (typeof x === 'boolean' ? x : fallback);
const strings = (x: unknown): string[] => list(x).filter((v): v is string => typeof v === 'string');
const oneOf = <T extends string>(options: readonly T[], x: unknown, fallback: T): T =>
  typeof x === 'string' && (options as readonly string[]).includes(x) ? (x as T) : fallback;
const vec3 = (x: unknown): [number, number, number] => {
  const v = list(x);
  return [num(v[0], 0), num(v[1], 0), num(v[2], 0)];
};

export const DEFAULT_WRENCH: WrenchTask = {
  group: '',
  dialUnit: 'in·lbf',
  wrenchLength: 10,
  extension: 0,
  lengthUnit: 'in',
  direction: 'forward',
  specShownIn: 'N·m',
};

/** Form values from a draft document, whatever state it is in. */
export function toEditorValues(input: unknown): EditorValues {
  const d = obj(input);
  const engine = obj(d.engine);
  const wrench = obj(d.wrench);
  const finalCheck = obj(d.finalCheck);
  const steps = list(d.steps).map((x) => {
    const s = obj(x);
    return { key: str(s.key), text: str(s.text), parts: strings(s.parts), caution: str(s.caution), after: strings(s.after) };
  });
  const marks = marksFromSteps(steps);
  return {
    slug: str(d.slug),
    title: str(d.title),
    engine: { key: str(engine.key), name: str(engine.name) },
    summary: str(d.summary),
    cautions: strings(d.cautions),
    demoValues: bool(d.demoValues),
    stages: list(d.stages).filter((s): s is Stage => (STAGES as readonly unknown[]).includes(s)),
    parts: list(d.parts).map((x) => {
      const p = obj(x);
      const pin = p.pin === undefined ? undefined : obj(p.pin);
      return {
        key: str(p.key),
        name: str(p.name),
        kind: oneOf(PART_KINDS, p.kind, 'block'),
        model: str(p.model),
        count: num(p.count, 1),
        ...(pin ? { pin: { diameterMm: num(pin.diameterMm), lengthMm: num(pin.lengthMm) } } : {}),
        decoy: bool(p.decoy),
      };
    }),
    anchors: list(d.anchors).map((x) => {
      const a = obj(x);
      return { key: str(a.key), part: str(a.part), kind: oneOf(ANCHOR_KINDS, a.kind, 'threaded-hole'), position: vec3(a.position), sizeMm: num(a.sizeMm) };
    }),
    steps,
    anyOrder: marks.anyOrder,
    customOrder: !marks.exact,
    pinSeats: list(d.pinSeats).map((x) => {
      const s = obj(x);
      return { part: str(s.part), anchor: str(s.anchor) };
    }),
    fastenerGroups: list(d.fastenerGroups).map((x) => {
      const g = obj(x);
      const torque = obj(g.torque);
      return {
        key: str(g.key),
        name: str(g.name),
        part: str(g.part),
        axis: vec3(g.axis),
        bolts: list(g.bolts).map((y) => {
          const b = obj(y);
          return { key: str(b.key), anchor: str(b.anchor) };
        }),
        torque: { value: num(torque.value), unit: oneOf(TORQUE_UNIT_IDS, torque.unit, 'N·m'), tolerancePct: num(torque.tolerancePct, 10) },
        passes: list(g.passes).map((p) => num(p)),
        rule: oneOf(PATTERN_RULES, g.rule, 'cross'),
      };
    }),
    hasWrench: d.wrench !== undefined,
    wrench: {
      group: str(wrench.group, DEFAULT_WRENCH.group),
      dialUnit: oneOf(TORQUE_UNIT_IDS, wrench.dialUnit, DEFAULT_WRENCH.dialUnit),
      wrenchLength: num(wrench.wrenchLength, DEFAULT_WRENCH.wrenchLength),
      extension: num(wrench.extension, DEFAULT_WRENCH.extension),
      lengthUnit: oneOf(LENGTH_UNIT_IDS, wrench.lengthUnit, DEFAULT_WRENCH.lengthUnit),
      direction: oneOf(['forward', 'back'] as const, wrench.direction, DEFAULT_WRENCH.direction),
      specShownIn: oneOf(TORQUE_UNIT_IDS, wrench.specShownIn, DEFAULT_WRENCH.specShownIn),
    },
    hasFinalCheck: d.finalCheck !== undefined,
    finalCheck: { fastenerCount: num(finalCheck.fastenerCount, 0), crankTurns: num(finalCheck.crankTurns, 0) },
  };
}

/** The draft document for form values: the procedure document's shape, less the version. */
export function fromEditorValues(v: EditorValues): Json {
  return {
    ...(v.slug ? { slug: v.slug } : {}),
    title: v.title,
    engine: { key: v.engine.key, name: v.engine.name },
    summary: v.summary,
    cautions: [...v.cautions],
    demoValues: v.demoValues,
    stages: [...v.stages],
    parts: v.parts.map((p) => ({
      key: p.key,
      name: p.name,
      kind: p.kind,
      model: p.model,
      count: p.count,
      ...(p.pin ? { pin: { diameterMm: p.pin.diameterMm, lengthMm: p.pin.lengthMm } } : {}),
      decoy: p.decoy,
    })),
    anchors: v.anchors.map((a) => ({ key: a.key, part: a.part, kind: a.kind, position: [...a.position], sizeMm: a.sizeMm })),
    steps: v.steps.map((s) => ({
      key: s.key,
      text: s.text,
      parts: [...s.parts],
      ...(s.caution.trim() ? { caution: s.caution } : {}),
      after: [...s.after],
    })),
    pinSeats: v.pinSeats.map((s) => ({ part: s.part, anchor: s.anchor })),
    fastenerGroups: v.fastenerGroups.map((g) => ({
      key: g.key,
      name: g.name,
      part: g.part,
      axis: [...g.axis],
      bolts: g.bolts.map((b) => ({ key: b.key, anchor: b.anchor })),
      torque: { value: g.torque.value, unit: g.torque.unit, tolerancePct: g.torque.tolerancePct },
      passes: [...g.passes],
      rule: g.rule,
    })),
    ...(v.hasWrench ? { wrench: { ...v.wrench } } : {}),
    ...(v.hasFinalCheck ? { finalCheck: { ...v.finalCheck } } : {}),
  };
}
