import { describe, expect, it } from 'vitest';
import { scoreFinalCheck } from '~/lib/scoring/final-check';
import { procedureSchema } from '~/lib/procedure/schema';
import { sumpMini, sumpMiniInput } from './fixtures/sump-mini';

// Rule from the brief (common practice, no source): every fastener accounted for, none left over,
// and the crankshaft turned at least the set number of turns without binding. Fixture: 4 bolts, 2 turns.

describe('scoreFinalCheck', () => {
  it('passes 4 of 4 fasteners, none left over, two turns', () => {
    const s = scoreFinalCheck(sumpMini(), { fastenersCounted: 4, crankTurns: 2, leftover: 0 });
    expect(s).toMatchObject({ stage: 'final-check', score: 2, maxScore: 2, passed: true });
    expect(s.results.map((r) => r.key)).toEqual(['fasteners', 'leftover', 'crank-turns']);
  });

  it('accepts more turns than required and no leftover count', () => {
    const s = scoreFinalCheck(sumpMini(), { fastenersCounted: 4, crankTurns: 3 });
    expect(s).toMatchObject({ score: 2, passed: true });
    expect(s.results.map((r) => r.key)).toEqual(['fasteners', 'crank-turns']);
  });

  it('fails a wrong count', () => {
    const s = scoreFinalCheck(sumpMini(), { fastenersCounted: 3, crankTurns: 2 });
    expect(s).toMatchObject({ score: 1, passed: false });
    expect(s.results[0]).toEqual({
      key: 'fasteners',
      ok: false,
      message: 'Counted 3 fasteners; the job uses 4, so count again before you close up',
    });
  });

  it('fails a leftover fastener even when the count matches', () => {
    const s = scoreFinalCheck(sumpMini(), { fastenersCounted: 4, crankTurns: 2, leftover: 1 });
    expect(s).toMatchObject({ score: 1, passed: false });
    expect(s.results.find((r) => r.key === 'leftover')!.ok).toBe(false);
  });

  it('fails too few crank turns', () => {
    const s = scoreFinalCheck(sumpMini(), { fastenersCounted: 4, crankTurns: 1.5 });
    expect(s).toMatchObject({ score: 1, passed: false });
    expect(s.results.find((r) => r.key === 'crank-turns')!.message).toBe(
      'Turned the crankshaft 1.5 times; turn it at least 2 full turns to show nothing binds',
    );
  });

  it('scores zero when both are wrong', () => {
    expect(scoreFinalCheck(sumpMini(), { fastenersCounted: 0, crankTurns: 0 }).score).toBe(0);
  });

  it('throws for a procedure without a final check (the dispatcher refuses that stage first)', () => {
    const input = sumpMiniInput();
    delete input.finalCheck;
    expect(() => scoreFinalCheck(procedureSchema.parse(input), { fastenersCounted: 4, crankTurns: 2 })).toThrow(
      /no final check/,
    );
  });
});
