import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { reworkAnswers, reworkItems } from '../../src/db/schema';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { scoreAnswer } from '../../src/lib/rework/questions';
import { Client, newLearner } from './helpers/client';
import { testDb } from './helpers/db';
import { demoProcedure } from '../support/demo-procedures';

const sump = demoProcedure('wren-160-sump');
const reference = correctAnswer(sump, 'pattern') as { group: string; passes: { torque: number; sequence: string[] }[] };

/** Pass 1 tightened round the circle (1, 2, 3 …): the mistake; pass 2 and the torques right. */
const roundTheCircle = {
  group: reference.group,
  passes: reference.passes.map((p, i) => (i === 0 ? { ...p, sequence: sump.fastenerGroups[0]!.bolts.map((b) => b.key) } : p)),
};

function submit(client: Client, stage: string, answer: unknown) {
  return client.post('/api/attempts', { procedure: 'wren-160-sump', stage, answer, clientId: randomUUID() });
}

interface Item {
  id: string;
  stage: string;
  itemKey: string;
  missKind: string;
  missCount: number;
  due: string;
  question: { kind: string; variant: number; choices: { id: string; label: string }[]; prompt: string } | null;
}

async function items(client: Client): Promise<{ due: Item[]; upcoming: Item[] }> {
  const res = await client.get('/api/me/rework');
  expect(res.status).toBe(200);
  return res.body;
}

/** A right and a wrong choice for an item's question, worked out from the procedure the way the server judges. */
function choicesFor(item: Item): { right: string; wrong: string } {
  const q = item.question!;
  const judged = q.choices.map((c) => {
    const v = scoreAnswer(sump, 'pattern', item.itemKey, q.variant, c.id);
    return { id: c.id, correct: v.ok && v.correct };
  });
  return { right: judged.find((c) => c.correct)!.id, wrong: judged.find((c) => !c.correct)!.id };
}

const { db, close } = testDb();
afterAll(close);

describe('a missed step in an attempt becomes one rework item', () => {
  let learner: Client;
  let learnerId: string;
  beforeAll(async () => {
    const made = await newLearner('rework');
    learner = made.client;
    learnerId = made.user.id;
  });

  it('a right attempt queues nothing', async () => {
    expect((await submit(learner, 'pattern', reference)).status).toBe(201);
    expect(await items(learner)).toMatchObject({ due: [], upcoming: [] });
  });

  it('a pattern mistake creates one item for that pass, due now, with its bolt question', async () => {
    const res = await submit(learner, 'pattern', roundTheCircle);
    expect(res.status).toBe(201);
    expect(res.body.passed).toBe(false);
    const { due, upcoming } = await items(learner);
    expect(upcoming).toEqual([]);
    expect(due).toHaveLength(1);
    expect(due[0]).toMatchObject({ stage: 'pattern', itemKey: 'pass-1', missKind: 'broken-pattern', missCount: 1 });
    expect(due[0]!.question).toMatchObject({ kind: 'next-bolt', prompt: 'Which bolt comes next in pass 1?' });
    // The source attempt is remembered.
    const [row] = await db.select().from(reworkItems).where(eq(reworkItems.id, due[0]!.id));
    expect(row!.sourceAttemptId).toBe(res.body.id);
    expect(row!.userId).toBe(learnerId);
  });

  it('a second miss refreshes the same item: no duplicate, one more miss', async () => {
    expect((await submit(learner, 'pattern', roundTheCircle)).status).toBe(201);
    const { due } = await items(learner);
    expect(due).toHaveLength(1);
    expect(due[0]).toMatchObject({ itemKey: 'pass-1', missCount: 2 });
    const rows = await db.select({ id: reworkItems.id }).from(reworkItems).where(eq(reworkItems.userId, learnerId));
    expect(rows).toHaveLength(1);
  });

  it('a replayed attempt (same clientId) counts the miss once', async () => {
    const clientId = randomUUID();
    const body = { procedure: 'wren-160-sump', stage: 'pattern', answer: roundTheCircle, clientId };
    expect((await learner.post('/api/attempts', body)).status).toBe(201);
    expect((await learner.post('/api/attempts', body)).status).toBe(200);
    expect((await items(learner)).due[0]).toMatchObject({ itemKey: 'pass-1', missCount: 3 });
  });

  it('answering it right moves it further out; replaying the clientId changes nothing; another answer with it is 409', async () => {
    const [item] = (await items(learner)).due;
    const { right, wrong } = choicesFor(item!);
    const body = { answer: { choice: right, variant: item!.question!.variant }, clientId: randomUUID() };
    const first = await learner.post(`/api/rework/${item!.id}/answer`, body);
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ itemId: item!.id, correct: true, rating: 3, ratingWord: 'good' });
    expect(first.body.accepted).toContain(right);
    expect(new Date(first.body.dueAfter).getTime()).toBeGreaterThan(new Date(first.body.dueBefore).getTime());
    expect(new Date(first.body.dueAfter).getTime()).toBeGreaterThan(Date.now());
    expect(first.body.dueBefore).toBe(item!.due);

    // The same request again (a retry after a lost reply): the same answer, nothing new stored.
    const again = await learner.post(`/api/rework/${item!.id}/answer`, body);
    expect(again.status).toBe(200);
    expect(again.body).toEqual(first.body);
    const stored = await db.select({ id: reworkAnswers.id }).from(reworkAnswers).where(eq(reworkAnswers.clientId, body.clientId));
    expect(stored).toHaveLength(1);

    // The same clientId with another answer is a client bug.
    const other = await learner.post(`/api/rework/${item!.id}/answer`, { ...body, answer: { ...body.answer, choice: wrong } });
    expect(other.status).toBe(409);

    // The item has left "due" and waits until its new date.
    const after = await items(learner);
    expect(after.due).toEqual([]);
    expect(after.upcoming[0]).toMatchObject({ id: item!.id, due: first.body.dueAfter, question: null });
  });

  it('answered wrong, it comes back sooner than answered right', async () => {
    // A second learner with the same miss answers wrong.
    const { client } = await newLearner('rework-wrong');
    await submit(client, 'pattern', roundTheCircle);
    const [item] = (await items(client)).due;
    const { wrong } = choicesFor(item!);
    const res = await client.post(`/api/rework/${item!.id}/answer`, { answer: { choice: wrong, variant: item!.question!.variant }, clientId: randomUUID() });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ correct: false, rating: 1, ratingWord: 'again' });
    expect(res.body.results[0].ok).toBe(false);
    expect(res.body.results[0].message).toMatch(/^pass 1: /);
    const [mine] = (await items(learner)).upcoming;
    expect(new Date(res.body.dueAfter).getTime() - new Date(res.body.createdAt).getTime()).toBeLessThan(
      new Date(mine!.due).getTime() - new Date(res.body.createdAt).getTime(),
    );
  });

  it('a hint lowers the rating of a right answer to Hard', async () => {
    const { client } = await newLearner('rework-hint');
    await submit(client, 'wrench', { setting: 11, unit: 'N·m' });
    const { due } = await items(client);
    expect(due.map((i) => i.itemKey).sort()).toEqual(['setting', 'unit']);
    const item = due.find((i) => i.itemKey === 'unit')!;
    expect(item.missKind).toBe('wrong-wrench-setting');
    const res = await client.post(`/api/rework/${item.id}/answer`, {
      answer: { choice: '97.36 in·lbf', variant: item.question!.variant, hinted: true },
      clientId: randomUUID(),
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ correct: true, rating: 2, ratingWord: 'hard' });
    // The scorer's worked arithmetic comes with the verdict.
    expect(res.body.notes.join(' ')).toMatch(/in·lbf/);
  });

  it('another learner can neither see nor answer the item', async () => {
    const { client: other } = await newLearner('rework-other');
    const [row] = await db.select().from(reworkItems).where(eq(reworkItems.userId, learnerId));
    expect(await items(other)).toMatchObject({ due: [], upcoming: [] });
    const res = await other.post(`/api/rework/${row!.id}/answer`, { answer: { choice: 'bolt-1', variant: 0 }, clientId: randomUUID() });
    expect(res.status).toBe(404);
    const answers = await db.select({ id: reworkAnswers.id }).from(reworkAnswers).where(and(eq(reworkAnswers.itemId, row!.id)));
    expect(answers).toHaveLength(1);
  });

  it('bad answers get 400 with what was wrong; an unknown item 404; signed out 401', async () => {
    const [row] = await db.select().from(reworkItems).where(eq(reworkItems.userId, learnerId));
    const url = `/api/rework/${row!.id}/answer`;
    const cases: [unknown, RegExp][] = [
      [{ answer: { choice: 'bolt-99', variant: 0 }, clientId: randomUUID() }, /not one of this question's choices/],
      [{ answer: { choice: 'bolt-1', variant: 0 }, clientId: 'abc' }, /clientId/],
      [{ answer: { choice: 'bolt-1' }, clientId: randomUUID() }, /variant|Required/],
      [{ answer: { choice: '', variant: 0 }, clientId: randomUUID() }, /choice|at least/],
      [{ clientId: randomUUID() }, /answer|Required/],
    ];
    for (const [body, message] of cases) {
      const res = await learner.post(url, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(JSON.stringify(res.body), JSON.stringify(body)).toMatch(message);
    }
    expect((await learner.request('POST', url, 'not json', { 'content-type': 'application/json' })).status).toBe(400);
    expect((await learner.post(`/api/rework/${randomUUID()}/answer`, { answer: { choice: 'x', variant: 0 }, clientId: randomUUID() })).status).toBe(404);
    expect((await learner.post('/api/rework/not-an-id/answer', { answer: { choice: 'x', variant: 0 }, clientId: randomUUID() })).status).toBe(404);
    expect((await new Client().post(url, { answer: { choice: 'bolt-1', variant: 0 }, clientId: randomUUID() })).status).toBe(401);
    expect((await new Client().get('/api/me/rework')).status).toBe(401);
  });

  it('an order mistake queues the step that came too early, and its question accepts what may follow it', async () => {
    const { client } = await newLearner('rework-order');
    const order = (correctAnswer(sump, 'order') as { sequence: string[] }).sequence;
    await submit(client, 'order', { sequence: ['fit-gasket', ...order.filter((k) => k !== 'fit-gasket')] });
    const { due } = await items(client);
    expect(due.map((i) => [i.itemKey, i.missKind])).toEqual([['fit-gasket', 'out-of-order']]);
    expect(due[0]!.question!.kind).toBe('next-step');
    // Seating the sump cover may come right after the gasket (everything else it needs can be done before).
    const res = await client.post(`/api/rework/${due[0]!.id}/answer`, { answer: { choice: 'seat-sump-cover', variant: due[0]!.question!.variant }, clientId: randomUUID() });
    expect(res.body.correct).toBe(true);
  });
});

describe('progress', () => {
  it('scores over time per procedure and stage, items by standing, and the streak in the given time zone', async () => {
    const { client } = await newLearner('progress');
    await submit(client, 'pattern', roundTheCircle);
    await submit(client, 'pattern', reference);
    const res = await client.get('/api/me/progress?tz=America/Chicago');
    expect(res.status).toBe(200);
    expect(res.body.timeZone).toBe('America/Chicago');
    const sumpProgress = res.body.procedures.find((p: { slug: string }) => p.slug === 'wren-160-sump');
    const pattern = sumpProgress.stages.find((s: { stage: string }) => s.stage === 'pattern');
    expect(pattern.attempts).toHaveLength(2);
    expect(pattern.attempts[0].percent).toBeLessThan(100);
    expect(pattern).toMatchObject({ latest: 100, best: 100 });
    expect(res.body.rework).toEqual({ mastered: 0, due: 1, learning: 0, total: 1 });
    expect(sumpProgress.rework).toEqual({ mastered: 0, due: 1, learning: 0 });
    expect(res.body.streak).toMatchObject({ current: 1, longest: 1, practisedToday: true });
    expect(res.body.streak.days).toEqual([res.body.today]);
  });

  it('defaults to UTC and refuses an unknown time zone with 400', async () => {
    const { client } = await newLearner('progress-tz');
    const plain = await client.get('/api/me/progress');
    expect(plain.status).toBe(200);
    expect(plain.body).toMatchObject({ timeZone: 'UTC', procedures: [], rework: { total: 0 }, streak: { current: 0 } });
    const bad = await client.get('/api/me/progress?tz=Mars/Olympus');
    expect(bad.status).toBe(400);
    expect(bad.body.fields.tz[0]).toMatch(/time zone/);
  });
});
