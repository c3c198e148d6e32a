import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { correctAnswer } from '../../src/lib/procedure/reference-answers';
import { demoProcedure } from '../support/demo-procedures';
import { Client, demoUser, newLearner } from './helpers/client';
import { classWithLearners, inDays } from './helpers/drill-class';

// Who may do what with drills: every route, called by each kind of caller, with the status it must answer.
// "other instructor" teaches no class of this drill; "outsider" is a learner of no class of it.

type Who = 'anonymous' | 'member' | 'outsider' | 'instructor' | 'otherInstructor' | 'admin';
const WHO: Who[] = ['anonymous', 'member', 'outsider', 'instructor', 'otherInstructor', 'admin'];

const sump = demoProcedure('wren-160-sump');
const clients = {} as Record<Who, Client>;
let classId = '';
let drillId = '';
let attemptId = '';

beforeAll(async () => {
  const s = await classWithLearners(1, 'access');
  classId = s.classId;
  clients.anonymous = new Client();
  clients.member = s.learners[0]!.client;
  clients.outsider = (await newLearner('access-out')).client;
  clients.instructor = s.instructor;
  clients.otherInstructor = (await demoUser('instructor2@larkspur.example')).client;
  clients.admin = (await demoUser('admin@larkspur.example')).client;
  const made = await s.instructor.post(`/api/classes/${classId}/drills`, {
    procedure: 'wren-160-sump',
    stages: ['order'],
    dueAt: inDays(9),
    passMarkPct: 80,
    answersAfterDue: true,
  });
  drillId = made.body.id;
  const attempt = await clients.member.post('/api/attempts', { procedure: 'wren-160-sump', stage: 'order', answer: { sequence: [] }, clientId: randomUUID(), drillId });
  attemptId = attempt.body.id;
});

const newDrill = () => ({ procedure: 'wren-160-spark-plug', stages: ['order'], dueAt: inDays(8), passMarkPct: 60 });

const routes: { name: string; call: (c: Client) => Promise<{ status: number }>; expect: Record<Who, number> }[] = [
  {
    name: 'POST /api/classes/:id/drills',
    call: (c) => c.post(`/api/classes/${classId}/drills`, newDrill()),
    expect: { anonymous: 401, member: 403, outsider: 403, instructor: 201, otherInstructor: 404, admin: 201 },
  },
  {
    name: 'GET /api/classes/:id/drills',
    call: (c) => c.get(`/api/classes/${classId}/drills`),
    expect: { anonymous: 401, member: 200, outsider: 404, instructor: 200, otherInstructor: 404, admin: 200 },
  },
  {
    name: 'PATCH /api/drills/:id',
    call: (c) => c.patch(`/api/drills/${drillId}`, { passMarkPct: 80 }),
    expect: { anonymous: 401, member: 403, outsider: 403, instructor: 200, otherInstructor: 404, admin: 200 },
  },
  {
    name: 'GET /api/me/drills',
    call: (c) => c.get('/api/me/drills'),
    expect: { anonymous: 401, member: 200, outsider: 200, instructor: 403, otherInstructor: 403, admin: 403 },
  },
  {
    name: 'POST /api/attempts with drillId',
    call: (c) => c.post('/api/attempts', { procedure: 'wren-160-sump', stage: 'order', answer: correctAnswer(sump, 'order'), clientId: randomUUID(), drillId }),
    expect: { anonymous: 401, member: 201, outsider: 404, instructor: 404, otherInstructor: 404, admin: 404 },
  },
  {
    name: 'GET /api/attempts/:id (an attempt on the drill)',
    call: (c) => c.get(`/api/attempts/${attemptId}`),
    expect: { anonymous: 401, member: 200, outsider: 404, instructor: 200, otherInstructor: 404, admin: 200 },
  },
  {
    name: 'GET /train/:procedure?drill=:id',
    call: (c) => c.get(`/train/wren-160-sump?drill=${drillId}`),
    expect: { anonymous: 302, member: 200, outsider: 403, instructor: 403, otherInstructor: 403, admin: 403 },
  },
  {
    name: 'GET /teach/classes/:id',
    call: (c) => c.get(`/teach/classes/${classId}`),
    expect: { anonymous: 302, member: 403, outsider: 403, instructor: 200, otherInstructor: 403, admin: 200 },
  },
];

describe('drills access matrix', () => {
  for (const route of routes) {
    for (const who of WHO) {
      it(`${route.name} as ${who} → ${route.expect[who]}`, async () => {
        const res = await route.call(clients[who]);
        expect(res.status).toBe(route.expect[who]);
      });
    }
  }
});

describe('drill ids that are not there', () => {
  it('an unknown or malformed class or drill id is 404 for those who may otherwise use the route', async () => {
    expect((await clients.admin.get(`/api/classes/${randomUUID()}/drills`)).status).toBe(404);
    expect((await clients.admin.post(`/api/classes/${randomUUID()}/drills`, newDrill())).status).toBe(404);
    expect((await clients.instructor.get('/api/classes/not-a-class/drills')).status).toBe(404);
    expect((await clients.instructor.patch(`/api/drills/${randomUUID()}`, { closed: true })).status).toBe(404);
    expect((await clients.instructor.patch('/api/drills/123', { closed: true })).status).toBe(404);
  });

  it('the other instructor cannot close the drill, and it stays open', async () => {
    expect((await clients.otherInstructor.patch(`/api/drills/${drillId}`, { closed: true })).status).toBe(404);
    const list = await clients.instructor.get(`/api/classes/${classId}/drills`);
    expect(list.body.find((d: { id: string }) => d.id === drillId).closedAt).toBeNull();
  });

  it('the trainer page tells a learner of another class the drill is not theirs', async () => {
    const page = await clients.outsider.get(`/train/wren-160-sump?drill=${drillId}`);
    expect(page.status).toBe(403);
    expect(page.body).toContain('This drill is not assigned to you');
    expect(page.body).not.toContain('astro-island');
    const made = await clients.member.get(`/train/wren-160-sump?drill=${drillId}`);
    expect(made.body).toContain('data-testid="drill-banner"');
    // Opened under another procedure's address, the page goes to the drill's own.
    const moved = await clients.member.get(`/train/wren-160-head?drill=${drillId}`);
    expect(moved.status).toBe(302);
    expect(moved.headers.get('location')).toBe(`/train/wren-160-sump?drill=${drillId}`);
  });
});
