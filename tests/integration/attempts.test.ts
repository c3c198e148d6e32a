import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { attempts, procedureVersions } from '../../src/db/schema';
import type { Stage } from '../../src/lib/procedure/schema';
import { Client, demoUser, newLearner } from './helpers/client';
import { testDb } from './helpers/db';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { demoProcedure } from '../support/demo-procedures';

const sump = demoProcedure('wren-160-sump');

function submit(client: Client, procedure: string, stage: Stage, answer: unknown, clientId = randomUUID()) {
  return client.post('/api/attempts', { procedure, stage, answer, clientId });
}

describe('POST /api/attempts scores on the server and keeps the attempt', () => {
  let learner: Client;
  beforeAll(async () => {
    learner = (await newLearner('attempts')).client;
  });

  for (const slug of ['wren-160-sump', 'wren-160-head', 'wren-160-flywheel', 'wren-160-spark-plug']) {
    const procedure = demoProcedure(slug);
    for (const stage of procedure.stages) {
      it(`${slug} ${stage}: the correct answer gets full marks`, async () => {
        const res = await submit(learner, slug, stage, correctAnswer(procedure, stage));
        expect(res.status).toBe(201);
        expect(res.body).toMatchObject({ procedure: slug, version: 1, stage, passed: true });
        expect(res.body.score).toBe(res.body.maxScore);
        expect(res.body.results.every((r: { ok: boolean }) => r.ok)).toBe(true);
      });
    }
  }

  it('stores the attempt with its procedure version and per-step results', async () => {
    const answer = { sequence: ['fit-gasket', ...(correctAnswer(sump, 'order') as { sequence: string[] }).sequence.filter((k) => k !== 'fit-gasket')] };
    const res = await submit(learner, 'wren-160-sump', 'order', answer);
    expect(res.status).toBe(201);
    expect(res.body.passed).toBe(false);
    expect(res.body.score).toBeLessThan(res.body.maxScore);
    const gasket = res.body.results.find((r: { key: string }) => r.key === 'fit-gasket');
    expect(gasket.ok).toBe(false);
    expect(gasket.message).toMatch(/dowel pin/i);

    const { db, close } = testDb();
    const [row] = await db
      .select({ results: attempts.results, version: procedureVersions.version, score: attempts.score })
      .from(attempts)
      .innerJoin(procedureVersions, eq(procedureVersions.id, attempts.procedureVersionId))
      .where(eq(attempts.id, res.body.id));
    await close();
    expect(row).toEqual({ results: res.body.results, version: 1, score: res.body.score });
  });

  it('the same clientId returns the stored attempt (200), never a second row', async () => {
    const clientId = randomUUID();
    const first = await submit(learner, 'wren-160-sump', 'final-check', { fastenersCounted: 7, crankTurns: 2 }, clientId);
    expect(first.status).toBe(201);
    // A retry after a lost answer, even with a different body, gets the first result back.
    const again = await submit(learner, 'wren-160-sump', 'final-check', { fastenersCounted: 8, crankTurns: 2 }, clientId);
    expect(again.status).toBe(200);
    expect(again.body).toEqual(first.body);
    const { db, close } = testDb();
    const rows = await db.select({ id: attempts.id }).from(attempts).where(eq(attempts.clientId, clientId));
    await close();
    expect(rows).toHaveLength(1);
    // The same clientId for another stage is a client bug: 409.
    expect((await submit(learner, 'wren-160-sump', 'order', { sequence: [] }, clientId)).status).toBe(409);
  });

  it('two learners may use the same clientId without seeing each other', async () => {
    const clientId = randomUUID();
    const other = (await newLearner('same-client-id')).client;
    const mine = await submit(learner, 'wren-160-spark-plug', 'final-check', { fastenersCounted: 1, crankTurns: 0 }, clientId);
    const theirs = await submit(other, 'wren-160-spark-plug', 'final-check', { fastenersCounted: 1, crankTurns: 0 }, clientId);
    expect([mine.status, theirs.status]).toEqual([201, 201]);
    expect(mine.body.id).not.toBe(theirs.body.id);
  });

  it('a wrong answer is a low score with feedback, not an error', async () => {
    const decoy = await submit(learner, 'wren-160-sump', 'pins', {
      placements: [
        { part: 'dowel-pin-10', anchor: 'dowel-hole-a' },
        { part: 'dowel-pin-8', anchor: 'sump-bolt-3' },
      ],
    });
    expect(decoy.status).toBe(201);
    expect(decoy.body.passed).toBe(false);
    expect(decoy.body.results.filter((r: { ok: boolean }) => !r.ok).length).toBeGreaterThanOrEqual(2);

    const wrongUnit = await submit(learner, 'wren-160-sump', 'wrench', { setting: 11, unit: 'N·m' });
    expect(wrongUnit.status).toBe(201);
    expect(wrongUnit.body.passed).toBe(false);
    expect(wrongUnit.body.results.find((r: { key: string }) => r.key === 'unit').ok).toBe(false);
  });

  it('answers bad input with 400 and what was wrong', async () => {
    const cases: [unknown, RegExp][] = [
      [{ procedure: 'wren-160-sump', stage: 'order', answer: { sequence: 'not a list' }, clientId: randomUUID() }, /sequence/],
      [{ procedure: 'wren-160-flywheel', stage: 'pattern', answer: { passes: [] }, clientId: randomUUID() }, /no pattern stage/],
      [{ procedure: 'wren-160-sump', stage: 'polish', answer: {}, clientId: randomUUID() }, /stage/],
      [{ procedure: 'wren-160-sump', stage: 'order', answer: { sequence: [] }, clientId: 'abc' }, /clientId/],
      [{ procedure: 'wren-160-sump', stage: 'order', clientId: randomUUID() }, /answer/i],
      [{ procedure: 'wren-160-sump', stage: 'wrench', answer: { setting: 'ninety', unit: 'in·lbf' }, clientId: randomUUID() }, /setting/],
    ];
    for (const [body, message] of cases) {
      const res = await learner.post('/api/attempts', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(JSON.stringify(res.body), JSON.stringify(body)).toMatch(message);
    }
    const notJson = await learner.request('POST', '/api/attempts', 'stage=order', { 'content-type': 'application/json' });
    expect(notJson.status).toBe(400);
  });

  it('an unknown procedure or version is 404', async () => {
    expect((await submit(learner, 'no-such-engine', 'order', { sequence: [] })).status).toBe(404);
    const res = await learner.post('/api/attempts', { procedure: 'wren-160-sump', version: 99, stage: 'order', answer: { sequence: [] }, clientId: randomUUID() });
    expect(res.status).toBe(404);
  });

  it('needs a signed-in user', async () => {
    expect((await submit(new Client(), 'wren-160-sump', 'order', { sequence: [] })).status).toBe(401);
  });
});

describe('GET /api/attempts/:id: the learner, the learner\'s instructors and admins only', () => {
  it('checks the owner and the class', async () => {
    const { client: learner1 } = await demoUser('learner1@larkspur.example');
    const made = await submit(learner1, 'wren-160-sump', 'final-check', { fastenersCounted: 8, crankTurns: 2 });
    expect(made.status).toBe(201);
    const path = `/api/attempts/${made.body.id}`;

    expect((await learner1.get(path)).status).toBe(200);
    expect((await learner1.get(path)).body).toEqual(made.body);
    expect((await (await newLearner('snoop')).client.get(path)).status).toBe(404);
    expect((await (await demoUser('learner2@larkspur.example')).client.get(path)).status).toBe(404);
    // Dana teaches Small Engines I, where learner1 is; Marcus teaches no class with learner1.
    expect((await (await demoUser('instructor@larkspur.example')).client.get(path)).status).toBe(200);
    expect((await (await demoUser('instructor2@larkspur.example')).client.get(path)).status).toBe(404);
    expect((await (await demoUser('admin@larkspur.example')).client.get(path)).status).toBe(200);
    expect((await new Client().get(path)).status).toBe(401);
    expect((await learner1.get('/api/attempts/not-a-uuid')).status).toBe(404);
  });
});
