import type { Part, Procedure } from '../procedure/schema';
import type { PinsAnswer } from './answers';
import type { StageScore, StepResult } from './types';

// Pins stage. One mark per pin seat filled with its own pin and nothing else, one per decoy pin left
// in the kit; every other wrong line (a pin where no pin goes, a pin used more often than the kit
// holds) costs a mark, never below zero.

const PIN_KINDS = new Set<Part['kind']>(['dowel-pin', 'sleeve']);
const SIZE_EPSILON_MM = 0.01;

const differs = (a: number, b: number) => Math.abs(a - b) > SIZE_EPSILON_MM;

export function scorePins(procedure: Procedure, answer: PinsAnswer): StageScore {
  const parts = new Map(procedure.parts.map((p) => [p.key, p] as const));
  const anchors = new Map(procedure.anchors.map((a) => [a.key, a] as const));
  const name = (key: string) => parts.get(key)?.name ?? `"${key}"`;

  const byAnchor = new Map<string, string[]>();
  const uses = new Map<string, number>();
  for (const { part, anchor } of answer.placements) {
    byAnchor.set(anchor, [...(byAnchor.get(anchor) ?? []), part]);
    uses.set(part, (uses.get(part) ?? 0) + 1);
  }

  const seatResults: StepResult[] = procedure.pinSeats.map((seat) => {
    const here = byAnchor.get(seat.anchor) ?? [];
    const hole = anchors.get(seat.anchor)!;
    const label = `locating hole ${hole.key}`;
    if (here.length === 0) return { key: hole.key, ok: false, message: `${label} (${hole.sizeMm} mm) was left empty` };
    if (here.length > 1) {
      return { key: hole.key, ok: false, message: `${here.length} pins in ${label} (${here.map(name).join(', ')}); a hole takes one pin` };
    }
    const key = here[0]!;
    if (key === seat.part) return { key: hole.key, ok: true, message: `${name(key)} seated in ${label}` };
    return { key: hole.key, ok: false, message: `${label}: ${wrongPinReason(parts.get(key), parts.get(seat.part)!, key, hole.sizeMm)}` };
  });

  const seated = new Set(procedure.pinSeats.map((s) => s.anchor));
  const strayResults: StepResult[] = [];
  for (const [anchorKey, here] of byAnchor) {
    if (seated.has(anchorKey)) continue;
    const hole = anchors.get(anchorKey);
    const what = here.map(name).join(', ');
    let message: string;
    const anyPin = here.some((k) => !parts.has(k) || PIN_KINDS.has(parts.get(k)!.kind));
    if (!hole) message = `there is no hole "${anchorKey}" on this engine (${what})`;
    else if (!anyPin) message = `${what} in ${hole.key}: this stage seats pins only`;
    else if (hole.kind === 'threaded-hole') {
      message = `${what} in threaded hole ${hole.key}: a pin there blocks the bolt, and driving the bolt home crushes the pin and spoils the threads`;
    } else if (hole.kind === 'locating-hole') message = `locating hole ${hole.key} takes no pin in this job (${what})`;
    else message = `${hole.kind} ${hole.key} is not a hole for a pin (${what})`;
    strayResults.push({ key: anchorKey, ok: false, message });
  }
  for (const [key, count] of uses) {
    const part = parts.get(key);
    // Decoys get their own line below; unknown parts are already named by the hole they went into.
    if (!part || part.decoy || count <= part.count) continue;
    strayResults.push({ key, ok: false, message: `${part.name} used ${count} times; the kit holds ${part.count}` });
  }

  const decoyResults: StepResult[] = procedure.parts
    .filter((p) => p.decoy && PIN_KINDS.has(p.kind))
    .map((p) =>
      (uses.get(p.key) ?? 0) === 0
        ? { key: p.key, ok: true, message: `${p.name} left in the kit: it is not for this job` }
        : { key: p.key, ok: false, message: `${p.name} is not for this job: leave it in the kit` },
    );

  const seatsOk = seatResults.filter((r) => r.ok).length;
  const decoysOk = decoyResults.filter((r) => r.ok).length;
  const score = Math.max(0, seatsOk + decoysOk - strayResults.length);
  const results = [...seatResults, ...strayResults, ...decoyResults];
  return {
    stage: 'pins',
    score,
    maxScore: seatResults.length + decoyResults.length,
    passed: results.every((r) => r.ok),
    results,
    notes: [
      `${seatsOk} of ${seatResults.length} holes right + ${decoysOk} of ${decoyResults.length} spare pins left out` +
        ` − ${strayResults.length} stray placement${strayResults.length === 1 ? '' : 's'} = ${score}`,
    ],
  };
}

/** Why `placed` is not the pin this hole takes, in the terms a learner can check on the bench. */
function wrongPinReason(placed: Part | undefined, wanted: Part, placedKey: string, holeMm: number): string {
  if (!placed) return `there is no part "${placedKey}" in the kit`;
  if (!PIN_KINDS.has(placed.kind)) return `${placed.name} is not a dowel pin or sleeve`;
  if (placed.pin && differs(placed.pin.diameterMm, holeMm)) {
    return `${placed.name} is ${placed.pin.diameterMm} mm across; this hole takes ${holeMm} mm`;
  }
  if (placed.pin && wanted.pin && differs(placed.pin.lengthMm, wanted.pin.lengthMm)) {
    return `${placed.name} is ${placed.pin.lengthMm} mm long; this hole takes a ${wanted.pin.lengthMm} mm pin`;
  }
  if (placed.kind !== wanted.kind) return `${placed.name} is a ${placed.kind}; this hole takes a ${wanted.kind}`;
  return `${placed.name} is not the pin this hole takes`;
}
