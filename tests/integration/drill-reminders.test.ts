import { randomUUID } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { drillReminders } from '../../src/db/schema';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { demoProcedure } from '../support/demo-procedures';
import { testDb } from './helpers/db';
import { classWithLearners } from './helpers/drill-class';
import { mailTo } from '../support/mail-catcher';

// `npm run remind` with a fixed clock (--now): the reminder a day before a drill is due, once per learner.

const sump = demoProcedure('wren-160-sump');
const HOUR = 60 * 60 * 1000;

function remind(now: Date, env: Record<string, string> = {}) {
  const run = spawnSync(process.execPath, ['scripts/remind.mjs', `--now=${now.toISOString()}`], {
    env: { ...process.env, APP_URL: 'https://bench.example', ...env },
    encoding: 'utf8',
  });
  return { code: run.status, out: `${run.stdout}${run.stderr}` };
}

async function remindersOf(drillId: string) {
  const { db, close } = testDb();
  try {
    return await db.select({ userId: drillReminders.userId }).from(drillReminders).where(eq(drillReminders.drillId, drillId));
  } finally {
    await close();
  }
}

/** A drill due well after anything else the tests make, so the fixed clock sees only this one as due soon. */
async function drillDueLater(s: Awaited<ReturnType<typeof classWithLearners>>, daysAhead: number) {
  const dueAt = new Date(Date.now() + daysAhead * 24 * HOUR + Math.floor(Math.random() * 50) * 60_000);
  const made = await s.instructor.post(`/api/classes/${s.classId}/drills`, { procedure: 'wren-160-sump', stages: ['order'], dueAt: dueAt.toISOString(), passMarkPct: 80 });
  expect(made.status).toBe(201);
  return { id: made.body.id as string, dueAt };
}

const remindersFor = async (email: string, drillId: string) =>
  (await mailTo(email)).filter((m) => m.subject.startsWith('Due soon:') && m.text.includes(`drill=${drillId}`));

describe('npm run remind', () => {
  let s: Awaited<ReturnType<typeof classWithLearners>>;
  let drill: { id: string; dueAt: Date };
  beforeAll(async () => {
    s = await classWithLearners(3, 'remind');
    drill = await drillDueLater(s, 400 + Math.floor(Math.random() * 300));
    const [passer, trier] = s.learners;
    const send = (client: typeof passer.client, answer: unknown) =>
      client.post('/api/attempts', { procedure: 'wren-160-sump', stage: 'order', answer, clientId: randomUUID(), drillId: drill.id });
    expect((await send(passer!.client, correctAnswer(sump, 'order'))).status).toBe(201);
    expect((await send(trier!.client, { sequence: [] })).status).toBe(201);
  });

  it('sends nothing while the drill is more than a day away', async () => {
    const run = remind(new Date(drill.dueAt.getTime() - 30 * HOUR));
    expect(run.code, run.out).toBe(0);
    for (const learner of s.learners) expect(await remindersFor(learner.email, drill.id)).toHaveLength(0);
  });

  it('run twice within the last day: one reminder to each learner who has not passed, none to the one who has', async () => {
    const now = new Date(drill.dueAt.getTime() - 12 * HOUR);
    const first = remind(now);
    expect(first.code, first.out).toBe(0);
    const second = remind(new Date(now.getTime() + HOUR));
    expect(second.code, second.out).toBe(0);

    const [passer, trier, idle] = s.learners;
    expect(await remindersFor(passer!.email, drill.id)).toHaveLength(0);
    const toTrier = await remindersFor(trier!.email, drill.id);
    expect(toTrier).toHaveLength(1);
    expect(toTrier[0]!.subject).toBe(`Due soon: ${sump.title} (${s.className})`);
    expect(toTrier[0]!.text).toContain('So far: in progress, best score 0 %.');
    expect(toTrier[0]!.text).toContain(`https://bench.example/train/wren-160-sump?drill=${drill.id}`);
    const toIdle = await remindersFor(idle!.email, drill.id);
    expect(toIdle).toHaveLength(1);
    expect(toIdle[0]!.text).toContain('You have not started it yet.');
    expect((await remindersOf(drill.id)).map((r) => r.userId).sort()).toEqual([trier!.user.id, idle!.user.id].sort());
  });

  it('a failed send gives its claim back, so the next run sends it', async () => {
    const other = await classWithLearners(1, 'remind-retry');
    const later = await drillDueLater(other, 800 + Math.floor(Math.random() * 300));
    const now = new Date(later.dueAt.getTime() - 2 * HOUR);
    // Port 1 on loopback has no mail relay: every send fails.
    const broken = remind(now, { SMTP_PORT: '1' });
    expect(broken.code).toBe(1);
    expect(broken.out).toMatch(/failed/);
    expect(await remindersOf(later.id)).toHaveLength(0);
    expect(await remindersFor(other.learners[0]!.email, later.id)).toHaveLength(0);

    const retried = remind(now);
    expect(retried.code, retried.out).toBe(0);
    expect(await remindersFor(other.learners[0]!.email, later.id)).toHaveLength(1);
  });

  it('refuses a --now that is not a date', () => {
    const run = spawnSync(process.execPath, ['scripts/remind.mjs', '--now=yesterday'], { env: process.env, encoding: 'utf8' });
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/--now must be an ISO 8601 date and time/);
  });
});
