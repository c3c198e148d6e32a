import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { buildClassResults, type ResultsInput } from '~/lib/results/class-results';
import { regroupAnalysis } from '~/lib/results/regroup';
import { resultsCsv, resultsFileName, resultsTable } from '~/lib/results/results-csv';
import { scoreAttempt } from '~/lib/scoring';
import { correctAnswer } from '~/lib/procedure/reference-answers';
import type { Stage } from '~/lib/procedure/schema';
import { demoProcedure } from '../support/demo-procedures';

// Results rows from plain data: a drill on the spark plug procedure, four learners, attempts scored by
// the real scorer, two sign-offs. No database.

const plug = demoProcedure('wren-160-spark-plug');
const DRILL = '00000000-0000-4000-8000-0000000000d1';
const PROC = '00000000-0000-4000-8000-0000000000a1';
const now = new Date('2026-03-12T12:00:00Z');

const learners = [
  { id: 'ava', name: 'Ava Lindqvist', email: 'ava@larkspur.example' },
  { id: 'ben', name: 'Ben Okafor', email: 'ben@larkspur.example' },
  { id: 'carmen', name: 'Carmen Ruiz', email: 'carmen@larkspur.example' },
  { id: 'deshawn', name: 'Deshawn Price', email: 'deshawn@larkspur.example' },
];

let n = 0;
function attempt(userId: string, stage: Stage, answer: unknown, day: number): ResultsInput['attempts'][number] {
  const scored = scoreAttempt(plug, stage, answer);
  if (!scored.ok) throw new Error('bad answer in the test');
  n += 1;
  return {
    id: `a${String(n).padStart(2, '0')}`,
    userId,
    drillId: DRILL,
    stage,
    score: scored.score.score,
    maxScore: scored.score.maxScore,
    results: scored.score.results,
    createdAt: new Date(`2026-03-${String(day).padStart(2, '0')}T10:00:00Z`),
  };
}

const right = (stage: Stage) => correctAnswer(plug, stage);
const torqueFirst = { sequence: ['check-gap', 'torque-plug', 'thread-by-hand', 'reconnect-lead'] };
const wrongUnit = { setting: 20, unit: 'N·m' };

// Ava: order wrong then right, wrench and final check right → passed.
// Ben: all three stages once; order right, wrench in the wrong unit → in progress (wrench below the mark).
// Carmen: only the order stage → not counted in the step analysis.
// Deshawn: nothing.
const attempts = [
  attempt('ava', 'order', torqueFirst, 2),
  attempt('ava', 'order', right('order'), 3),
  attempt('ava', 'wrench', right('wrench'), 3),
  attempt('ava', 'final-check', right('final-check'), 4),
  attempt('ben', 'order', right('order'), 5),
  attempt('ben', 'wrench', wrongUnit, 5),
  attempt('ben', 'final-check', { fastenersCounted: 1, crankTurns: 0, leftover: 0 }, 6),
  attempt('carmen', 'order', torqueFirst, 7),
];

const input: ResultsInput = {
  classInfo: { id: 'class-1', name: 'Small Engines I' },
  learners,
  drills: [
    {
      id: DRILL,
      procedureId: PROC,
      slug: plug.slug,
      title: plug.title,
      version: 1,
      document: plug,
      stages: ['order', 'wrench', 'final-check'],
      dueAt: new Date('2026-03-20T17:00:00Z'),
      passMarkPct: 80,
      attemptLimit: null,
      closedAt: null,
    },
  ],
  // Given out of time order on purpose: the builder sorts them.
  attempts: [...attempts].reverse(),
  signOffs: [
    { learnerId: 'ava', procedureId: PROC, benchDate: '2026-03-05', outcome: 'redo', notes: 'gap not checked', createdAt: new Date('2026-03-05T15:00:00Z') },
    { learnerId: 'ava', procedureId: PROC, benchDate: '2026-03-09', outcome: 'pass', notes: '', createdAt: new Date('2026-03-09T15:00:00Z') },
    { learnerId: 'ben', procedureId: PROC, benchDate: '2026-03-09', outcome: 'redo', notes: 'lead left off', createdAt: new Date('2026-03-09T16:00:00Z') },
  ],
  procedures: [{ id: PROC, slug: plug.slug, title: plug.title }],
  now,
  groups: 'halves',
};

describe('buildClassResults: one row a learner', () => {
  const results = buildClassResults(input);
  const row = (id: string) => results.learners.find((l) => l.id === id)!;

  it('lists every learner in the order given, with the drill columns', () => {
    expect(results.learners.map((l) => l.name)).toEqual(learners.map((l) => l.name));
    expect(results.drills).toEqual([
      expect.objectContaining({ id: DRILL, procedure: 'wren-160-spark-plug', stages: ['order', 'wrench', 'final-check'], dueAt: '2026-03-20T17:00:00.000Z' }),
    ]);
  });

  it('per stage: best score, attempt count and the latest attempt; per drill: standing from drillProgress', () => {
    const ava = row('ava').drills[0]!;
    expect(ava.status).toBe('passed');
    expect(ava.passed).toBe(true);
    expect(ava.attempts).toBe(4);
    expect(ava.bestPct).toBe(100);
    expect(ava.stages[0]).toEqual({ stage: 'order', attempts: 2, bestPct: 100, passed: true, latestAttemptId: 'a02' });
    expect(row('ava').lastActivity).toBe('2026-03-04T10:00:00.000Z');

    const ben = row('ben').drills[0]!;
    expect(ben.status).toBe('in-progress');
    expect(ben.stages.map((s) => s.bestPct)).toEqual([100, 0, 100]);
    // (100 + 0 + 100) / 3 = 66.666…, shown and exported with one decimal.
    expect(ben.bestPct).toBe(66.7);

    const carmen = row('carmen').drills[0]!;
    // torque-plug placed before thread-by-hand: 3 of 4 marks (the Kendall-scaled order score).
    expect(carmen.stages[0]).toMatchObject({ attempts: 1, bestPct: 75, passed: false });
    expect(carmen.stages[1]).toEqual({ stage: 'wrench', attempts: 0, bestPct: null, passed: false, latestAttemptId: null });

    expect(row('deshawn').drills[0]).toMatchObject({ status: 'not-started', bestPct: null, attempts: 0 });
    expect(row('deshawn').lastActivity).toBeNull();
  });

  it('shows the latest sign-off per procedure (latest bench date wins)', () => {
    expect(row('ava').signOffs).toEqual([{ procedureId: PROC, outcome: 'pass', benchDate: '2026-03-09', notes: '' }]);
    expect(row('ben').signOffs).toEqual([{ procedureId: PROC, outcome: 'redo', benchDate: '2026-03-09', notes: 'lead left off' }]);
    expect(row('carmen').signOffs).toEqual([]);
    expect(results.signOffProcedures).toEqual([{ id: PROC, slug: plug.slug, title: plug.title }]);
  });
});

describe('buildClassResults: step analysis on first attempts', () => {
  const analysis = buildClassResults(input).stepAnalysis[0]!;
  const step = (key: string) => analysis.steps.find((s) => s.key === key)!;

  it('counts only learners who tried every stage, each by their first attempt', () => {
    expect(analysis.counted).toBe(2);
    expect(analysis.notCounted).toBe(2);
    // Ava's first order attempt put the torque step too early; her second (right) does not count.
    expect(step('torque-plug')).toMatchObject({ correct: 1, p: 0.5, missed: 0.5 });
    expect(step('check-gap')).toMatchObject({ correct: 2, p: 1, d: 0, rpb: null });
    expect(step('unit')).toMatchObject({ correct: 1, p: 0.5 });
    expect(analysis.learners.find((l) => l.id === 'ava')!.firstAttempts).toEqual({ order: 'a01', wrench: 'a03', 'final-check': 'a04' });
  });

  it('ranks by steps right and splits into halves of one', () => {
    // Ava misses 1 step (torque-plug), Ben 2 (unit, setting): Ava is the upper group.
    expect(analysis.learners.map((l) => [l.id, l.total, l.group])).toEqual([
      ['ava', 8, 'upper'],
      ['ben', 7, 'lower'],
    ]);
    expect(analysis.groupSize).toBe(1);
    expect(step('unit').d).toBe(1);
    expect(step('torque-plug').d).toBe(-1);
  });

  it('regroups the same answers for another split without changing the ranking', () => {
    const again = regroupAnalysis(analysis, '27');
    expect(again.groupSize).toBe(1);
    expect(again.learners.map((l) => l.id)).toEqual(['ava', 'ben']);
    expect(again.steps.map((s) => s.p)).toEqual(analysis.steps.map((s) => s.p));
  });

  it('lists the steps of a drill nobody has finished, with nothing computed', () => {
    const empty = buildClassResults({ ...input, attempts: [] }).stepAnalysis[0]!;
    expect(empty.counted).toBe(0);
    expect(empty.steps).toHaveLength(9);
    expect(empty.steps[0]).toMatchObject({ stage: 'order', key: 'check-gap', p: null, d: null, rpb: null });
  });
});

describe('grade export CSV', () => {
  const results = buildClassResults(input);

  it('has a header row in the documented order and one row a learner', () => {
    const { fields, data } = resultsTable(results);
    const d = 'Wren 160: install the spark plug v1, due 2026-03-20';
    expect(fields).toEqual([
      'Learner', 'E-mail', 'Last activity',
      `${d}: Order best %`, `${d}: Order attempts`,
      `${d}: Wrench best %`, `${d}: Wrench attempts`,
      `${d}: Final check best %`, `${d}: Final check attempts`,
      `${d}: best %`, `${d}: status`, `${d}: passed`,
      'Sign-off Wren 160: install the spark plug: outcome', 'Sign-off Wren 160: install the spark plug: bench date',
    ]);
    expect(data).toHaveLength(4);
    expect(data[1]).toEqual(['Ben Okafor', 'ben@larkspur.example', '2026-03-06T10:00:00.000Z', 100, 1, 0, 1, 100, 1, 66.7, 'in-progress', 'no', 'redo', '2026-03-09']);
  });

  it('parses back with papaparse to the same learners and numbers', () => {
    const parsed = Papa.parse<Record<string, string>>(resultsCsv(results), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.map((r) => r.Learner)).toEqual(results.learners.map((l) => l.name));
    const ava = parsed.data[0]!;
    expect(ava['Wren 160: install the spark plug v1, due 2026-03-20: Order attempts']).toBe('2');
    expect(ava['Wren 160: install the spark plug v1, due 2026-03-20: passed']).toBe('yes');
    // Nothing yet is an empty cell, not "null" or "0".
    expect(parsed.data[3]!['Wren 160: install the spark plug v1, due 2026-03-20: Order best %']).toBe('');
  });

  it('ends lines with CRLF and quotes cells with commas', () => {
    const csv = resultsCsv(results);
    expect(csv.split('\r\n')).toHaveLength(5);
    expect(csv).toContain('"Wren 160: install the spark plug v1, due 2026-03-20: Order best %"');
  });

  it('prefixes a quote to text cells that a spreadsheet would run as a formula', () => {
    const risky = ['=HYPERLINK("http://x.example","click")', '+1+1', '-2+3', '@SUM(A1)', '\tTab', '=1\n+2'];
    const withRisk = buildClassResults({
      ...input,
      learners: risky.map((name, i) => ({ id: `r${i}`, name, email: `r${i}@test.example` })),
      attempts: [],
      signOffs: [],
    });
    const parsed = Papa.parse<string[]>(resultsCsv(withRisk), { skipEmptyLines: true });
    expect(parsed.data.slice(1).map((r) => r[0])).toEqual(risky.map((name) => `'${name}`));
    // Numbers are left alone (a percentage is never mistaken for a formula).
    expect(resultsCsv(results)).toContain(',66.7,');
  });

  it('names the file with ASCII letters, digits and dashes only', () => {
    const day = new Date('2026-03-12T08:00:00Z');
    expect(resultsFileName('Small Engines I', day)).toBe('results-small-engines-i-2026-03-12.csv');
    expect(resultsFileName('Motores Pequeños "B"; rm -rf /', day)).toBe('results-motores-pequenos-b-rm-rf-2026-03-12.csv');
    expect(resultsFileName('///', day)).toBe('results-class-2026-03-12.csv');
  });
});
