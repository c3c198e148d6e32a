import { procedureSchema, type Procedure } from './schema';
import { findCycle } from './graph';
import { canonicalJson, sha256Text } from './checksum';
import { wrenchGeometryProblem } from '../wrench';

// The schema checks each field; the rules here check that the fields agree with each other,
// so every scorer can trust a validated procedure without checking again.

export interface Issue {
  /** Dotted path into the document, e.g. "steps.3.after.0"; "" for the whole document. */
  path: string;
  message: string;
}

export type ValidationResult = { ok: true; procedure: Procedure } | { ok: false; issues: Issue[] };

const PIN_KINDS = new Set(['dowel-pin', 'sleeve']);
// Hole sizes and pin diameters come from the same drawing; allow for decimal noise only.
const SIZE_EPSILON_MM = 0.01;

export function validateProcedure(input: unknown): ValidationResult {
  const parsed = procedureSchema.safeParse(input);
  if (!parsed.success) {
    return {
      ok: false,
      issues: parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message })),
    };
  }
  const issues = crossReferenceIssues(parsed.data);
  return issues.length > 0 ? { ok: false, issues } : { ok: true, procedure: parsed.data };
}

/** SHA-256 (hex) of the procedure as canonical JSON: equal documents, equal checksum, in browser and server. */
export function procedureChecksum(procedure: Procedure): string {
  return sha256Text(canonicalJson(procedure));
}

/** Rules that span fields; assumes the document already passed the schema. */
export function crossReferenceIssues(p: Procedure): Issue[] {
  const issues: Issue[] = [];
  const add = (path: string, message: string) => issues.push({ path, message });

  const duplicateKeys = (items: readonly { key: string }[], path: string, noun: string) => {
    const seen = new Set<string>();
    items.forEach((item, i) => {
      if (seen.has(item.key)) add(`${path}.${i}.key`, `duplicate ${noun} key ${item.key}`);
      seen.add(item.key);
    });
  };
  duplicateKeys(p.parts, 'parts', 'part');
  duplicateKeys(p.anchors, 'anchors', 'anchor');
  duplicateKeys(p.steps, 'steps', 'step');
  duplicateKeys(p.fastenerGroups, 'fastenerGroups', 'group');
  // Bolt keys label feedback lines, so they must be unique across the whole procedure.
  const boltKeys = new Set<string>();
  p.fastenerGroups.forEach((g, gi) =>
    g.bolts.forEach((b, bi) => {
      if (boltKeys.has(b.key)) add(`fastenerGroups.${gi}.bolts.${bi}.key`, `duplicate bolt key ${b.key}`);
      boltKeys.add(b.key);
    }),
  );

  const parts = new Map(p.parts.map((x) => [x.key, x] as const));
  const anchors = new Map(p.anchors.map((x) => [x.key, x] as const));
  const stepKeys = new Set(p.steps.map((s) => s.key));

  p.anchors.forEach((a, i) => {
    if (!parts.has(a.part)) add(`anchors.${i}.part`, `anchor ${a.key} sits on part ${a.part}, which is not in the parts list`);
  });

  p.steps.forEach((s, i) => {
    s.parts.forEach((k, j) => {
      if (!parts.has(k)) add(`steps.${i}.parts.${j}`, `step ${s.key} names part ${k}, which is not in the parts list`);
    });
    s.after.forEach((k, j) => {
      if (!stepKeys.has(k)) add(`steps.${i}.after.${j}`, `step ${s.key} waits for step ${k}, which does not exist`);
    });
  });
  const cycle = findCycle(p.steps);
  if (cycle) {
    const at = p.steps.findIndex((s) => s.key === cycle[0]);
    add(`steps.${at}.after`, `steps form a cycle: ${cycle.join(' → ')}`);
  }

  pinIssues(p, parts, anchors, add);
  fastenerIssues(p, parts, anchors, add);

  if (p.wrench && !p.fastenerGroups.some((g) => g.key === p.wrench!.group)) {
    add('wrench.group', `wrench task names group ${p.wrench.group}, which does not exist`);
  }
  if (p.wrench) {
    const problem = wrenchGeometryProblem(p.wrench.wrenchLength, p.wrench.extension, p.wrench.direction);
    if (problem) add('wrench.extension', `wrench task: ${problem}`);
  }

  const stagesSeen = new Set<string>();
  p.stages.forEach((stage, i) => {
    if (stagesSeen.has(stage)) add(`stages.${i}`, `stage ${stage} is listed twice`);
    stagesSeen.add(stage);
    if (stage === 'pins' && p.pinSeats.length === 0) add(`stages.${i}`, 'stage pins needs at least one pin seat');
    if (stage === 'pattern' && p.fastenerGroups.length === 0) add(`stages.${i}`, 'stage pattern needs a fastener group');
    if (stage === 'wrench' && !p.wrench) add(`stages.${i}`, 'stage wrench needs a wrench task');
    if (stage === 'final-check' && !p.finalCheck) add(`stages.${i}`, 'stage final-check needs finalCheck');
  });
  return issues;
}

type PartMap = Map<string, Procedure['parts'][number]>;
type AnchorMap = Map<string, Procedure['anchors'][number]>;
type Add = (path: string, message: string) => void;

function pinIssues(p: Procedure, parts: PartMap, anchors: AnchorMap, add: Add) {
  p.parts.forEach((part, i) => {
    if (PIN_KINDS.has(part.kind) && !part.pin) add(`parts.${i}.pin`, `pin ${part.key} needs its size (diameterMm, lengthMm)`);
  });

  const seatsPerPart = new Map<string, number>();
  const seatedHoles = new Set<string>();
  p.pinSeats.forEach((seat, i) => {
    const part = parts.get(seat.part);
    const hole = anchors.get(seat.anchor);
    if (!part) add(`pinSeats.${i}.part`, `pin seat names part ${seat.part}, which is not in the parts list`);
    else if (!PIN_KINDS.has(part.kind)) add(`pinSeats.${i}.part`, `pin seat uses ${part.key}, which is not a dowel pin or sleeve`);
    else if (part.decoy) add(`pinSeats.${i}.part`, `pin ${part.key} is a decoy but has a seat in hole ${seat.anchor}`);
    if (!hole) add(`pinSeats.${i}.anchor`, `pin seat names hole ${seat.anchor}, which is not an anchor`);
    else if (hole.kind !== 'locating-hole') add(`pinSeats.${i}.anchor`, `pin seat names ${hole.key}, a ${hole.kind}, not a locating hole`);
    else if (seatedHoles.has(hole.key)) add(`pinSeats.${i}.anchor`, `hole ${hole.key} has two pin seats`);
    if (part?.pin && hole && Math.abs(part.pin.diameterMm - hole.sizeMm) > SIZE_EPSILON_MM) {
      add(`pinSeats.${i}`, `pin ${part.key} is ${part.pin.diameterMm} mm across but hole ${hole.key} is ${hole.sizeMm} mm`);
    }
    seatedHoles.add(seat.anchor);
    seatsPerPart.set(seat.part, (seatsPerPart.get(seat.part) ?? 0) + 1);
  });

  p.parts.forEach((part, i) => {
    if (!PIN_KINDS.has(part.kind) || part.decoy) return;
    const seats = seatsPerPart.get(part.key) ?? 0;
    if (seats === 0) add(`parts.${i}`, `pin ${part.key} has no hole`);
    if (seats > part.count) add(`parts.${i}.count`, `pin ${part.key} has ${seats} seats but the kit holds ${part.count}`);
  });
}

function fastenerIssues(p: Procedure, parts: PartMap, anchors: AnchorMap, add: Add) {
  const holeUsedBy = new Map<string, string>();
  const boltsPerPart = new Map<string, number>();
  p.fastenerGroups.forEach((g, gi) => {
    const at = `fastenerGroups.${gi}`;
    const part = parts.get(g.part);
    if (!part) add(`${at}.part`, `group ${g.key} uses part ${g.part}, which is not in the parts list`);
    else if (part.decoy) add(`${at}.part`, `group ${g.key} uses ${part.key}, which is a decoy`);
    // A nut threads onto a shaft end (the flywheel nut); everything else goes into a threaded hole.
    const fits = part?.kind === 'nut' ? ['threaded-hole', 'shaft-end'] : ['threaded-hole'];

    g.bolts.forEach((b, bi) => {
      const hole = anchors.get(b.anchor);
      if (!hole) add(`${at}.bolts.${bi}.anchor`, `bolt ${b.key} goes into ${b.anchor}, which is not an anchor`);
      else if (!fits.includes(hole.kind)) add(`${at}.bolts.${bi}.anchor`, `bolt ${b.key} goes into ${hole.key}, a ${hole.kind}, not a threaded hole`);
      const other = holeUsedBy.get(b.anchor);
      if (other !== undefined) add(`${at}.bolts.${bi}.anchor`, `bolts ${other} and ${b.key} share hole ${b.anchor}`);
      else holeUsedBy.set(b.anchor, b.key);
    });

    const total = (boltsPerPart.get(g.part) ?? 0) + g.bolts.length;
    boltsPerPart.set(g.part, total);
    if (part && total > part.count) add(`${at}.bolts`, `group ${g.key} needs ${total} of ${part.key} but the kit holds ${part.count}`);

    g.passes.forEach((f, j) => {
      const prev = g.passes[j - 1];
      if (prev !== undefined && f <= prev) add(`${at}.passes.${j}`, `passes must rise: pass ${j + 1} (${f}) is not above pass ${j} (${prev})`);
    });
    const last = g.passes[g.passes.length - 1]!;
    if (last !== 1) add(`${at}.passes.${g.passes.length - 1}`, `the last pass must be the full torque (1), not ${last}`);
  });
}
