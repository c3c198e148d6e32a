import { describe, expect, it } from 'vitest';
import { scoreAttempt } from '~/lib/scoring';
import { procedureSchema } from '~/lib/procedure/schema';
import { SUMP_MINI_ORDER, sumpMini, sumpMiniInput } from './fixtures/sump-mini';

function scored(stage: string, answer: unknown) {
  const r = scoreAttempt(sumpMini(), stage, answer);
  if (!r.ok) throw new Error(`refused: ${JSON.stringify(r.issues)}`);
  return r.score;
}

describe('scoreAttempt', () => {
  it('dispatches each stage to its scorer', () => {
    expect(scored('order', { sequence: SUMP_MINI_ORDER })).toMatchObject({ stage: 'order', passed: true });
    expect(
      scored('pins', {
        placements: [
          { part: 'dowel-8', anchor: 'loc-a' },
          { part: 'dowel-8', anchor: 'loc-b' },
        ],
      }),
    ).toMatchObject({ stage: 'pins', passed: true });
    expect(scored('final-check', { fastenersCounted: 4, crankTurns: 2 })).toMatchObject({ stage: 'final-check', passed: true });
  });

  it('scores the pattern of the first group, with bolt positions from the anchors', () => {
    // Cross pattern for 4 bolts on a circle, 1-3-2-4 (from memory of ASME PCC-1, legacy cross pattern);
    // passes at 50 % and 100 % of 11 N·m are the fixture's demo values.
    const passes = [
      { torque: 5.5, sequence: ['b1', 'b3', 'b2', 'b4'] },
      { torque: 11, sequence: ['b1', 'b3', 'b2', 'b4'] },
    ];
    expect(scored('pattern', { passes })).toMatchObject({ stage: 'pattern', passed: true });
    expect(scored('pattern', { group: 'sump-bolts', passes })).toMatchObject({ stage: 'pattern', passed: true });
    // Round the circle instead of across it
    const around = passes.map((p) => ({ ...p, sequence: ['b1', 'b2', 'b3', 'b4'] }));
    expect(scored('pattern', { passes: around })).toMatchObject({ stage: 'pattern', passed: false });
  });

  it('scores the wrench setting against the group spec', () => {
    // NIST SP 811 (2008), App. B.9: 1 N·m = 8.850745791327185 lbf·in → 11 N·m = 97.36 in·lbf, no extension
    expect(scored('wrench', { setting: 97.36, unit: 'in·lbf' })).toMatchObject({ stage: 'wrench', passed: true });
    // Common practice, no source: dialling the N·m number on an inch-pound wrench is the classic unit mistake
    expect(scored('wrench', { setting: 11, unit: 'in·lbf' })).toMatchObject({ stage: 'wrench', passed: false });
  });

  it('refuses an unknown stage or one the procedure does not have', () => {
    expect(scoreAttempt(sumpMini(), 'glue', {})).toEqual({ ok: false, issues: [{ path: 'stage', message: 'there is no stage "glue"' }] });
    const input = sumpMiniInput();
    input.stages = ['order'];
    expect(scoreAttempt(procedureSchema.parse(input), 'pins', { placements: [] })).toEqual({
      ok: false,
      issues: [{ path: 'stage', message: 'procedure wren-160-sump-mini has no pins stage' }],
    });
  });

  it('refuses a malformed answer with paths under "answer"', () => {
    const r = scoreAttempt(sumpMini(), 'order', { sequence: 'pin-a' });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues.map((i) => i.path)).toEqual(['answer.sequence']);
    const w = scoreAttempt(sumpMini(), 'wrench', { setting: 97, unit: 'lb' });
    expect(!w.ok && w.issues.map((i) => i.path)).toEqual(['answer.unit']);
    const f = scoreAttempt(sumpMini(), 'final-check', { fastenersCounted: 3.5, crankTurns: 2 });
    expect(!f.ok && f.issues.map((i) => i.path)).toEqual(['answer.fastenersCounted']);
  });

  it('refuses a pattern answer for a group the procedure does not have', () => {
    expect(scoreAttempt(sumpMini(), 'pattern', { group: 'head-bolts', passes: [{ torque: 1, sequence: [] }] })).toEqual({
      ok: false,
      issues: [{ path: 'answer.group', message: 'there is no fastener group "head-bolts"' }],
    });
  });
});
