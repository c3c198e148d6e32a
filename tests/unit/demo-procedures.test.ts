import { describe, expect, it } from 'vitest';
import { procedureSchema, type Procedure } from '~/lib/procedure/schema';
import { validateProcedure } from '~/lib/procedure/validate';
import { findAnchor, getModel } from '@models/index';
import { DEMO_PROCEDURES } from '@models/procedures/index';

// The four demo procedures for the fictional Wren 160: they parse, pass validation, and every key
// they use points at a real model, anchor, part or step.

function parsed(slug: string): Procedure {
  const input = DEMO_PROCEDURES.find((p) => p.slug === slug);
  if (!input) throw new Error(`no demo procedure ${slug}`);
  return procedureSchema.parse(input);
}

/** Every step that must come before `key`, following `after` links transitively. */
function ancestors(p: Procedure, key: string): Set<string> {
  const byKey = new Map(p.steps.map((s) => [s.key, s]));
  const seen = new Set<string>();
  const stack = [...(byKey.get(key)?.after ?? [])];
  while (stack.length > 0) {
    const k = stack.pop()!;
    if (seen.has(k)) continue;
    seen.add(k);
    stack.push(...(byKey.get(k)?.after ?? []));
  }
  return seen;
}
const unordered = (p: Procedure, a: string, b: string) => !ancestors(p, a).has(b) && !ancestors(p, b).has(a);

const all = DEMO_PROCEDURES.map((input) => [input.slug, input] as const);

describe('demo procedures', () => {
  it('are the four Wren 160 procedures', () => {
    expect(DEMO_PROCEDURES.map((p) => p.slug)).toEqual([
      'wren-160-sump', 'wren-160-head', 'wren-160-flywheel', 'wren-160-spark-plug',
    ]);
  });

  it.each(all)('%s parses with the schema and passes validation', (_, input) => {
    const result = procedureSchema.safeParse(input);
    expect(result.success ? [] : result.error.issues).toEqual([]);
    const checked = validateProcedure(input);
    expect(checked.ok ? [] : checked.issues).toEqual([]);
  });

  it.each(all)('%s is marked as demo values for a fictional engine', (slug) => {
    const p = parsed(slug);
    expect(p.demoValues).toBe(true);
    expect(p.summary).toMatch(/demo values for a fictional engine/i);
    expect(p.engine).toEqual({ key: 'wren-160', name: 'Wren 160' });
    expect(p.cautions.some((c) => /service manual/.test(c))).toBe(true);
    expect(p.cautions.some((c) => /spark plug lead/.test(c))).toBe(true);
  });

  it.each(all)('%s names only parts, models, steps and anchors that exist', (slug) => {
    const p = parsed(slug);
    const parts = new Map(p.parts.map((x) => [x.key, x]));
    const anchors = new Map(p.anchors.map((x) => [x.key, x]));
    const steps = new Set(p.steps.map((s) => s.key));

    for (const part of p.parts) {
      const model = getModel(part.model);
      expect(model, `model ${part.model}`).toBeDefined();
      expect(part.kind).toBe(model!.kind);
    }
    for (const step of p.steps) {
      for (const k of step.parts) expect(parts.has(k), `part ${k} in ${step.key}`).toBe(true);
      for (const k of step.after) expect(steps.has(k), `step ${k} before ${step.key}`).toBe(true);
    }
    // Anchors are copied from the models: same key, kind, size and position, on the part drawn with that model.
    for (const a of p.anchors) {
      const found = findAnchor(a.key);
      expect(found, `anchor ${a.key}`).toBeDefined();
      expect(parts.get(a.part)?.model).toBe(found!.model.key);
      expect(a.position).toEqual(found!.anchor.position);
      expect(a.kind).toBe(found!.anchor.kind);
      expect(a.sizeMm).toBe(found!.anchor.sizeMm);
    }
    for (const seat of p.pinSeats) {
      expect(parts.get(seat.part)?.decoy).toBe(false);
      expect(anchors.get(seat.anchor)?.kind).toBe('locating-hole');
      expect(findAnchor(seat.anchor)).toBeDefined();
      expect(parts.get(seat.part)?.pin?.diameterMm).toBe(anchors.get(seat.anchor)?.sizeMm);
    }
    for (const g of p.fastenerGroups) {
      expect(parts.has(g.part), `group part ${g.part}`).toBe(true);
      for (const b of g.bolts) {
        expect(anchors.has(b.anchor), `bolt anchor ${b.anchor}`).toBe(true);
        // The group axis is the way each fastener goes in.
        expect(findAnchor(b.anchor)?.anchor.axis).toEqual(g.axis);
      }
      expect(parts.get(g.part)!.count).toBeGreaterThanOrEqual(g.bolts.length);
    }
    if (p.wrench) expect(p.fastenerGroups.map((g) => g.key)).toContain(p.wrench.group);
    if (p.finalCheck) {
      expect(p.finalCheck.fastenerCount).toBe(p.fastenerGroups.reduce((n, g) => n + g.bolts.length, 0));
    }
  });
});

// Stages, specs and step orders as set out for the demo scenario (demo values for a fictional engine).
describe('wren-160-sump', () => {
  const p = parsed('wren-160-sump');

  it('runs every stage and holds the 10 mm decoy pin', () => {
    expect(p.stages).toEqual(['order', 'pins', 'pattern', 'wrench', 'final-check']);
    const decoys = p.parts.filter((x) => x.decoy);
    expect(decoys.map((x) => x.key)).toEqual(['dowel-pin-10']);
    expect(decoys[0]!.pin).toEqual({ diameterMm: 10, lengthMm: 20 });
    expect(p.pinSeats).toEqual([
      { part: 'dowel-pin-8', anchor: 'dowel-hole-a' },
      { part: 'dowel-pin-8', anchor: 'dowel-hole-b' },
    ]);
    // The decoy fits none of the locating holes.
    const holes = p.anchors.filter((a) => a.kind === 'locating-hole').map((a) => a.sizeMm);
    expect(holes).not.toContain(decoys[0]!.pin!.diameterMm);
  });

  it('puts the dowel pins in two steps with no order between them, both before the gasket', () => {
    expect(unordered(p, 'dowel-pin-a', 'dowel-pin-b')).toBe(true);
    expect([...ancestors(p, 'fit-gasket')]).toEqual(expect.arrayContaining(['dowel-pin-a', 'dowel-pin-b']));
  });

  it('seats the sump only after the gasket, lube and timing marks, and bolts after that', () => {
    expect([...ancestors(p, 'seat-sump-cover')]).toEqual(
      expect.arrayContaining(['fit-gasket', 'lube-cam-and-bearings', 'align-timing-marks', 'check-oil-seal']),
    );
    // Common practice, no source: start by hand, run down snug across the part, torque across, check once around.
    const chain = ['seat-sump-cover', 'start-bolts-by-hand', 'run-bolts-snug', 'torque-cross-pattern', 'check-once-around'];
    chain.slice(1).forEach((k, i) => expect(ancestors(p, k).has(chain[i]!)).toBe(true));
    expect(p.steps.find((s) => s.key === 'lube-cam-and-bearings')?.caution).toMatch(/spark|flame/);
  });

  it('torques eight flange bolts in a cross pattern, two passes, to 11 N·m', () => {
    const [g] = p.fastenerGroups;
    expect(g).toMatchObject({ part: 'flange-bolt', rule: 'cross', passes: [0.5, 1], axis: [0, 1, 0] });
    expect(g!.torque).toEqual({ value: 11, unit: 'N·m', tolerancePct: 10 });
    expect(g!.bolts.map((b) => b.anchor)).toEqual([1, 2, 3, 4, 5, 6, 7, 8].map((n) => `sump-bolt-${n}`));
    expect(p.wrench).toMatchObject({ specShownIn: 'N·m', dialUnit: 'in·lbf', wrenchLength: 10, extension: 0 });
    expect(p.finalCheck).toEqual({ fastenerCount: 8, crankTurns: 2 });
  });
});

describe('wren-160-head', () => {
  const p = parsed('wren-160-head');

  it('seats two sleeves in either order before the new gasket, then the head and five bolts', () => {
    expect(p.stages).toEqual(['order', 'pins', 'pattern', 'wrench', 'final-check']);
    expect(unordered(p, 'sleeve-a', 'sleeve-b')).toBe(true);
    expect([...ancestors(p, 'fit-head-gasket')]).toEqual(expect.arrayContaining(['sleeve-a', 'sleeve-b']));
    expect(ancestors(p, 'start-head-bolts').has('seat-head')).toBe(true);
    expect(p.pinSeats.map((s) => s.anchor)).toEqual(['sleeve-hole-a', 'sleeve-hole-b']);
  });

  it('takes five head bolts to 24 N·m in three passes, opposite rule, with a forward extension', () => {
    const [g] = p.fastenerGroups;
    expect(g!.bolts).toHaveLength(5);
    expect(g!.torque).toEqual({ value: 24, unit: 'N·m', tolerancePct: 10 });
    expect(g!.passes).toEqual([1 / 3, 2 / 3, 1]);
    expect(g!.rule).toBe('opposite');
    expect(p.wrench).toMatchObject({ wrenchLength: 12, extension: 2, lengthUnit: 'in', direction: 'forward' });
    expect(['in·lbf', 'ft·lbf']).toContain(p.wrench!.dialUnit);
    expect(p.finalCheck).toEqual({ fastenerCount: 5, crankTurns: 2 });
  });
});

describe('wren-160-flywheel', () => {
  const p = parsed('wren-160-flywheel');

  it('has no pattern stage and keys the flywheel before fitting it, nut last', () => {
    expect(p.stages).toEqual(['order', 'wrench', 'final-check']);
    const order = ['clean-taper', 'fit-flywheel-key', 'fit-flywheel', 'fit-washer', 'start-nut', 'torque-nut'];
    order.slice(1).forEach((k, i) => expect(ancestors(p, k).has(order[i]!)).toBe(true));
    expect(ancestors(p, 'torque-nut').has('hold-with-strap')).toBe(true);
  });

  it('torques one nut on the shaft end to 65 N·m, dialled in ft·lbf with an adapter pointing back', () => {
    const [g] = p.fastenerGroups;
    expect(g!.bolts).toEqual([{ key: 'nut', anchor: 'crank-thread-end' }]);
    expect(g!.torque).toEqual({ value: 65, unit: 'N·m', tolerancePct: 10 });
    expect(g!.rule).toBe('opposite');
    expect(p.wrench).toMatchObject({ dialUnit: 'ft·lbf', direction: 'back' });
    expect(p.finalCheck).toEqual({ fastenerCount: 1, crankTurns: 2 });
  });
});

describe('wren-160-spark-plug', () => {
  const p = parsed('wren-160-spark-plug');

  it('checks the gap first and reconnects the lead only at the end', () => {
    expect(p.stages).toEqual(['order', 'wrench', 'final-check']);
    const others = p.steps.map((s) => s.key).filter((k) => k !== 'reconnect-lead');
    expect([...ancestors(p, 'reconnect-lead')].sort()).toEqual(others.sort());
    expect(ancestors(p, 'check-gap').size).toBe(0);
  });

  it('states the gap in both units consistently', () => {
    const text = p.steps.find((s) => s.key === 'check-gap')!.text;
    const mm = Number(/([\d.]+) mm/.exec(text)?.[1]);
    const inches = Number(/([\d.]+) in\b/.exec(text)?.[1]);
    expect([mm, inches]).toEqual([0.76, 0.03]);
    // NIST SP 811 (2008), App. B: 1 in = 25.4 mm exactly; the text rounds 0.762 mm to two places.
    expect(Math.abs(inches * 25.4 - mm)).toBeLessThan(0.005);
  });

  it('torques the plug to 20 N·m, dialled in in·lbf, and turns no crank in the final check', () => {
    const [g] = p.fastenerGroups;
    expect(g!.torque).toEqual({ value: 20, unit: 'N·m', tolerancePct: 10 });
    expect(g!.bolts.map((b) => b.anchor)).toEqual(['plug-hole']);
    expect(p.wrench!.dialUnit).toBe('in·lbf');
    expect(p.finalCheck).toEqual({ fastenerCount: 1, crankTurns: 0 });
  });
});
