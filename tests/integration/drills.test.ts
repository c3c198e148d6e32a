import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { attempts, drills } from '../../src/db/schema';
import type { Stage } from '../../src/lib/procedure/schema';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { demoProcedure } from '../support/demo-procedures';
import { newLearner, type Client } from './helpers/client';
import { testDb } from './helpers/db';
import { classWithLearners, inDays } from './helpers/drill-class';
import { waitForMail } from '../support/mail-catcher';

const sump = demoProcedure('wren-160-sump');
const spark = demoProcedure('wren-160-spark-plug');

type Setup = Awaited<ReturnType<typeof classWithLearners>>;

function submit(client: Client, drillId: string, stage: Stage, answer: unknown, extra: Record<string, unknown> = {}) {
  return client.post('/api/attempts', { procedure: 'wren-160-sump', stage, answer, clientId: randomUUID(), drillId, ...extra });
}

async function storedAttempts(drillId: string, userId?: string) {
  const { db, close } = testDb();
  try {
    return await db
      .select({ id: attempts.id, stage: attempts.stage, results: attempts.results, notes: attempts.notes })
      .from(attempts)
      .where(userId ? and(eq(attempts.drillId, drillId), eq(attempts.userId, userId)) : eq(attempts.drillId, drillId));
  } finally {
    await close();
  }
}

/** Moves a drill's due date, as time passing would (the API refuses a past date on purpose). */
async function setDueAt(drillId: string, dueAt: Date) {
  const { db, close } = testDb();
  await db.update(drills).set({ dueAt }).where(eq(drills.id, drillId));
  await close();
}

describe('drills: an instructor assigns, edits and closes', () => {
  let s: Setup;
  beforeAll(async () => {
    s = await classWithLearners(3, 'assign');
  });

  it('assigns a drill pinned to the latest version, stages in trainer order, every learner not started', async () => {
    const dueAt = inDays(5);
    const res = await s.instructor.post(`/api/classes/${s.classId}/drills`, {
      procedure: 'wren-160-sump',
      stages: ['wrench', 'order'],
      dueAt,
      passMarkPct: 80,
      attemptLimit: 3,
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      classId: s.classId,
      className: s.className,
      procedure: { slug: 'wren-160-sump', title: sump.title, version: 1 },
      stages: ['order', 'wrench'],
      dueAt: new Date(dueAt).toISOString(),
      passMarkPct: 80,
      attemptLimit: 3,
      answersAfterDue: false,
      closedAt: null,
      learners: 3,
      counts: { 'not-started': 3, 'in-progress': 0, passed: 0, missed: 0, overdue: 0 },
    });
    const list = await s.instructor.get(`/api/classes/${s.classId}/drills`);
    expect(list.status).toBe(200);
    expect(list.body.map((d: { id: string }) => d.id)).toEqual([res.body.id]);
  });

  it('pins a given version, and names the field when the procedure, version or stages are wrong', async () => {
    const base = { stages: ['order'], dueAt: inDays(3), passMarkPct: 70 };
    const pinned = await s.instructor.post(`/api/classes/${s.classId}/drills`, { ...base, procedure: 'wren-160-head', version: 1 });
    expect(pinned.status).toBe(201);
    expect(pinned.body.procedure.version).toBe(1);

    const noVersion = await s.instructor.post(`/api/classes/${s.classId}/drills`, { ...base, procedure: 'wren-160-head', version: 99 });
    expect(noVersion.status).toBe(400);
    expect(noVersion.body.fields.version).toEqual(['wren-160-head has no version 99']);
    const unknown = await s.instructor.post(`/api/classes/${s.classId}/drills`, { ...base, procedure: 'wren-999' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.fields.procedure).toEqual(['No published procedure "wren-999"']);
    const noPins = await s.instructor.post(`/api/classes/${s.classId}/drills`, { ...base, procedure: 'wren-160-flywheel', stages: ['order', 'pins'] });
    expect(noPins.status).toBe(400);
    expect(noPins.body.fields.stages[0]).toMatch(/^wren-160-flywheel has no Pins stage/);
  });

  it('refuses a due date in the past, a bad pass mark and no stages with 400 and field errors', async () => {
    const res = await s.instructor.post(`/api/classes/${s.classId}/drills`, {
      procedure: 'wren-160-sump',
      stages: [],
      dueAt: inDays(-1),
      passMarkPct: 0,
    });
    expect(res.status).toBe(400);
    expect(res.body.fields).toEqual({
      stages: ['Pick at least one stage'],
      dueAt: ['The due date has already passed: pick a later one'],
      passMarkPct: ['The pass mark is at least 1 %'],
    });
    const notJson = await s.instructor.request('POST', `/api/classes/${s.classId}/drills`, 'not json', { 'content-type': 'application/json' });
    expect(notJson.status).toBe(400);
  });

  it('edits, closes and reopens a drill, keeping every attempt', async () => {
    const made = await s.instructor.post(`/api/classes/${s.classId}/drills`, {
      procedure: 'wren-160-sump',
      stages: ['order', 'pins'],
      dueAt: inDays(4),
      passMarkPct: 80,
    });
    const id = made.body.id as string;
    const learner = s.learners[0]!;
    expect((await submit(learner.client, id, 'order', correctAnswer(sump, 'order'))).status).toBe(201);

    const edited = await s.instructor.patch(`/api/drills/${id}`, { passMarkPct: 90, attemptLimit: 2, stages: ['pins', 'order', 'final-check'] });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ passMarkPct: 90, attemptLimit: 2, stages: ['order', 'pins', 'final-check'], closedAt: null });
    expect(edited.body.counts).toMatchObject({ 'in-progress': 1, 'not-started': 2 });

    const past = await s.instructor.patch(`/api/drills/${id}`, { dueAt: inDays(-2) });
    expect(past.status).toBe(400);
    expect(past.body.fields.dueAt).toEqual(['The due date has already passed: pick a later one']);
    const repinned = await s.instructor.patch(`/api/drills/${id}`, { procedure: 'wren-160-head' });
    expect(repinned.status).toBe(400);
    const wrongStage = await s.instructor.patch(`/api/drills/${id}`, { stages: ['order'], passMarkPct: 101 });
    expect(wrongStage.status).toBe(400);
    expect(wrongStage.body.fields.passMarkPct).toEqual(['The pass mark is at most 100 %']);

    const closed = await s.instructor.patch(`/api/drills/${id}`, { closed: true });
    expect(closed.status).toBe(200);
    expect(closed.body.closedAt).not.toBeNull();
    // Closed: nobody can pass it any more, so every learner is counted as missed; the attempt is still there.
    expect(closed.body.counts).toMatchObject({ missed: 3 });
    expect(await storedAttempts(id)).toHaveLength(1);
    const refused = await submit(learner.client, id, 'pins', correctAnswer(sump, 'pins'));
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatch(/closed/);
    expect(await storedAttempts(id)).toHaveLength(1);

    // Closing again keeps the first closing time; reopening takes attempts again.
    const again = await s.instructor.patch(`/api/drills/${id}`, { closed: true });
    expect(again.body.closedAt).toBe(closed.body.closedAt);
    const reopened = await s.instructor.patch(`/api/drills/${id}`, { closed: false });
    expect(reopened.body.closedAt).toBeNull();
    expect((await submit(learner.client, id, 'pins', correctAnswer(sump, 'pins'))).status).toBe(201);
  });

  it('tells each learner of the class by e-mail when a drill is assigned', async () => {
    const made = await s.instructor.post(`/api/classes/${s.classId}/drills`, {
      procedure: 'wren-160-spark-plug',
      stages: ['order'],
      dueAt: '2031-06-02T15:00:00Z',
      passMarkPct: 100,
    });
    expect(made.status).toBe(201);
    for (const learner of s.learners) {
      const mail = await waitForMail(learner.email, (m) => m.text.includes(`drill=${made.body.id}`));
      expect(mail).toHaveLength(1);
      expect(mail[0]!.subject).toBe(`New drill for ${s.className}: ${spark.title}`);
      expect(mail[0]!.text).toContain('Due: Mon 2 Jun 2031, 15:00 UTC'); // 2 June 2031 is a Monday (`date -u -d 2031-06-02`)
      expect(mail[0]!.text).toContain(`/train/wren-160-spark-plug?drill=${made.body.id}`);
    }
  });
});

describe('drills: what a learner sees and may submit', () => {
  let s: Setup;
  let drillId: string;
  beforeAll(async () => {
    s = await classWithLearners(2, 'learner');
    const made = await s.instructor.post(`/api/classes/${s.classId}/drills`, {
      procedure: 'wren-160-sump',
      stages: ['order', 'wrench'],
      dueAt: inDays(6),
      passMarkPct: 75,
      attemptLimit: 2,
    });
    drillId = made.body.id;
  });

  it('GET /api/me/drills shows status, best score and attempts left, and follows each attempt', async () => {
    const { client } = s.learners[0]!;
    const mine = () => client.get('/api/me/drills').then((r) => r.body.find((d: { id: string }) => d.id === drillId));
    const before = await mine();
    expect(before).toMatchObject({ className: s.className, procedure: { slug: 'wren-160-sump', version: 1 }, stages: ['order', 'wrench'] });
    expect(before.progress).toMatchObject({ status: 'not-started', bestPct: null, attempts: 0, attemptsLeft: 2 });
    expect(before).not.toHaveProperty('counts');

    const first = await submit(client, drillId, 'order', correctAnswer(sump, 'order'));
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ drillId, answersHidden: false, passed: true });
    // The learner's standing comes back with the attempt: Order done, Wrench untouched.
    expect(first.body.drill).toMatchObject({ id: drillId, status: 'in-progress', bestPct: 50, attempts: 1, attemptsLeft: 2 });
    expect(first.body.drill.stages).toEqual([
      { stage: 'order', attempts: 1, bestPct: 100, passed: true, attemptsLeft: 1 },
      { stage: 'wrench', attempts: 0, bestPct: null, passed: false, attemptsLeft: 2 },
    ]);

    const after = await mine();
    expect(after.progress).toMatchObject({ status: 'in-progress', bestPct: 50, attempts: 1, attemptsLeft: 2 });
    expect((await submit(client, drillId, 'wrench', correctAnswer(sump, 'wrench'))).status).toBe(201);
    expect((await mine()).progress).toMatchObject({ status: 'passed', bestPct: 100, attempts: 2 });

    // The class list for a learner: the drills with their own standing, nothing instructors-only.
    const classList = await client.get(`/api/classes/${s.classId}/drills`);
    expect(classList.status).toBe(200);
    expect(classList.body[0]).toMatchObject({ id: drillId, progress: { status: 'passed' } });
    expect(classList.body[0]).not.toHaveProperty('counts');
    expect(classList.body[0]).not.toHaveProperty('learners');
  });

  it('refuses a stage the drill does not ask for, another procedure and another version with 400', async () => {
    const { client } = s.learners[1]!;
    const pins = await submit(client, drillId, 'pins', correctAnswer(sump, 'pins'));
    expect(pins.status).toBe(400);
    expect(pins.body.fields.stage[0]).toBe('The Pins stage is not part of this drill (it asks for: Order, Wrench)');
    const other = await client.post('/api/attempts', { procedure: 'wren-160-spark-plug', stage: 'order', answer: correctAnswer(spark, 'order'), clientId: randomUUID(), drillId });
    expect(other.status).toBe(400);
    expect(other.body.fields.procedure).toBeDefined();
    const version = await submit(client, drillId, 'order', correctAnswer(sump, 'order'), { version: 2 });
    expect(version.status).toBe(400);
    expect(version.body.fields.version[0]).toMatch(/pinned to version 1/);
    expect(await storedAttempts(drillId, s.learners[1]!.user.id)).toHaveLength(0);
  });

  it('a learner of another class, or a made-up drill id, gets 404 and nothing is stored', async () => {
    const outsider = await newLearner('outsider');
    const res = await submit(outsider.client, drillId, 'order', correctAnswer(sump, 'order'));
    expect(res.status).toBe(404);
    expect(res.body.fields.drillId).toEqual(['This drill is not assigned to you']);
    expect(await storedAttempts(drillId, outsider.user.id)).toHaveLength(0);
    expect((await submit(outsider.client, randomUUID(), 'order', correctAnswer(sump, 'order'))).status).toBe(404);
    expect((await submit(outsider.client, 'not-a-uuid', 'order', correctAnswer(sump, 'order'))).status).toBe(400);
  });

  it('refuses attempts past the per-stage limit with 409, stores nothing, and replays still answer', async () => {
    const { client, user } = s.learners[1]!;
    const wrong = { setting: 1, unit: 'N·m' };
    const clientId = randomUUID();
    const first = await client.post('/api/attempts', { procedure: 'wren-160-sump', stage: 'wrench', answer: wrong, clientId, drillId });
    expect(first.status).toBe(201);
    expect((await submit(client, drillId, 'wrench', wrong)).status).toBe(201);
    const third = await submit(client, drillId, 'wrench', correctAnswer(sump, 'wrench'));
    expect(third.status).toBe(409);
    expect(third.body.error).toBe('You have used all 2 attempts on the Wrench stage of this drill');
    expect((await storedAttempts(drillId, user.id)).filter((a) => a.stage === 'wrench')).toHaveLength(2);
    // A retried submit of the first attempt gets it back, limit or not.
    const replay = await client.post('/api/attempts', { procedure: 'wren-160-sump', stage: 'wrench', answer: wrong, clientId, drillId });
    expect(replay.status).toBe(200);
    expect(replay.body.id).toBe(first.body.id);
    // The same clientId without the drill is another submission.
    expect((await client.post('/api/attempts', { procedure: 'wren-160-sump', stage: 'wrench', answer: wrong, clientId })).status).toBe(409);
    // With no attempts left on a stage it cannot pass, the drill is missed.
    const mine = (await client.get('/api/me/drills')).body.find((d: { id: string }) => d.id === drillId);
    expect(mine.progress.status).toBe('missed');
  });

  it('parallel submits cannot pass the limit: one of three gets in when one attempt is left', async () => {
    const { client, user } = s.learners[1]!;
    expect((await submit(client, drillId, 'order', { sequence: [] })).status).toBe(201);
    const raced = await Promise.all([0, 1, 2].map(() => submit(client, drillId, 'order', correctAnswer(sump, 'order'))));
    expect(raced.map((r) => r.status).sort()).toEqual([201, 409, 409]);
    expect((await storedAttempts(drillId, user.id)).filter((a) => a.stage === 'order')).toHaveLength(2);
  });

  it('attempts after the due date count while the drill is open, and the drill shows overdue', async () => {
    const late = await s.instructor.post(`/api/classes/${s.classId}/drills`, {
      procedure: 'wren-160-sump',
      stages: ['order', 'pins'],
      dueAt: inDays(1),
      passMarkPct: 80,
    });
    await setDueAt(late.body.id, new Date(Date.now() - 60_000));
    const { client } = s.learners[0]!;
    const res = await submit(client, late.body.id, 'order', correctAnswer(sump, 'order'));
    expect(res.status).toBe(201);
    expect(res.body.drill.status).toBe('overdue');
    const counts = (await s.instructor.get(`/api/classes/${s.classId}/drills`)).body.find((d: { id: string }) => d.id === late.body.id).counts;
    expect(counts).toEqual({ 'not-started': 0, 'in-progress': 0, passed: 0, missed: 0, overdue: 2 });
  });
});

describe('drills that show the right answers only after the due date', () => {
  let s: Setup;
  let drillId: string;
  beforeAll(async () => {
    s = await classWithLearners(1, 'hidden');
    const made = await s.instructor.post(`/api/classes/${s.classId}/drills`, {
      procedure: 'wren-160-sump',
      stages: ['wrench', 'pins'],
      dueAt: inDays(2),
      passMarkPct: 80,
      answersAfterDue: true,
    });
    drillId = made.body.id;
  });

  it('before the due date the learner gets right / not right only; the database and the instructor keep everything', async () => {
    const { client } = s.learners[0]!;
    const res = await submit(client, drillId, 'wrench', { setting: 11, unit: 'N·m' });
    expect(res.status).toBe(201);
    expect(res.body.answersHidden).toBe(true);
    expect(res.body.notes).toEqual([]);
    expect(res.body.passed).toBe(false);
    const wrong = res.body.results.filter((r: { ok: boolean }) => !r.ok);
    expect(wrong.length).toBeGreaterThan(0);
    for (const line of res.body.results) expect(line.message).toMatch(/: (right|not right yet\. The right answer shows after the due date\.)$/);

    const [stored] = await storedAttempts(drillId);
    expect(stored!.notes.length).toBeGreaterThan(0);
    expect(stored!.results.map((r) => r.ok)).toEqual(res.body.results.map((r: { ok: boolean }) => r.ok));
    expect(stored!.results.some((r) => r.message.includes('not right yet'))).toBe(false);

    const mineAgain = await client.get(`/api/attempts/${res.body.id}`);
    expect(mineAgain.body.answersHidden).toBe(true);
    expect(mineAgain.body.results).toEqual(res.body.results);
    expect(mineAgain.body.notes).toEqual([]);
    const teacherView = await s.instructor.get(`/api/attempts/${res.body.id}`);
    expect(teacherView.status).toBe(200);
    expect(teacherView.body.answersHidden).toBe(false);
    expect(teacherView.body.results).toEqual(stored!.results);
    expect(teacherView.body.notes).toEqual(stored!.notes);

    // Once the due date has passed, the learner sees the whole feedback.
    await setDueAt(drillId, new Date(Date.now() - 1000));
    const afterDue = await client.get(`/api/attempts/${res.body.id}`);
    expect(afterDue.body.answersHidden).toBe(false);
    expect(afterDue.body.results).toEqual(stored!.results);
  });
});
