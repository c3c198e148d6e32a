import { createStore, type StoreApi } from 'zustand/vanilla';
import type { PublicProcedure } from '../../lib/procedure/public-view';
import type { Stage, TorqueUnit } from '../../lib/procedure/schema';
import type { StepResult } from '../../lib/scoring/types';
import { STAGE_LABELS, boltLabel, readableKey } from './labels';

// The trainer's one store: the learner's work per stage (saved to the server as a draft), the
// server's answers, and view state shared by the 3D scene and the lists. Every action is plain and
// synchronous so both the canvas and the keyboard/list paths change the same state the same way.

export interface OrderDraft {
  /** Step keys in the order the learner placed them. */
  sequence: string[];
}
export interface PinsDraft {
  placements: { part: string; anchor: string }[];
}
export interface PatternPassDraft {
  /** Torque for this pass in the group's unit, null until the learner enters it. */
  torque: number | null;
  sequence: string[];
}
export interface PatternDraft {
  group: string;
  passes: PatternPassDraft[];
  activePass: number;
}
export interface WrenchDraft {
  setting: number | null;
  unit: TorqueUnit;
}
export interface FinalCheckDraft {
  fastenersCounted: number | null;
  leftover: number | null;
  /** Full turns of the crankshaft so far (fractions while dragging). */
  crankTurns: number;
}
export interface Drafts {
  order: OrderDraft;
  pins: PinsDraft;
  pattern: PatternDraft;
  wrench: WrenchDraft;
  'final-check': FinalCheckDraft;
}

/** What POST /api/attempts answered for a stage. */
export interface AttemptResult {
  id: string;
  score: number;
  maxScore: number;
  passed: boolean;
  results: StepResult[];
  notes: string[];
  /** On a drill that keeps its answers until the due date: the lines say right or not, no more. */
  answersHidden?: boolean;
}

export type SaveStatus = 'idle' | 'saving' | 'saved' | 'offline';

export interface TrainerState {
  procedure: PublicProcedure;
  stage: Stage;
  drafts: Drafts;
  results: Partial<Record<Stage, AttemptResult>>;
  submitting: Stage | null;
  submitError: string | null;
  save: { status: SaveStatus; savedAt: string | null };
  /** Pin part picked from the tray, waiting for a hole. */
  selectedPin: string | null;
  /** Part, anchor or bolt key under the pointer or keyboard focus (labels in the scene). */
  hovered: string | null;
  /** 0 = assembled, 1 = fully exploded. */
  explode: number;
  /** Last sentence for the screen-reader live region. */
  announcement: string;
  /** Bumped on each change of the learner's work; the draft saver watches it. */
  revision: number;
}

export interface TrainerActions {
  setStage(stage: Stage): void;
  placeStep(key: string): void;
  moveStep(from: number, to: number): void;
  removeStep(key: string): void;
  selectPin(part: string | null): void;
  /** Puts the selected pin (or the given one) into a hole; a hole holds one pin. */
  placePin(anchor: string, part?: string): void;
  removePin(anchor: string): void;
  /** Adds a bolt to the active pass (a bolt already in the pass is ignored). */
  tapBolt(bolt: string): void;
  undoBolt(): void;
  clearPass(): void;
  setActivePass(index: number): void;
  setPassTorque(index: number, torque: number | null): void;
  setWrench(setting: number | null, unit?: TorqueUnit): void;
  setFastenersCounted(count: number | null): void;
  setLeftover(count: number | null): void;
  addCrankTurn(delta: number): void;
  resetStage(stage: Stage): void;
  /** Replaces the learner's work with a saved copy (server or this device); not an edit, so no revision bump. */
  restoreDrafts(saved: Partial<Drafts>): void;
  setHovered(key: string | null): void;
  setExplode(value: number): void;
  setResult(stage: Stage, result: AttemptResult): void;
  setSubmitting(stage: Stage | null, error?: string | null): void;
  setSaveStatus(status: SaveStatus, savedAt?: string | null): void;
  announce(text: string): void;
}

export type TrainerStore = StoreApi<TrainerState & TrainerActions>;

export function emptyDrafts(procedure: PublicProcedure): Drafts {
  const group = procedure.fastenerGroups[0];
  return {
    order: { sequence: [] },
    pins: { placements: [] },
    pattern: {
      group: group?.key ?? '',
      passes: Array.from({ length: group?.passCount ?? 1 }, () => ({ torque: null, sequence: [] })),
      activePass: 0,
    },
    wrench: { setting: null, unit: procedure.wrench?.dialUnit ?? 'N·m' },
    'final-check': { fastenersCounted: null, leftover: null, crankTurns: 0 },
  };
}

/** The unit pattern torques are entered in: the group's, or the spec as the wrench stage shows it. */
export function patternUnit(procedure: PublicProcedure): TorqueUnit {
  return procedure.fastenerGroups[0]?.torque?.unit ?? procedure.wrench?.spec.unit ?? 'N·m';
}

/** The answer POST /api/attempts expects for a stage, built from the draft. */
export function answerFor(stage: Stage, drafts: Drafts): unknown {
  switch (stage) {
    case 'order':
      return { sequence: drafts.order.sequence };
    case 'pins':
      return { placements: drafts.pins.placements };
    case 'pattern':
      return {
        group: drafts.pattern.group,
        passes: drafts.pattern.passes.map((p) => ({ torque: p.torque ?? 0, sequence: p.sequence })),
      };
    case 'wrench':
      return { setting: drafts.wrench.setting ?? 0, unit: drafts.wrench.unit };
    case 'final-check': {
      const d = drafts['final-check'];
      return { fastenersCounted: d.fastenersCounted ?? 0, crankTurns: Math.floor(d.crankTurns), leftover: d.leftover ?? 0 };
    }
  }
}

/** Saved drafts laid over empty ones; a pattern draft with the wrong number of passes is dropped. */
export function mergeDrafts(procedure: PublicProcedure, saved: Partial<Drafts> | undefined): Drafts {
  const empty = emptyDrafts(procedure);
  const merged = { ...empty, ...saved };
  const pattern = merged.pattern;
  if (pattern.passes.length !== empty.pattern.passes.length || pattern.group !== empty.pattern.group) merged.pattern = empty.pattern;
  else merged.pattern = { ...pattern, activePass: Math.min(pattern.activePass, pattern.passes.length - 1) };
  return merged;
}

export function createTrainerStore(procedure: PublicProcedure, saved?: Partial<Drafts>): TrainerStore {
  const drafts = mergeDrafts(procedure, saved);
  return createStore<TrainerState & TrainerActions>()((set, get) => {
    const stepText = (key: string) => procedure.steps.find((s) => s.key === key)?.text ?? key;
    const partName = (key: string) => procedure.parts.find((p) => p.key === key)?.name ?? key;
    const partCount = (key: string) => procedure.parts.find((p) => p.key === key)?.count ?? 1;
    /** Changes one stage's draft and marks the work changed (the saver watches `revision`). */
    const edit = <S extends Stage>(stage: S, change: (draft: Drafts[S]) => Drafts[S], announcement?: string) =>
      set((state) => ({
        drafts: { ...state.drafts, [stage]: change(state.drafts[stage]) },
        revision: state.revision + 1,
        ...(announcement ? { announcement } : {}),
      }));

    return {
      procedure,
      stage: procedure.stages[0]!,
      drafts,
      results: {},
      submitting: null,
      submitError: null,
      save: { status: 'idle', savedAt: null },
      selectedPin: null,
      hovered: null,
      explode: 1,
      announcement: '',
      revision: 0,

      // A check error belongs to the stage it came from.
      setStage: (stage) => set({ stage, selectedPin: null, submitError: null, announcement: `Stage: ${STAGE_LABELS[stage]}` }),

      placeStep: (key) => {
        if (get().drafts.order.sequence.includes(key)) return;
        const position = get().drafts.order.sequence.length + 1;
        edit('order', (d) => ({ sequence: [...d.sequence, key] }), `Placed step ${position}: ${stepText(key)}`);
      },
      moveStep: (from, to) =>
        edit(
          'order',
          (d) => {
            const sequence = [...d.sequence];
            if (from < 0 || from >= sequence.length || to < 0 || to >= sequence.length) return d;
            const [moved] = sequence.splice(from, 1);
            sequence.splice(to, 0, moved!);
            return { sequence };
          },
          `Moved to position ${to + 1}`,
        ),
      removeStep: (key) => edit('order', (d) => ({ sequence: d.sequence.filter((k) => k !== key) }), `Took back: ${stepText(key)}`),

      selectPin: (part) => set({ selectedPin: part, announcement: part ? `Holding ${partName(part)}. Choose a hole.` : '' }),
      placePin: (anchor, part) => {
        const pin = part ?? get().selectedPin;
        if (!pin) return;
        // The kit holds `count` of each pin: one more can only come out of a hole it already sits in.
        const inOtherHoles = get().drafts.pins.placements.filter((p) => p.part === pin && p.anchor !== anchor).length;
        if (inOtherHoles >= partCount(pin)) {
          set({ announcement: `No ${partName(pin)} left in the tray. Take one out of a hole first.` });
          return;
        }
        edit(
          'pins',
          (d) => ({ placements: [...d.placements.filter((p) => p.anchor !== anchor), { part: pin, anchor }] }),
          `${partName(pin)} placed in ${readableKey(anchor)}`,
        );
        set({ selectedPin: null });
      },
      removePin: (anchor) => edit('pins', (d) => ({ placements: d.placements.filter((p) => p.anchor !== anchor) }), `Pin taken out of ${readableKey(anchor)}`),

      tapBolt: (bolt) => {
        const { passes, activePass } = get().drafts.pattern;
        const pass = passes[activePass];
        if (!pass || pass.sequence.includes(bolt)) return;
        edit(
          'pattern',
          (d) => ({ ...d, passes: d.passes.map((p, i) => (i === d.activePass ? { ...p, sequence: [...p.sequence, bolt] } : p)) }),
          `Pass ${activePass + 1}: ${boltLabel(bolt)} is number ${pass.sequence.length + 1}`,
        );
      },
      undoBolt: () =>
        edit('pattern', (d) => ({ ...d, passes: d.passes.map((p, i) => (i === d.activePass ? { ...p, sequence: p.sequence.slice(0, -1) } : p)) }), 'Last bolt taken back'),
      clearPass: () =>
        edit('pattern', (d) => ({ ...d, passes: d.passes.map((p, i) => (i === d.activePass ? { ...p, sequence: [] } : p)) }), 'Pass cleared'),
      setActivePass: (index) =>
        set((state) => {
          const activePass = Math.max(0, Math.min(index, state.drafts.pattern.passes.length - 1));
          return { drafts: { ...state.drafts, pattern: { ...state.drafts.pattern, activePass } }, announcement: `Pass ${activePass + 1}` };
        }),
      setPassTorque: (index, torque) =>
        edit('pattern', (d) => ({ ...d, passes: d.passes.map((p, i) => (i === index ? { ...p, torque } : p)) })),

      setWrench: (setting, unit) => edit('wrench', (d) => ({ setting, unit: unit ?? d.unit })),

      setFastenersCounted: (count) => edit('final-check', (d) => ({ ...d, fastenersCounted: count })),
      setLeftover: (count) => edit('final-check', (d) => ({ ...d, leftover: count })),
      addCrankTurn: (delta) => {
        const before = get().drafts['final-check'].crankTurns;
        const after = Math.max(0, before + delta);
        const whole = Math.floor(after) > Math.floor(before) ? `Crankshaft turned ${Math.floor(after)} full turn${Math.floor(after) === 1 ? '' : 's'}` : undefined;
        edit('final-check', (d) => ({ ...d, crankTurns: after }), whole);
      },

      resetStage: (stage) =>
        set((state) => {
          const { [stage]: _dropped, ...results } = state.results;
          return {
            drafts: { ...state.drafts, [stage]: emptyDrafts(procedure)[stage] },
            results,
            revision: state.revision + 1,
            selectedPin: null,
            announcement: 'Stage reset. Try again.',
          };
        }),

      restoreDrafts: (saved) => set({ drafts: mergeDrafts(procedure, saved), selectedPin: null, announcement: 'Your saved work is back.' }),

      setHovered: (key) => set({ hovered: key }),
      setExplode: (value) => set({ explode: Math.max(0, Math.min(1, value)) }),
      setResult: (stage, result) =>
        set((state) => ({
          results: { ...state.results, [stage]: result },
          announcement: `${result.passed ? 'Passed' : 'Not yet'}: ${result.score} of ${result.maxScore}. ${result.results.filter((r) => !r.ok).length} to fix.`,
        })),
      setSubmitting: (stage, error = null) => set({ submitting: stage, submitError: error }),
      setSaveStatus: (status, savedAt) => set((state) => ({ save: { status, savedAt: savedAt === undefined ? state.save.savedAt : savedAt } })),
      announce: (text) => set({ announcement: text }),
    };
  });
}
