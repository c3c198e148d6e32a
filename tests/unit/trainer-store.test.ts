import { describe, expect, it } from 'vitest';
import { answerFor, createTrainerStore, emptyDrafts, patternUnit, type AttemptResult } from '~/components/trainer/store';
import { toPublicProcedure } from '~/lib/procedure/public-view';
import { correctAnswer } from '~/lib/procedure/reference-answers';
import { STAGES, type Stage } from '~/lib/procedure/schema';
import { scoreAttempt } from '~/lib/scoring';
import { answerSchemas, type PatternAnswer, type PinsAnswer, type WrenchAnswer } from '~/lib/scoring/answers';
import { demoProcedure } from '../support/demo-procedures';

// The trainer store: every path (canvas, lists, keyboard) changes the learner's work through these actions.

const procedure = demoProcedure('wren-160-sump');
const view = toPublicProcedure(procedure, 'learner-1:wren-160-sump:1');
const fresh = () => createTrainerStore(view);
const stepKeys = view.steps.map((s) => s.key);

const result = (passed: boolean): AttemptResult => ({
  id: 'a1',
  score: passed ? 2 : 1,
  maxScore: 2,
  passed,
  results: [{ key: 'x', ok: passed, message: 'm' }],
  notes: [],
});

describe('order', () => {
  it('places steps one after another, once each, and counts each change', () => {
    const store = fresh();
    store.getState().placeStep(stepKeys[2]!);
    store.getState().placeStep(stepKeys[0]!);
    store.getState().placeStep(stepKeys[2]!);
    expect(store.getState().drafts.order.sequence).toEqual([stepKeys[2], stepKeys[0]]);
    expect(store.getState().revision).toBe(2);
    expect(store.getState().announcement).toContain('Placed step 2');
  });

  it('moves a step to a new position and ignores moves off the list', () => {
    const store = fresh();
    for (const key of stepKeys.slice(0, 4)) store.getState().placeStep(key);
    store.getState().moveStep(0, 2);
    expect(store.getState().drafts.order.sequence).toEqual([stepKeys[1], stepKeys[2], stepKeys[0], stepKeys[3]]);
    store.getState().moveStep(3, 0);
    expect(store.getState().drafts.order.sequence).toEqual([stepKeys[3], stepKeys[1], stepKeys[2], stepKeys[0]]);
    store.getState().moveStep(1, 9);
    expect(store.getState().drafts.order.sequence).toEqual([stepKeys[3], stepKeys[1], stepKeys[2], stepKeys[0]]);
  });

  it('takes a step back out', () => {
    const store = fresh();
    for (const key of stepKeys.slice(0, 3)) store.getState().placeStep(key);
    store.getState().removeStep(stepKeys[1]!);
    expect(store.getState().drafts.order.sequence).toEqual([stepKeys[0], stepKeys[2]]);
  });
});

describe('pins', () => {
  it('puts the picked pin in a hole and lets go of it', () => {
    const store = fresh();
    store.getState().placePin('dowel-hole-a');
    expect(store.getState().drafts.pins.placements).toEqual([]);
    store.getState().selectPin('dowel-pin-8');
    store.getState().placePin('dowel-hole-a');
    expect(store.getState().drafts.pins.placements).toEqual([{ part: 'dowel-pin-8', anchor: 'dowel-hole-a' }]);
    expect(store.getState().selectedPin).toBeNull();
    expect(store.getState().announcement).toContain('Dowel hole A');
  });

  it('holds one pin per hole: a second pin replaces the first', () => {
    const store = fresh();
    store.getState().placePin('dowel-hole-a', 'dowel-pin-8');
    store.getState().placePin('dowel-hole-a', 'dowel-pin-10');
    expect(store.getState().drafts.pins.placements).toEqual([{ part: 'dowel-pin-10', anchor: 'dowel-hole-a' }]);
  });

  it('uses no more of a pin than the kit holds', () => {
    const store = fresh();
    // The demo kit has two 8 mm pins and one 10 mm pin.
    store.getState().placePin('dowel-hole-a', 'dowel-pin-8');
    store.getState().placePin('dowel-hole-b', 'dowel-pin-8');
    store.getState().placePin('sump-bolt-1', 'dowel-pin-8');
    expect(store.getState().drafts.pins.placements.map((p) => p.anchor)).toEqual(['dowel-hole-a', 'dowel-hole-b']);
    expect(store.getState().announcement).toContain('No');
    // Moving a pin within the same hole is not an extra pin.
    store.getState().placePin('dowel-hole-b', 'dowel-pin-8');
    expect(store.getState().drafts.pins.placements).toHaveLength(2);
    store.getState().removePin('dowel-hole-a');
    expect(store.getState().drafts.pins.placements).toEqual([{ part: 'dowel-pin-8', anchor: 'dowel-hole-b' }]);
  });
});

describe('pattern', () => {
  it('taps bolts into the active pass, each bolt once', () => {
    const store = fresh();
    store.getState().tapBolt('bolt-1');
    store.getState().tapBolt('bolt-5');
    store.getState().tapBolt('bolt-1');
    expect(store.getState().drafts.pattern.passes[0]!.sequence).toEqual(['bolt-1', 'bolt-5']);
    expect(store.getState().announcement).toBe('Pass 1: Bolt 5 is number 2');
  });

  it('keeps each pass to itself: undo and clear touch only the active pass', () => {
    const store = fresh();
    store.getState().tapBolt('bolt-1');
    store.getState().tapBolt('bolt-5');
    store.getState().setActivePass(1);
    store.getState().tapBolt('bolt-3');
    store.getState().tapBolt('bolt-7');
    store.getState().undoBolt();
    expect(store.getState().drafts.pattern.passes.map((p) => p.sequence)).toEqual([['bolt-1', 'bolt-5'], ['bolt-3']]);
    store.getState().clearPass();
    expect(store.getState().drafts.pattern.passes.map((p) => p.sequence)).toEqual([['bolt-1', 'bolt-5'], []]);
    store.getState().setActivePass(7);
    expect(store.getState().drafts.pattern.activePass).toBe(1);
    expect(store.getState().announcement).toBe('Pass 2');
  });

  it('sets a torque per pass', () => {
    const store = fresh();
    store.getState().setPassTorque(1, 11);
    expect(store.getState().drafts.pattern.passes.map((p) => p.torque)).toEqual([null, 11]);
  });
});

describe('final check', () => {
  it('adds crank turns, never below zero, and says each full turn', () => {
    const store = fresh();
    for (let i = 0; i < 5; i++) store.getState().addCrankTurn(0.25);
    expect(store.getState().drafts['final-check'].crankTurns).toBe(1.25);
    store.getState().addCrankTurn(-3);
    expect(store.getState().drafts['final-check'].crankTurns).toBe(0);
    for (let i = 0; i < 4; i++) store.getState().addCrankTurn(0.25);
    expect(store.getState().announcement).toBe('Crankshaft turned 1 full turn');
  });
});

describe('resetStage', () => {
  it("clears the stage's draft and result and leaves the others", () => {
    const store = fresh();
    store.getState().placeStep(stepKeys[0]!);
    store.getState().tapBolt('bolt-2');
    store.getState().setResult('order', result(false));
    store.getState().setResult('pattern', result(true));
    const before = store.getState().revision;
    store.getState().resetStage('order');
    const state = store.getState();
    expect(state.drafts.order).toEqual({ sequence: [] });
    expect(state.results.order).toBeUndefined();
    expect(state.drafts.pattern.passes[0]!.sequence).toEqual(['bolt-2']);
    expect(state.results.pattern?.passed).toBe(true);
    expect(state.revision).toBe(before + 1);
  });
});

describe('restoreDrafts', () => {
  it('replaces the work without counting it as an edit', () => {
    const store = fresh();
    store.getState().placeStep(stepKeys[0]!);
    const revision = store.getState().revision;
    store.getState().restoreDrafts({ order: { sequence: [stepKeys[3]!, stepKeys[4]!] } });
    expect(store.getState().drafts.order.sequence).toEqual([stepKeys[3], stepKeys[4]]);
    expect(store.getState().drafts.pins).toEqual(emptyDrafts(view).pins);
    expect(store.getState().revision).toBe(revision);
  });

  it('drops a pattern draft that does not fit the group', () => {
    const store = fresh();
    store.getState().restoreDrafts({ pattern: { group: 'sump-bolts', passes: [{ torque: 1, sequence: ['bolt-1'] }], activePass: 0 } });
    expect(store.getState().drafts.pattern).toEqual(emptyDrafts(view).pattern);
  });
});

describe('answerFor', () => {
  it('gives answers the server accepts for empty work', () => {
    const drafts = emptyDrafts(view);
    for (const stage of STAGES) expect(answerSchemas[stage].safeParse(answerFor(stage, drafts)).success, stage).toBe(true);
  });

  it('builds exactly the answer shapes of each stage', () => {
    const store = fresh();
    store.getState().placeStep(stepKeys[1]!);
    store.getState().placePin('dowel-hole-a', 'dowel-pin-8');
    store.getState().tapBolt('bolt-4');
    store.getState().setPassTorque(0, 5.5);
    store.getState().setWrench(97, 'in·lbf');
    store.getState().setFastenersCounted(8);
    store.getState().setLeftover(0);
    store.getState().addCrankTurn(2.75);
    const drafts = store.getState().drafts;
    const expected: Record<Stage, unknown> = {
      order: { sequence: [stepKeys[1]] },
      pins: { placements: [{ part: 'dowel-pin-8', anchor: 'dowel-hole-a' }] },
      pattern: { group: 'sump-bolts', passes: [{ torque: 5.5, sequence: ['bolt-4'] }, { torque: 0, sequence: [] }] },
      wrench: { setting: 97, unit: 'in·lbf' },
      'final-check': { fastenersCounted: 8, crankTurns: 2, leftover: 0 },
    };
    for (const stage of STAGES) {
      const answer = answerFor(stage, drafts);
      expect(answer, stage).toEqual(expected[stage]);
      // strict() would reject extra keys the scorer does not know.
      expect(answerSchemas[stage].strict().parse(answer), stage).toEqual(expected[stage]);
    }
  });

  it('scores full marks when the store is driven to the worked-out answer', () => {
    const store = fresh();
    const s = () => store.getState();
    for (const key of (correctAnswer(procedure, 'order') as { sequence: string[] }).sequence) s().placeStep(key);
    for (const p of (correctAnswer(procedure, 'pins') as PinsAnswer).placements) {
      s().selectPin(p.part);
      s().placePin(p.anchor);
    }
    (correctAnswer(procedure, 'pattern') as PatternAnswer).passes.forEach((pass, i) => {
      s().setActivePass(i);
      s().setPassTorque(i, pass.torque);
      for (const bolt of pass.sequence) s().tapBolt(bolt);
    });
    // 11 N·m × 8.850745791327185 in·lbf per N·m = 97.358 in·lbf: NIST SP 811 (2008), App. B.9
    expect(patternUnit(view)).toBe('N·m');
    const wrench = correctAnswer(procedure, 'wrench') as WrenchAnswer;
    expect(wrench.setting).toBeCloseTo(11 * 8.850745791327185, 9);
    s().setWrench(97.5, 'in·lbf');
    s().setFastenersCounted(8);
    s().setLeftover(0);
    for (let i = 0; i < 8; i++) s().addCrankTurn(0.25);

    for (const stage of procedure.stages) {
      const scored = scoreAttempt(procedure, stage, answerFor(stage, s().drafts));
      expect(scored.ok, stage).toBe(true);
      if (scored.ok) expect([stage, scored.score.score]).toEqual([stage, scored.score.maxScore]);
    }
  });

  it('scores the classic wrong-unit mistake: the N·m number dialled on an in·lbf wrench as in·lbf', () => {
    const store = fresh();
    store.getState().setWrench(11);
    const scored = scoreAttempt(procedure, 'wrench', answerFor('wrench', store.getState().drafts));
    expect(scored.ok && scored.score.passed).toBe(false);
  });
});
