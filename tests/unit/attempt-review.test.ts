import { describe, expect, it } from 'vitest';
import { reviewFrames } from '~/lib/results/attempt-review';
import { scoreAttempt } from '~/lib/scoring';
import { correctAnswer } from '~/lib/procedure/reference-answers';
import type { Procedure, Stage } from '~/lib/procedure/schema';
import { demoProcedure } from '../support/demo-procedures';

// The review replays an answer frame by frame with the scorer's own lines; every line appears once.

const sump = demoProcedure('wren-160-sump');

function review(procedure: Procedure, stage: Stage, answer: unknown) {
  const scored = scoreAttempt(procedure, stage, answer);
  if (!scored.ok) throw new Error('bad answer in the test');
  const frames = reviewFrames(procedure, stage, answer, scored.score.results);
  // Nothing lost, nothing shown twice.
  expect(frames.flatMap((f) => f.lines)).toHaveLength(scored.score.results.length);
  expect(new Set(frames.flatMap((f) => f.lines))).toEqual(new Set(scored.score.results));
  return frames;
}

describe('reviewFrames', () => {
  it('order: one frame per placed step, in the learner\'s order, then the steps left out', () => {
    const sequence = (correctAnswer(sump, 'order') as { sequence: string[] }).sequence;
    const answer = { sequence: ['fit-gasket', ...sequence.filter((k) => k !== 'fit-gasket' && k !== 'check-once-around'), 'no-such-step'] };
    const frames = review(sump, 'order', answer);
    expect(frames[0]!.title).toBe('Step 1: Lay a new sump gasket on the crankcase face over both dowel pins.');
    expect(frames[0]!.lines).toEqual([expect.objectContaining({ key: 'fit-gasket', ok: false })]);
    expect(frames.at(-2)!.title).toMatch(/“no-such-step”, not a step of this procedure/);
    expect(frames.at(-1)!.title).toBe('Also found');
    expect(frames.at(-1)!.lines).toEqual([expect.objectContaining({ key: 'check-once-around', ok: false })]);
  });

  it('pins: one frame per pin placed; the decoy left in the kit comes last', () => {
    const answer = { placements: [{ part: 'dowel-pin-10', anchor: 'dowel-hole-a' }, { part: 'dowel-pin-8', anchor: 'dowel-hole-b' }] };
    const frames = review(sump, 'pins', answer);
    expect(frames.map((f) => f.title)).toEqual(['Pin 1: 10 mm dowel pin into Dowel hole A', 'Pin 2: 8 mm dowel pin into Dowel hole B']);
    // The decoy's own line (used when it must stay in the kit) belongs with the pin that used it.
    expect(frames[0]!.lines.map((l) => [l.key, l.ok])).toEqual([
      ['dowel-hole-a', false],
      ['dowel-pin-10', false],
    ]);
    expect(frames[1]!.lines.every((l) => l.ok)).toBe(true);
  });

  it('pattern: one frame per pass with its bolt sequence and torque', () => {
    const right = correctAnswer(sump, 'pattern') as { group: string; passes: { torque: number; sequence: string[] }[] };
    const answer = { ...right, passes: [right.passes[0]!, { ...right.passes[1]!, torque: 20 }] };
    const frames = review(sump, 'pattern', answer);
    expect(frames).toHaveLength(2);
    expect(frames[0]!.title).toBe(`Pass 1 of 2 at ${right.passes[0]!.torque} N·m`);
    expect(frames[0]!.detail).toHaveLength(8);
    expect(frames[0]!.detail[0]).toMatch(/^1\. Bolt \d$/);
    expect(frames[0]!.lines.map((l) => l.key)).toEqual(['passes', 'pass-1', 'pass-1-torque']);
    expect(frames[1]!.lines.find((l) => l.key === 'pass-2-torque')!.ok).toBe(false);
  });

  it('wrench and final check: the setting, then each check', () => {
    const wrench = review(sump, 'wrench', { setting: 11, unit: 'N·m' });
    expect(wrench).toEqual([{ title: 'Dial set to 11 N·m', detail: [], lines: [expect.objectContaining({ key: 'unit' }), expect.objectContaining({ key: 'setting' })] }]);
    const check = review(sump, 'final-check', { fastenersCounted: 7, crankTurns: 2, leftover: 1 });
    expect(check.map((f) => [f.title, f.lines.map((l) => l.ok)])).toEqual([
      ['Counted 7 fasteners', [false]],
      ['1 left over on the bench', [false]],
      ['Turned the crankshaft 2 times', [true]],
    ]);
  });

  it('an answer that no longer reads as its stage still shows every line', () => {
    const results = [{ key: 'x', ok: false, message: 'kept' }];
    expect(reviewFrames(sump, 'order', { nonsense: true }, results)).toEqual([{ title: 'Results', detail: [], lines: results }]);
  });
});
