import { describe, expect, it } from 'vitest';
import { validateProcedure, type Issue } from '~/lib/procedure/validate';
import type { ProcedureInput } from '~/lib/procedure/schema';
import { sumpMiniInput } from './fixtures/sump-mini';

// The rules are this project's own (see validate.ts); each case breaks one rule in a valid document
// and checks the issue names the offending key at the right path.

function issuesAfter(change: (p: ProcedureInput) => void): Issue[] {
  const input = sumpMiniInput();
  change(input);
  const r = validateProcedure(input);
  if (r.ok) throw new Error('expected the document to be refused');
  return r.issues;
}

describe('validateProcedure', () => {
  it('accepts the fixture and fills defaults', () => {
    const r = validateProcedure(sumpMiniInput());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.procedure.parts.find((p) => p.key === 'crankcase')).toMatchObject({ count: 1, decoy: false });
    expect(r.procedure.steps[0]!.after).toEqual([]);
    expect(r.procedure.wrench).toMatchObject({ extension: 0, direction: 'forward' });
  });

  it('reports schema errors with dotted paths and stops there', () => {
    const issues = issuesAfter((p) => {
      p.steps[3]!.after = ['Not A Key'];
    });
    expect(issues).toEqual([{ path: 'steps.3.after.0', message: 'use lower-case letters, digits and dashes' }]);
    expect(validateProcedure(null).ok).toBe(false);
  });

  const cases: [string, (p: ProcedureInput) => void, Issue][] = [
    ['duplicate part', (p) => void p.parts.push({ ...p.parts[0]!, name: 'Other' }), { path: 'parts.8.key', message: 'duplicate part key crankcase' }],
    ['duplicate anchor', (p) => void p.anchors!.push({ ...p.anchors![2]! }), { path: 'anchors.7.key', message: 'duplicate anchor key h1' }],
    ['duplicate step', (p) => void p.steps.push({ key: 'lube', text: 'Lube again' }), { path: 'steps.7.key', message: 'duplicate step key lube' }],
    [
      'duplicate group',
      (p) => void p.fastenerGroups!.push({ ...p.fastenerGroups![0]!, bolts: [{ key: 'b9', anchor: 'loc-a' }] }),
      { path: 'fastenerGroups.1.key', message: 'duplicate group key sump-bolts' },
    ],
    [
      'duplicate bolt',
      (p) => void (p.fastenerGroups![0]!.bolts[1]!.key = 'b1'),
      { path: 'fastenerGroups.0.bolts.1.key', message: 'duplicate bolt key b1' },
    ],
    ['step names a missing part', (p) => void p.steps[1]!.parts!.push('dowel-6'), { path: 'steps.1.parts.1', message: 'step pin-a names part dowel-6, which is not in the parts list' }],
    ['step waits for a missing step', (p) => void (p.steps[4]!.after = ['warm-up']), { path: 'steps.4.after.0', message: 'step lube waits for step warm-up, which does not exist' }],
    [
      'cycle',
      (p) => void p.steps[3]!.after!.push('seat-sump'),
      { path: 'steps.3.after', message: 'steps form a cycle: fit-gasket → seat-sump → fit-gasket' },
    ],
    ['anchor on a missing part', (p) => void (p.anchors![0]!.part = 'cylinder'), { path: 'anchors.0.part', message: 'anchor loc-a sits on part cylinder, which is not in the parts list' }],
    ['pin seat part missing', (p) => void (p.pinSeats![0]!.part = 'dowel-6'), { path: 'pinSeats.0.part', message: 'pin seat names part dowel-6, which is not in the parts list' }],
    ['pin seat part not a pin', (p) => void (p.pinSeats![0]!.part = 'sump-gasket'), { path: 'pinSeats.0.part', message: 'pin seat uses sump-gasket, which is not a dowel pin or sleeve' }],
    ['pin seat hole missing', (p) => void (p.pinSeats![1]!.anchor = 'loc-c'), { path: 'pinSeats.1.anchor', message: 'pin seat names hole loc-c, which is not an anchor' }],
    ['pin seat in a threaded hole', (p) => void (p.pinSeats![1]!.anchor = 'h2'), { path: 'pinSeats.1.anchor', message: 'pin seat names h2, a threaded-hole, not a locating hole' }],
    ['two seats in one hole', (p) => void (p.pinSeats![1]!.anchor = 'loc-a'), { path: 'pinSeats.1.anchor', message: 'hole loc-a has two pin seats' }],
    ['pin bigger than its hole', (p) => void (p.anchors![1]!.sizeMm = 6), { path: 'pinSeats.1', message: 'pin dowel-8 is 8 mm across but hole loc-b is 6 mm' }],
    ['pin without a hole', (p) => void (p.pinSeats = []), { path: 'parts.4', message: 'pin dowel-8 has no hole' }],
    ['pin without a size', (p) => void delete p.parts[4]!.pin, { path: 'parts.4.pin', message: 'pin dowel-8 needs its size (diameterMm, lengthMm)' }],
    ['more seats than pins', (p) => void (p.parts[4]!.count = 1), { path: 'parts.4.count', message: 'pin dowel-8 has 2 seats but the kit holds 1' }],
    ['decoy with a seat', (p) => void (p.pinSeats![1]!.part = 'dowel-10'), { path: 'pinSeats.1.part', message: 'pin dowel-10 is a decoy but has a seat in hole loc-b' }],
    ['group part missing', (p) => void (p.fastenerGroups![0]!.part = 'cap-screw'), { path: 'fastenerGroups.0.part', message: 'group sump-bolts uses part cap-screw, which is not in the parts list' }],
    ['bolt hole missing', (p) => void (p.fastenerGroups![0]!.bolts[2]!.anchor = 'h9'), { path: 'fastenerGroups.0.bolts.2.anchor', message: 'bolt b3 goes into h9, which is not an anchor' }],
    ['bolt in a locating hole', (p) => void (p.fastenerGroups![0]!.bolts[2]!.anchor = 'loc-a'), { path: 'fastenerGroups.0.bolts.2.anchor', message: 'bolt b3 goes into loc-a, a locating-hole, not a threaded hole' }],
    ['two bolts in one hole', (p) => void (p.fastenerGroups![0]!.bolts[3]!.anchor = 'h1'), { path: 'fastenerGroups.0.bolts.3.anchor', message: 'bolts b1 and b4 share hole h1' }],
    ['more bolts than the kit holds', (p) => void (p.parts[6]!.count = 3), { path: 'fastenerGroups.0.bolts', message: 'group sump-bolts needs 4 of flange-bolt but the kit holds 3' }],
    ['passes not rising', (p) => void (p.fastenerGroups![0]!.passes = [0.5, 0.5, 1]), { path: 'fastenerGroups.0.passes.1', message: 'passes must rise: pass 2 (0.5) is not above pass 1 (0.5)' }],
    ['last pass below 1', (p) => void (p.fastenerGroups![0]!.passes = [0.3, 0.8]), { path: 'fastenerGroups.0.passes.1', message: 'the last pass must be the full torque (1), not 0.8' }],
    ['wrench names a missing group', (p) => void (p.wrench!.group = 'head-bolts'), { path: 'wrench.group', message: 'wrench task names group head-bolts, which does not exist' }],
    ['stage pins without seats', (p) => { p.pinSeats = []; p.parts.splice(4, 1); }, { path: 'stages.1', message: 'stage pins needs at least one pin seat' }],
    ['stage wrench without a task', (p) => void delete p.wrench, { path: 'stages.3', message: 'stage wrench needs a wrench task' }],
    ['stage final-check without one', (p) => void delete p.finalCheck, { path: 'stages.4', message: 'stage final-check needs finalCheck' }],
    ['stage listed twice', (p) => void p.stages.push('order'), { path: 'stages.5', message: 'stage order is listed twice' }],
  ];

  it.each(cases)('refuses: %s', (_name, change, expected) => {
    expect(issuesAfter(change)).toContainEqual(expected);
  });

  it('refuses a pattern stage with no fastener group (and the wrench task that named it)', () => {
    const issues = issuesAfter((p) => {
      p.fastenerGroups = [];
    });
    expect(issues).toContainEqual({ path: 'stages.2', message: 'stage pattern needs a fastener group' });
    expect(issues).toContainEqual({ path: 'wrench.group', message: 'wrench task names group sump-bolts, which does not exist' });
  });

  it('refuses an adapter pointing back that is as long as the wrench', () => {
    const issues = issuesAfter((p) => {
      p.wrench!.extension = 10;
      p.wrench!.direction = 'back';
    });
    expect(issues).toHaveLength(1);
    expect(issues[0]!.path).toBe('wrench.extension');
    expect(issues[0]!.message).toMatch(/^wrench task: /);
  });

  it('lets a nut thread onto a shaft end, but not a bolt', () => {
    const withShaft = (kind: 'nut' | 'bolt') => (p: ProcedureInput) => {
      p.parts[6]!.kind = kind;
      p.anchors!.push({ key: 'crank-end', part: 'crankcase', kind: 'shaft-end', position: [0, 0, 0.1], sizeMm: 16 });
      p.fastenerGroups![0]!.bolts[0]!.anchor = 'crank-end';
    };
    const nut = sumpMiniInput();
    withShaft('nut')(nut);
    expect(validateProcedure(nut).ok).toBe(true);
    expect(issuesAfter(withShaft('bolt'))).toEqual([
      { path: 'fastenerGroups.0.bolts.0.anchor', message: 'bolt b1 goes into crank-end, a shaft-end, not a threaded hole' },
    ]);
  });
});
