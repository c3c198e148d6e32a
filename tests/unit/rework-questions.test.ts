import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { demoProcedure } from '../support/demo-procedures';
import { dagArb, permutations, procedureFromDag } from './fixtures/random-dag';
import { sumpMini } from './fixtures/sump-mini';
import { STAGES, type Procedure, type Stage } from '~/lib/procedure/schema';
import { isLinearExtension } from '~/lib/procedure/graph';
import { correctAnswer } from '~/lib/procedure/reference-answers';
import { nextBolts } from '~/lib/patterns';
import { groupBoltPositions, scorePattern } from '~/lib/scoring/pattern';
import { scoreWrench } from '~/lib/scoring/wrench';
import { asker, buildQuestion, canAsk, scoreAnswer } from '~/lib/rework/questions';
import { judgeNextBolt } from '~/lib/rework/ask-pattern';
import { NO_PIN } from '~/lib/rework/ask-pins';
import { missesOf } from '~/lib/rework/misses';

const SLUGS = ['wren-160-sump', 'wren-160-head', 'wren-160-flywheel', 'wren-160-spark-plug'];
const sump = demoProcedure('wren-160-sump');
const head = demoProcedure('wren-160-head');

/** Choices a question accepts, judged one by one. */
function accepted(procedure: Procedure, stage: Stage, key: string, variant = 0): string[] {
  const verdict = scoreAnswer(procedure, stage, key, variant, buildQuestion(procedure, stage, key, variant)!.choices[0]!.id);
  if (!verdict.ok) throw new Error(verdict.message);
  return [...verdict.accepted].sort();
}

/** Every key a scorer can report for a procedure's stage (what missesOf may be given). */
function itemKeys(p: Procedure, stage: Stage): string[] {
  switch (stage) {
    case 'order':
      return p.steps.map((s) => s.key);
    case 'pins':
      return [...p.anchors.map((a) => a.key), ...p.parts.map((x) => x.key)];
    case 'pattern':
      return ['passes', ...p.fastenerGroups[0]!.passes.flatMap((_, i) => [`pass-${i + 1}`, `pass-${i + 1}-torque`])];
    case 'wrench':
      return ['unit', 'setting'];
    case 'final-check':
      return ['fasteners', 'leftover', 'crank-turns'];
  }
}

describe('Order: what comes right after (or before) a step', () => {
  it('accepts exactly the steps some valid order puts right after it (brute force over every order, random DAGs)', () => {
    fc.assert(
      fc.property(dagArb(2, 6), (dag) => {
        const procedure = procedureFromDag(dag);
        const keys = dag.steps.map((s) => s.key);
        const valid = permutations(keys).filter((order) => isLinearExtension(order, dag.steps));
        for (const key of keys) {
          const question = buildQuestion(procedure, 'order', key, 1)!;
          const after = question.kind === 'next-step';
          const expected = new Set<string>();
          for (const order of valid) {
            const i = order.indexOf(key);
            const neighbour = after ? order[i + 1] : order[i - 1];
            if (neighbour) expected.add(neighbour);
          }
          expect(accepted(procedure, 'order', key, 1)).toEqual([...expected].sort());
          // "Right before" is asked only of a step that must come last.
          if (!after) expect(valid.every((order) => order[order.length - 1] === key)).toBe(true);
        }
      }),
      { numRuns: 120 },
    );
  });

  it('every neighbour in the reference order of each demo procedure is accepted', () => {
    for (const slug of SLUGS) {
      const p = demoProcedure(slug);
      const order = (correctAnswer(p, 'order') as { sequence: string[] }).sequence;
      order.forEach((key, i) => {
        const question = buildQuestion(p, 'order', key, 3)!;
        const neighbour = question.kind === 'next-step' ? order[i + 1] : order[i - 1];
        const verdict = scoreAnswer(p, 'order', key, 3, neighbour!);
        expect(verdict.ok && verdict.correct, `${slug}: ${key} → ${neighbour}`).toBe(true);
      });
    }
  });

  it('a wrong choice says why, in the Order scorer\'s words', () => {
    // The gasket cannot follow dowel pin A while pin B is still out: it needs both pins.
    const question = buildQuestion(sump, 'order', 'dowel-pin-a', 0)!;
    expect(question.kind).toBe('next-step');
    expect(question.context[0]).toContain('dowel hole A');
    const verdict = scoreAnswer(sump, 'order', 'seat-sump-cover', 0, 'fit-gasket');
    expect(verdict.ok && verdict.correct).toBe(false);
    if (!verdict.ok) return;
    expect(verdict.results[0]!.message).toMatch(/cannot come right after/);
    expect(verdict.results.some((r) => /came before/.test(r.message))).toBe(true);
  });
});

describe('Pattern: which bolt comes next in this pass', () => {
  /** One whole sequence the rule accepts, drawn by `picks` among the bolts allowed at each point. */
  function sequenceFrom(p: Procedure, picks: readonly number[]): string[] {
    const group = p.fastenerGroups[0]!;
    const bolts = groupBoltPositions(group, Object.fromEntries(p.anchors.map((a) => [a.key, a.position])));
    const done: string[] = [];
    while (done.length < bolts.length) {
      const allowed = nextBolts(bolts, group.axis, group.rule, done);
      done.push(allowed[(picks[done.length] ?? 0) % allowed.length]!);
    }
    return done;
  }

  /** The Pattern scorer's verdict on pass 1 when the learner starts with `start` and carries on as well as the rule allows. */
  function passOneOk(p: Procedure, start: string[]): boolean {
    const group = p.fastenerGroups[0]!;
    const bolts = groupBoltPositions(group, Object.fromEntries(p.anchors.map((a) => [a.key, a.position])));
    const sequence = [...start];
    while (sequence.length < bolts.length) {
      const allowed = nextBolts(bolts, group.axis, group.rule, sequence).filter((k) => !sequence.includes(k));
      sequence.push(allowed[0] ?? bolts.find((b) => !sequence.includes(b.key))!.key);
    }
    const answer = correctAnswer(p, 'pattern') as { passes: { torque: number; sequence: string[] }[] };
    const passes = answer.passes.map((pass, i) => (i === 0 ? { ...pass, sequence } : pass));
    const positions = Object.fromEntries(p.anchors.map((a) => [a.key, a.position]));
    return scorePattern(group, positions, { passes }).results.find((r) => r.key === 'pass-1')!.ok;
  }

  for (const p of [sump, head]) {
    it(`${p.slug}: every next bolt of a sequence the rule accepts is scored right, after every prefix`, () => {
      fc.assert(
        fc.property(fc.array(fc.nat(50), { minLength: 8, maxLength: 8 }), (picks) => {
          const sequence = sequenceFrom(p, picks);
          sequence.forEach((bolt, k) => expect(judgeNextBolt(p, 1, sequence.slice(0, k), bolt)!.correct).toBe(true));
        }),
        { numRuns: 60 },
      );
    });

    it(`${p.slug}: a choice is right exactly when the pass can still end in a sequence the scorer passes`, () => {
      fc.assert(
        fc.property(fc.nat(999_999), (variant) => {
          const question = buildQuestion(p, 'pattern', 'pass-1', variant)!;
          expect(question.kind).toBe('next-bolt');
          const done = question.model?.kind === 'bolts' ? question.model.done : [];
          for (const choice of question.choices) {
            const verdict = scoreAnswer(p, 'pattern', 'pass-1', variant, choice.id);
            expect(verdict.ok && verdict.correct).toBe(passOneOk(p, [...done, choice.id]));
          }
          // A question worth asking: some choice is wrong, some is right.
          const verdict = scoreAnswer(p, 'pattern', 'pass-1', variant, question.choices[0]!.id);
          expect(verdict.ok && verdict.accepted.length).toBeGreaterThan(0);
          expect(verdict.ok && verdict.accepted.length).toBeLessThan(question.choices.length);
        }),
        { numRuns: 40 },
      );
    });
  }

  it('the same variant gives the same question; another review usually asks after another prefix', () => {
    expect(buildQuestion(sump, 'pattern', 'pass-2', 41)).toEqual(buildQuestion(sump, 'pattern', 'pass-2', 41));
    const prefixes = new Set(
      Array.from({ length: 20 }, (_, v) => JSON.stringify((buildQuestion(sump, 'pattern', 'pass-1', v)!.model as { done: string[] }).done)),
    );
    expect(prefixes.size).toBeGreaterThan(3);
  });

  it('pass torque: only the pass\'s share of the final torque is right (sump: half of 11 N·m, then 11 N·m)', () => {
    // Demo values for a fictional engine: the sump's passes are 0.5 and 1 × 11 N·m.
    expect(accepted(sump, 'pattern', 'pass-1-torque')).toEqual(['5.5']);
    expect(accepted(sump, 'pattern', 'pass-2-torque')).toEqual(['11']);
    expect(accepted(head, 'pattern', 'pass-1-torque')).toEqual(['8']);
    expect(accepted(sump, 'pattern', 'passes')).toEqual(['2']);
    expect(accepted(head, 'pattern', 'passes')).toEqual(['3']);
  });
});

describe('Pins: which pin goes in this hole, which hole takes this pin', () => {
  it('a locating hole takes its own pin; a threaded hole takes none', () => {
    expect(accepted(sump, 'pins', 'dowel-hole-a')).toEqual(['dowel-pin-8']);
    expect(accepted(sump, 'pins', 'sump-bolt-3')).toEqual([NO_PIN]);
    expect(accepted(head, 'pins', 'sleeve-hole-b')).toEqual(['locating-sleeve']);
  });

  it('a pin fits every hole it is seated in (more than one right answer); the decoy stays in the kit', () => {
    expect(accepted(sump, 'pins', 'dowel-pin-8')).toEqual(['dowel-hole-a', 'dowel-hole-b']);
    expect(accepted(sump, 'pins', 'dowel-pin-10')).toEqual([NO_PIN]);
  });

  it('the wrong pin is explained by the Pins scorer (size)', () => {
    const verdict = scoreAnswer(sump, 'pins', 'dowel-hole-a', 0, 'dowel-pin-10');
    expect(verdict.ok && verdict.correct).toBe(false);
    expect(verdict.ok && verdict.results.map((r) => r.message).join(' ')).toMatch(/10 mm across; this hole takes 8 mm/);
  });
});

describe('Wrench: what do you set the wrench to', () => {
  for (const slug of ['wren-160-sump', 'wren-160-head', 'wren-160-flywheel', 'wren-160-spark-plug']) {
    it(`${slug}: exactly one choice is right, and the Wrench scorer passes it`, () => {
      const p = demoProcedure(slug);
      const [only, ...more] = accepted(p, 'wrench', 'setting');
      expect(more).toEqual([]);
      const [value, unit] = [Number(only!.split(' ')[0]), only!.split(' ').slice(1).join(' ')];
      const group = p.fastenerGroups.find((g) => g.key === p.wrench!.group)!;
      expect(scoreWrench(p.wrench!, group.torque, { setting: value, unit: unit as 'in·lbf' }).passed).toBe(true);
      // The spec in its own unit is always offered: the classic slip.
      const question = buildQuestion(p, 'wrench', 'unit', 0)!;
      expect(question.choices.map((c) => c.id)).toContain(`${group.torque.value} ${group.torque.unit}`);
    });
  }

  it('sump: 11 N·m on an in·lbf dial is 97.36 in·lbf', () => {
    // NIST SP 811 (2008), B.8: 1 N·m = 8.850 745 791 in·lbf, so 11 N·m = 97.358 in·lbf.
    expect(accepted(sump, 'wrench', 'unit')).toEqual(['97.36 in·lbf']);
  });
});

describe('Final check', () => {
  it('counts, leftovers and crank turns as the Final check scorer judges them', () => {
    expect(accepted(sump, 'final-check', 'fasteners')).toEqual(['8']);
    expect(accepted(sump, 'final-check', 'leftover')).toEqual(['0']);
    // "At least two turns": two and three both pass.
    expect(accepted(sump, 'final-check', 'crank-turns')).toEqual(['2', '3']);
  });

  it('asks nothing about crank turns when the procedure asks for none', () => {
    const plug = demoProcedure('wren-160-spark-plug');
    expect(plug.finalCheck!.crankTurns).toBe(0);
    expect(canAsk(plug, 'final-check', 'crank-turns')).toBe(false);
  });
});

describe('every question', () => {
  it('for every key a scorer can report in the demo procedures, has choices, a hint and at least one right and one wrong choice', () => {
    for (const slug of SLUGS) {
      const p = demoProcedure(slug);
      for (const stage of p.stages) {
        for (const key of itemKeys(p, stage)) {
          const ask = asker(p, stage, key, 5);
          if (!ask) continue;
          const right = ask.question.choices.filter((c) => ask.judge(c.id).correct);
          expect(right.length, `${slug} ${stage} ${key}`).toBeGreaterThan(0);
          expect(right.length, `${slug} ${stage} ${key}`).toBeLessThan(ask.question.choices.length);
          expect(new Set(ask.question.choices.map((c) => c.id)).size).toBe(ask.question.choices.length);
          expect(ask.question.hint.length).toBeGreaterThan(10);
        }
      }
    }
  });

  it('carries no answer key to the browser: only prompt, context, choices (id and label), hint and what the model shows', () => {
    for (const slug of SLUGS) {
      const p = demoProcedure(slug);
      for (const stage of p.stages) {
        for (const key of itemKeys(p, stage)) {
          const question = buildQuestion(p, stage, key, 9);
          if (!question) continue;
          expect(Object.keys(question).sort()).toEqual(
            ['choices', 'context', 'hint', 'itemKey', 'kind', 'prompt', 'stage', 'variant', ...(question.model ? ['model'] : [])].sort(),
          );
          for (const choice of question.choices) expect(Object.keys(choice).sort()).toEqual(['id', 'label']);
          const json = JSON.stringify(question);
          for (const secret of ['"after"', 'pinSeats', 'decoy', '"rule"', 'correct', 'accepted']) expect(json).not.toContain(secret);
        }
      }
    }
  });

  it('refuses a choice it did not offer', () => {
    const verdict = scoreAnswer(sump, 'pattern', 'pass-1', 0, 'bolt-99');
    expect(verdict).toEqual({ ok: false, message: '"bolt-99" is not one of this question\'s choices' });
  });
});

describe('misses of a scored attempt', () => {
  it('one item per failed line the procedure can ask about, with the stage\'s kind of miss', () => {
    const results = [
      { key: 'fit-gasket', ok: false, message: '' },
      { key: 'fit-gasket', ok: false, message: '' },
      { key: 'dowel-pin-a', ok: true, message: '' },
      { key: 'no-such-step', ok: false, message: '' },
    ];
    expect(missesOf(sump, 'order', results)).toEqual([{ stage: 'order', itemKey: 'fit-gasket', missKind: 'out-of-order' }]);
    const kinds = Object.fromEntries(
      STAGES.map((stage) => [stage, missesOf(sump, stage, itemKeys(sump, stage).map((key) => ({ key, ok: false, message: '' })))[0]?.missKind]),
    );
    expect(kinds).toEqual({
      order: 'out-of-order',
      pins: 'wrong-pin',
      pattern: 'broken-pattern',
      wrench: 'wrong-wrench-setting',
      'final-check': 'failed-final-check',
    });
  });

  it('works on a procedure outside the demo set (the scorer tests\' cut-down sump)', () => {
    const mini = sumpMini();
    for (const stage of mini.stages) {
      for (const key of itemKeys(mini, stage)) {
        const ask = asker(mini, stage, key, 2);
        if (ask) expect(ask.question.choices.some((c) => ask.judge(c.id).correct)).toBe(true);
      }
    }
  });
});
