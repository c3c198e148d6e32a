import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { Client, demoUser, newLearner } from './helpers/client';
import { BASE_URL } from './helpers/server';
import { fixtureDb } from '../support/drill-fixtures';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import type { Stage } from '../../src/lib/procedure/schema';
import { demoProcedure } from '../support/demo-procedures';

// A class of its own (taught by the second demo instructor) with one drill on the spark plug procedure:
// learners post attempts through the API, the drill and sign-offs are written to the database.

const plug = demoProcedure('wren-160-spark-plug');
const fixtures = fixtureDb();
const STAGES: Stage[] = ['order', 'wrench', 'final-check'];

let classId = '';
let drillId = '';
let instructor: Client;
let otherInstructor: Client;
let admin: Client;
let outsider: Client;
const learners: { client: Client; id: string; name: string }[] = [];
const attemptIds: Record<string, string[]> = {};

async function submit(who: { client: Client; id: string }, stage: Stage, answer: unknown) {
  const res = await who.client.post('/api/attempts', { procedure: plug.slug, stage, answer, clientId: randomUUID() });
  expect(res.status).toBe(201);
  (attemptIds[who.id] ??= []).push(res.body.id);
  return res.body as { id: string };
}

beforeAll(async () => {
  const teacher = await demoUser('instructor2@larkspur.example');
  instructor = teacher.client;
  otherInstructor = (await demoUser('instructor@larkspur.example')).client;
  admin = (await demoUser('admin@larkspur.example')).client;
  outsider = (await newLearner('results-outsider')).client;

  const created = await instructor.post('/api/classes', { name: `Results ${randomUUID().slice(0, 6)}` });
  expect(created.status).toBe(201);
  classId = created.body.id;
  // Names chosen so the list order (by name) is known; the last one is a spreadsheet formula.
  for (const name of ['Alma Test', 'Bruno Test', 'Cleo Test', '=1+2 Test']) {
    const client = new Client();
    const email = `results-${randomUUID().slice(0, 8)}@test.example`;
    const res = await client.post('/api/auth/sign-up', { name, email, password: 'correct horse battery' });
    expect(res.status).toBe(201);
    expect((await client.post('/api/classes/join', { joinCode: created.body.joinCode })).status).toBe(200);
    learners.push({ client, id: res.body.id, name });
  }
  ({ drillId } = await fixtures.insertDrill({ classId, slug: plug.slug, stages: STAGES, createdBy: teacher.user.id }));

  const [alma, bruno, cleo] = learners;
  // Alma: order wrong first (torque before threading), then right; wrench and final check right.
  await submit(alma!, 'order', { sequence: ['check-gap', 'torque-plug', 'thread-by-hand', 'reconnect-lead'] });
  await submit(alma!, 'order', correctAnswer(plug, 'order'));
  await submit(alma!, 'wrench', correctAnswer(plug, 'wrench'));
  await submit(alma!, 'final-check', correctAnswer(plug, 'final-check'));
  // Bruno: every stage once, the wrench in the wrong unit.
  await submit(bruno!, 'order', correctAnswer(plug, 'order'));
  await submit(bruno!, 'wrench', { setting: 20, unit: 'N·m' });
  await submit(bruno!, 'final-check', correctAnswer(plug, 'final-check'));
  // Cleo: the order stage only.
  await submit(cleo!, 'order', correctAnswer(plug, 'order'));
  for (const l of learners) await fixtures.linkAttempts(drillId, attemptIds[l.id] ?? []);
  // An attempt outside the drill does not count.
  await submit(cleo!, 'wrench', correctAnswer(plug, 'wrench'));

  const version = await fixtures.procedureVersion(plug.slug);
  await fixtures.insertSignOff({ classId, learnerId: alma!.id, procedureId: version.procedureId, instructorId: teacher.user.id, benchDate: '2026-03-02', outcome: 'redo', notes: 'gap not checked' });
  await fixtures.insertSignOff({ classId, learnerId: alma!.id, procedureId: version.procedureId, instructorId: teacher.user.id, benchDate: '2026-03-09', outcome: 'pass' });
});

afterAll(() => fixtures.close());

describe('GET /api/classes/:id/results', () => {
  it('answers one row a learner with per-stage best scores, attempts, standing and sign-offs', async () => {
    const res = await instructor.get(`/api/classes/${classId}/results`);
    expect(res.status).toBe(200);
    const body = res.body;
    expect(body.class).toEqual({ id: classId, name: expect.stringMatching(/^Results /) });
    expect(body.drills).toEqual([expect.objectContaining({ id: drillId, procedure: plug.slug, version: 1, stages: STAGES, passMarkPct: 80 })]);
    expect(body.learners.map((l: { name: string }) => l.name)).toEqual(['=1+2 Test', 'Alma Test', 'Bruno Test', 'Cleo Test']);

    const row = (name: string) => body.learners.find((l: { name: string }) => l.name === name).drills[0];
    const alma = row('Alma Test');
    expect(alma).toMatchObject({ drillId, status: 'passed', passed: true, bestPct: 100, attempts: 4 });
    expect(alma.stages.map((s: { attempts: number; bestPct: number }) => [s.attempts, s.bestPct])).toEqual([[2, 100], [1, 100], [1, 100]]);
    expect(alma.stages[0].latestAttemptId).toBe(attemptIds[learners[0]!.id]![1]);

    expect(row('Bruno Test')).toMatchObject({ status: 'in-progress', passed: false, bestPct: 66.7, attempts: 3 });
    // Cleo's wrench attempt outside the drill is not counted.
    expect(row('Cleo Test').stages.map((s: { attempts: number }) => s.attempts)).toEqual([1, 0, 0]);
    expect(row('=1+2 Test')).toMatchObject({ status: 'not-started', bestPct: null, attempts: 0 });

    const almaRow = body.learners.find((l: { name: string }) => l.name === 'Alma Test');
    expect(almaRow.signOffs).toEqual([{ procedureId: expect.any(String), outcome: 'pass', benchDate: '2026-03-09', notes: '' }]);
    expect(body.signOffProcedures).toEqual([expect.objectContaining({ slug: plug.slug, title: plug.title })]);
  });

  it('analyses each step on first attempts of learners who tried every stage', async () => {
    const res = await instructor.get(`/api/classes/${classId}/results`);
    const analysis = res.body.stepAnalysis[0];
    expect(analysis).toMatchObject({ drillId, counted: 2, notCounted: 2, groupSize: 1 });
    const step = (key: string) => analysis.steps.find((s: { key: string }) => s.key === key);
    expect(step('torque-plug')).toMatchObject({ stage: 'order', correct: 1, p: 0.5, missed: 0.5 });
    expect(step('unit')).toMatchObject({ stage: 'wrench', correct: 1, p: 0.5, d: 1 });
    expect(step('check-gap')).toMatchObject({ p: 1, d: 0, rpb: null });
    expect(analysis.learners.map((l: { name: string; total: number; group: string }) => [l.name, l.total, l.group])).toEqual([
      ['Alma Test', 8, 'upper'],
      ['Bruno Test', 7, 'lower'],
    ]);
    expect(analysis.learners[0].firstAttempts.order).toBe(attemptIds[learners[0]!.id]![0]);
  });

  it('takes ?groups=27 and refuses other splits with a 400 naming the field', async () => {
    const ok = await instructor.get(`/api/classes/${classId}/results?groups=27`);
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ groups: '27', groupShare: 0.27 });
    const bad = await instructor.get(`/api/classes/${classId}/results?groups=thirds`);
    expect(bad.status).toBe(400);
    expect(bad.body.fields.groups[0]).toMatch(/halves/);
  });
});

describe('GET /api/classes/:id/results.csv', () => {
  it('is a UTF-8 CSV attachment with a safe file name and a byte-order mark', async () => {
    // A plain fetch, for the raw bytes: text() would drop the byte-order mark this checks.
    const signIn = await fetch(`${BASE_URL}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-forwarded-for': '10.251.1.1' },
      body: JSON.stringify({ email: 'instructor2@larkspur.example', password: 'wren-bench-160' }),
    });
    const cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).find((c) => c.startsWith('bw_session='))!;
    const res = await fetch(`${BASE_URL}/api/classes/${classId}/results.csv`, { headers: { cookie, 'x-forwarded-for': '10.251.1.1' } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="results-results-[a-z0-9]+-\d{4}-\d{2}-\d{2}\.csv"$/);
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
  });

  it('parses back with papaparse to the same learners and numbers as the JSON', async () => {
    const [json, csv] = await Promise.all([instructor.get(`/api/classes/${classId}/results`), instructor.get(`/api/classes/${classId}/results.csv`)]);
    expect(csv.status).toBe(200);
    const parsed = Papa.parse<Record<string, string>>(csv.body as string, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const drill = `${plug.title} v1, due ${json.body.drills[0].dueAt.slice(0, 10)}`;
    expect(parsed.meta.fields).toEqual([
      'Learner', 'E-mail', 'Last activity',
      `${drill}: Order best %`, `${drill}: Order attempts`,
      `${drill}: Wrench best %`, `${drill}: Wrench attempts`,
      `${drill}: Final check best %`, `${drill}: Final check attempts`,
      `${drill}: best %`, `${drill}: status`, `${drill}: passed`,
      `Sign-off ${plug.title}: outcome`, `Sign-off ${plug.title}: bench date`,
    ]);
    expect(parsed.data).toHaveLength(json.body.learners.length);

    const cell = (v: number | string | null) => (v === null ? '' : String(v));
    json.body.learners.forEach((learner: any, i: number) => {
      const row = parsed.data[i]!;
      // The formula-like name comes back with its guard quote; everything else as in the JSON.
      expect(row.Learner).toBe(learner.name.startsWith('=') ? `'${learner.name}` : learner.name);
      expect(row['E-mail']).toBe(learner.email);
      expect(row['Last activity']).toBe(cell(learner.lastActivity));
      const d = learner.drills[0];
      d.stages.forEach((s: any, j: number) => {
        const stage = ['Order', 'Wrench', 'Final check'][j];
        expect(row[`${drill}: ${stage} best %`]).toBe(cell(s.bestPct));
        expect(row[`${drill}: ${stage} attempts`]).toBe(String(s.attempts));
      });
      expect(row[`${drill}: best %`]).toBe(cell(d.bestPct));
      expect(row[`${drill}: status`]).toBe(d.status);
      expect(row[`${drill}: passed`]).toBe(d.passed ? 'yes' : 'no');
      const signOff = learner.signOffs[0];
      expect(row[`Sign-off ${plug.title}: outcome`]).toBe(signOff?.outcome ?? '');
      expect(row[`Sign-off ${plug.title}: bench date`]).toBe(signOff?.benchDate ?? '');
    });
    expect(parsed.data[0]!.Learner).toBe("'=1+2 Test");
  });
});

describe('who may see class results', () => {
  type Who = 'instructor' | 'otherInstructor' | 'learner' | 'outsider' | 'anonymous' | 'admin';
  const client = (who: Who): Client =>
    ({ instructor, otherInstructor, learner: learners[0]!.client, outsider, anonymous: new Client(), admin })[who];
  const expected: Record<Who, number> = { instructor: 200, otherInstructor: 403, learner: 403, outsider: 403, anonymous: 401, admin: 200 };

  for (const suffix of ['results', 'results.csv']) {
    for (const who of Object.keys(expected) as Who[]) {
      it(`GET /api/classes/:id/${suffix} as ${who} → ${expected[who]}`, async () => {
        const res = await client(who).get(`/api/classes/${classId}/${suffix}`);
        expect(res.status).toBe(expected[who]);
        if (expected[who] !== 200) expect(res.body.error).toEqual(expect.any(String));
      });
    }

    it(`${suffix}: an unknown class is 404, a malformed id 400 (never 500), for instructors and admins`, async () => {
      for (const c of [instructor, admin]) {
        expect((await c.get(`/api/classes/${randomUUID()}/${suffix}`)).status).toBe(404);
        for (const bad of ['not-a-class', '12345', `${classId}x`, '%3Bdrop--', 'abc%27d', 'x'.repeat(300)]) {
          expect((await c.get(`/api/classes/${bad}/${suffix}`)).status, bad).toBe(400);
        }
      }
      // Learners are refused by role before the id is looked at.
      expect((await learners[0]!.client.get(`/api/classes/not-a-class/${suffix}`)).status).toBe(403);
    });
  }
});

describe('results and attempt review pages', () => {
  type Who = 'instructor' | 'otherInstructor' | 'learner' | 'outsider' | 'admin';
  const client = (who: Who): Client => ({ instructor, otherInstructor, learner: learners[0]!.client, outsider, admin })[who];

  it('/teach/classes/:id/results: the class instructor and admins see it; others get 403, the signed-out sign in', async () => {
    const path = `/teach/classes/${classId}/results`;
    const expected: Record<Who, number> = { instructor: 200, otherInstructor: 403, learner: 403, outsider: 403, admin: 200 };
    for (const who of Object.keys(expected) as Who[]) expect((await client(who).get(path)).status, who).toBe(expected[who]);
    const anon = await new Client().get(path);
    expect(anon.status).toBe(302);
    expect(anon.headers.get('location')).toBe(`/sign-in?next=${encodeURIComponent(path)}`);
    const page = await instructor.get(path);
    expect(page.body).toContain('Alma Test');
    expect(page.body).toContain(`/api/classes/${classId}/results.csv`);
    expect((await instructor.get(`/teach/classes/${randomUUID()}/results`)).status).toBe(404);
    expect((await instructor.get('/teach/classes/not-a-class/results')).status).toBe(404);
  });

  it('the class page links to its results', async () => {
    const page = await instructor.get(`/teach/classes/${classId}`);
    expect(page.body).toContain(`href="/teach/classes/${classId}/results"`);
  });

  it('/teach/attempts/:id: the learner\'s instructor and admins review it; anyone else gets 404 or 403', async () => {
    const first = attemptIds[learners[0]!.id]![0]!;
    const path = `/teach/attempts/${first}`;
    // The learner's own attempt: this page is for instructors, the learner has the trainer's feedback.
    const expected: Record<Who, number> = { instructor: 200, otherInstructor: 404, learner: 403, outsider: 403, admin: 200 };
    for (const who of Object.keys(expected) as Who[]) expect((await client(who).get(path)).status, who).toBe(expected[who]);
    const anon = await new Client().get(path);
    expect(anon.status).toBe(302);
    expect(anon.headers.get('location')).toBe(`/sign-in?next=${encodeURIComponent(path)}`);
    expect((await instructor.get(`/teach/attempts/${randomUUID()}`)).status).toBe(404);
    expect((await instructor.get('/teach/attempts/not-an-attempt')).status).toBe(404);
  });

  it('the review shows the stored answer step by step with the server\'s lines', async () => {
    const first = attemptIds[learners[0]!.id]![0]!;
    const page = await instructor.get(`/teach/attempts/${first}`);
    expect(page.status).toBe(200);
    const html = page.body as string;
    expect(html).toContain('Alma Test: Order');
    expect(html).toContain('attempt 1 of 2 on this drill');
    expect(html).toContain('Step 2: Torque the spark plug to 20 N·m.');
    expect(html).toContain(`/teach/classes/${classId}/results`);
    expect(html).toContain(`/teach/attempts/${attemptIds[learners[0]!.id]![1]}`);
  });
});
