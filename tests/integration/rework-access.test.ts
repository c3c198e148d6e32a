import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { reworkItems } from '../../src/db/schema';
import { Client, demoUser, newLearner } from './helpers/client';
import { testDb } from './helpers/db';
import { THREE_SIGNATURE, assetUrls, pageHtml, reachable } from './helpers/bundles';

// Who may call the rework and progress routes and open their pages. The owner is a new learner in the
// demo class "Small Engines I" with one missed step; "instructor" teaches that class, "other instructor"
// teaches none of the owner's classes.

type Who = 'anonymous' | 'owner' | 'otherLearner' | 'instructor' | 'otherInstructor' | 'admin';
const WHO: Who[] = ['anonymous', 'owner', 'otherLearner', 'instructor', 'otherInstructor', 'admin'];

const clients = {} as Record<Who, Client>;
let ownerId = '';
let itemId = '';
const { db, close } = testDb();
afterAll(close);

beforeAll(async () => {
  const owner = await newLearner('access-owner');
  clients.owner = owner.client;
  ownerId = owner.user.id;
  expect((await owner.client.post('/api/classes/join', { joinCode: 'WREN4SMA' })).status).toBe(200);
  // One wrong fastener count: one rework item.
  const attempt = await owner.client.post('/api/attempts', {
    procedure: 'wren-160-sump', stage: 'final-check', answer: { fastenersCounted: 7, crankTurns: 2, leftover: 0 }, clientId: randomUUID(),
  });
  expect(attempt.status).toBe(201);
  const [item] = await db.select({ id: reworkItems.id }).from(reworkItems).where(eq(reworkItems.userId, ownerId));
  itemId = item!.id;
  clients.anonymous = new Client();
  clients.otherLearner = (await newLearner('access-other')).client;
  clients.instructor = (await demoUser('instructor@larkspur.example')).client;
  clients.otherInstructor = (await demoUser('instructor2@larkspur.example')).client;
  clients.admin = (await demoUser('admin@larkspur.example')).client;
});

const routes: { name: string; call: (c: Client) => Promise<{ status: number }>; expect: Record<Who, number> }[] = [
  {
    name: 'GET /api/me/rework',
    call: (c) => c.get('/api/me/rework'),
    expect: { anonymous: 401, owner: 200, otherLearner: 200, instructor: 200, otherInstructor: 200, admin: 200 },
  },
  {
    name: "POST /api/rework/:id/answer (the owner's item)",
    // A choice the question does not offer: the owner gets 400 (the item is theirs), so nothing is answered.
    call: (c) => c.post(`/api/rework/${itemId}/answer`, { answer: { choice: 'not-a-choice', variant: 0 }, clientId: randomUUID() }),
    expect: { anonymous: 401, owner: 400, otherLearner: 404, instructor: 404, otherInstructor: 404, admin: 404 },
  },
  {
    name: 'GET /api/me/progress',
    call: (c) => c.get('/api/me/progress'),
    expect: { anonymous: 401, owner: 200, otherLearner: 200, instructor: 200, otherInstructor: 200, admin: 200 },
  },
  {
    name: "GET /api/learners/:id/progress (the owner's)",
    call: (c) => c.get(`/api/learners/${ownerId}/progress`),
    expect: { anonymous: 401, owner: 403, otherLearner: 403, instructor: 200, otherInstructor: 404, admin: 200 },
  },
];

describe('rework and progress routes by role and owner', () => {
  for (const route of routes) {
    for (const who of WHO) {
      it(`${route.name} as ${who} → ${route.expect[who]}`, async () => {
        expect((await route.call(clients[who])).status).toBe(route.expect[who]);
      });
    }
  }

  it("the instructor sees the owner's progress, not their own", async () => {
    const res = await clients.instructor.get(`/api/learners/${ownerId}/progress?tz=Europe/Oslo`);
    expect(res.body.learner.id).toBe(ownerId);
    expect(res.body.timeZone).toBe('Europe/Oslo');
    expect(res.body.rework).toMatchObject({ total: 1, due: 1 });
    const sump = res.body.procedures.find((p: { slug: string }) => p.slug === 'wren-160-sump');
    expect(sump.stages[0]).toMatchObject({ stage: 'final-check', latest: 50 });
  });

  it('an instructor id or an unknown id is not a learner to look at', async () => {
    const { user } = await demoUser('instructor2@larkspur.example');
    expect((await clients.admin.get(`/api/learners/${user.id}/progress`)).status).toBe(404);
    expect((await clients.admin.get('/api/learners/no-such-user/progress')).status).toBe(404);
  });

  it("the other learner's rework list does not hold the owner's item", async () => {
    const res = await clients.otherLearner.get('/api/me/rework');
    expect([...res.body.due, ...res.body.upcoming].map((i: { id: string }) => i.id)).not.toContain(itemId);
  });
});

describe('pages', () => {
  const pages: { path: () => string; status: Record<Exclude<Who, 'anonymous'>, number> }[] = [
    { path: () => '/rework', status: { owner: 200, otherLearner: 200, instructor: 200, otherInstructor: 200, admin: 200 } },
    { path: () => '/progress', status: { owner: 200, otherLearner: 200, instructor: 200, otherInstructor: 200, admin: 200 } },
    {
      path: () => `/teach/learners/${ownerId}/progress`,
      status: { owner: 403, otherLearner: 403, instructor: 200, otherInstructor: 404, admin: 200 },
    },
  ];
  for (const page of pages) {
    it(`${page.path().replace(/[0-9a-f-]{36}/, ':id')}: signed out to sign-in, then by role and class`, async () => {
      const path = page.path();
      const anon = await clients.anonymous.get(path);
      expect(anon.status).toBe(302);
      expect(anon.headers.get('location')).toBe(`/sign-in?next=${encodeURIComponent(path)}`);
      for (const [who, status] of Object.entries(page.status)) expect((await clients[who as Who].get(path)).status, who).toBe(status);
    });
  }

  it("the class roster links each learner's progress", async () => {
    const classes = await clients.instructor.get('/api/classes');
    const demo = classes.body.find((c: { name: string }) => c.name === 'Small Engines I');
    const html = (await clients.instructor.get(`/teach/classes/${demo.id}`)).body as string;
    expect(html).toContain(`href="/teach/learners/${ownerId}/progress"`);
  });

  it('/learn leads to Rework and Progress and says what is due', async () => {
    const html = (await clients.owner.get('/learn')).body as string;
    expect(html).toContain('href="/rework"');
    expect(html).toContain('href="/progress"');
    expect(html).toMatch(/1 missed step is due now/);
  });

  it('/rework hands the island the list with the question, and no answer key', async () => {
    const html = (await clients.owner.get('/rework')).body as string;
    expect(html).toContain('How many fasteners do you count installed');
    expect(html).not.toContain('accepted');
  });
});

describe('three.js on the new pages', () => {
  it('/progress loads none, not even lazily', async () => {
    const html = await pageHtml(clients.owner, '/progress');
    for (const [url, code] of reachable(assetUrls(html), true)) expect(code, url).not.toMatch(THREE_SIGNATURE);
  });

  it('/rework loads it only lazily, for the questions shown on the model', async () => {
    const html = await pageHtml(clients.owner, '/rework');
    for (const [url, code] of reachable(assetUrls(html), false)) expect(code, url).not.toMatch(THREE_SIGNATURE);
    expect([...reachable(assetUrls(html), true).values()].some((code) => THREE_SIGNATURE.test(code))).toBe(true);
  });
});
