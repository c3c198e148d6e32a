import type { Part, Procedure } from '../procedure/schema';
import { scorePins } from '../scoring/pins';
import type { PinsAnswer } from '../scoring/answers';
import { holeLabel, pinSize } from '../../components/trainer/labels';
import type { Asker, Choice, Judgement } from './question-types';
import { shuffled } from './variant';

// Pins: "which pin goes in this hole?" for a hole the learner got wrong, "which hole takes this pin?" for a
// pin they misused. A choice is judged by the Pins scorer on the right placements with this one changed.

export const NO_PIN = 'none';

const PIN_KINDS = new Set<Part['kind']>(['dowel-pin', 'sleeve']);
const HOLE_KINDS = new Set(['locating-hole', 'threaded-hole']);

const pinName = (part: Part) => (pinSize(part) ? `${part.name} (${pinSize(part)})` : part.name);

function reference(procedure: Procedure): PinsAnswer['placements'] {
  return procedure.pinSeats.map((s) => ({ part: s.part, anchor: s.anchor }));
}

function verdict(procedure: Procedure, placements: PinsAnswer['placements'], right: string, key: string): Judgement {
  const score = scorePins(procedure, { placements });
  if (score.passed) return { correct: true, results: [{ key, ok: true, message: right }] };
  return { correct: false, results: score.results.filter((r) => !r.ok) };
}

function pinForHole(procedure: Procedure, anchorKey: string, variant: number): Asker | null {
  const hole = procedure.anchors.find((a) => a.key === anchorKey);
  if (!hole || !HOLE_KINDS.has(hole.kind)) return null;
  const pins = procedure.parts.filter((p) => PIN_KINDS.has(p.kind));
  if (pins.length === 0) return null;
  const label = holeLabel(hole);
  const choices: Choice[] = [...shuffled(pins.map((p) => ({ id: p.key, label: pinName(p) })), variant), { id: NO_PIN, label: 'No pin: this hole stays empty' }];
  const judge = (choice: string): Judgement => {
    // The right placements, with this hole holding the chosen pin (or nothing).
    const placements = reference(procedure).filter((p) => p.anchor !== anchorKey);
    if (choice !== NO_PIN) placements.push({ part: choice, anchor: anchorKey });
    const right = choice === NO_PIN ? `${label} takes no pin` : `${pinName(procedure.parts.find((p) => p.key === choice)!)} goes in ${label}`;
    return verdict(procedure, placements, right, anchorKey);
  };
  return {
    question: {
      kind: 'pin-for-hole',
      stage: 'pins',
      itemKey: anchorKey,
      variant,
      prompt: 'Which pin goes in this hole?',
      context: [label],
      choices,
      hint: `This hole is ${hole.sizeMm} mm across: a pin must match its size. Threaded holes take bolts, never pins.`,
      model: { kind: 'holes', focus: anchorKey, pickHoles: false },
    },
    judge,
  };
}

function holeForPin(procedure: Procedure, partKey: string, variant: number): Asker | null {
  const part = procedure.parts.find((p) => p.key === partKey);
  if (!part || !PIN_KINDS.has(part.kind)) return null;
  const holes = procedure.anchors.filter((a) => HOLE_KINDS.has(a.kind));
  const choices: Choice[] = [
    ...holes.map((h) => ({ id: h.key, label: holeLabel(h) })),
    { id: NO_PIN, label: 'None: it stays in the kit' },
  ];
  const seats = procedure.pinSeats.filter((s) => s.part === partKey);
  const judge = (choice: string): Judgement => {
    const right = choice === NO_PIN ? `${part.name} is not for this job: it stays in the kit` : `${pinName(part)} goes in ${holeLabel(holes.find((h) => h.key === choice)!)}`;
    // Move one of this pin's own placements to the chosen hole; right when any such move keeps every line right.
    const tries = (seats.length > 0 ? seats : [null]).map((seat) => {
      const placements = reference(procedure).filter((p) => !(seat && p.anchor === seat.anchor));
      if (choice !== NO_PIN) placements.push({ part: partKey, anchor: choice });
      return verdict(procedure, placements, right, partKey);
    });
    return tries.find((t) => t.correct) ?? tries[0]!;
  };
  return {
    question: {
      kind: 'hole-for-pin',
      stage: 'pins',
      itemKey: partKey,
      variant,
      prompt: 'Which hole takes this pin?',
      context: [pinName(part)],
      choices,
      hint: part.pin
        ? `The pin is ${part.pin.diameterMm} mm across; look for a locating hole of that size. A pin that fits no hole stays in the kit.`
        : 'Look for a locating hole of the same size; threaded holes take bolts, never pins.',
      model: { kind: 'holes', focus: null, pickHoles: true },
    },
    judge,
  };
}

export function askPins(procedure: Procedure, key: string, variant: number): Asker | null {
  if (procedure.anchors.some((a) => a.key === key)) return pinForHole(procedure, key, variant);
  return holeForPin(procedure, key, variant);
}
