import { beforeAll, describe, expect, it } from 'vitest';
import type { Client } from './helpers/client';
import { benchWorld, photoForm, pngBytes } from './helpers/bench-world';

// Who may call each upload and sign-off route. "owner" is the learner whose photo and sign-offs are
// asked for (a learner in class A); "instructorA" teaches class A; "instructorB" teaches class B only;
// "otherLearner" is a learner in class B.

type Who = 'anonymous' | 'owner' | 'otherLearner' | 'instructorA' | 'instructorB' | 'admin';
const EVERYONE: Who[] = ['anonymous', 'owner', 'otherLearner', 'instructorA', 'instructorB', 'admin'];

let world: Awaited<ReturnType<typeof benchWorld>>;
const clients = {} as Record<Who, Client>;
let photoId = '';

beforeAll(async () => {
  world = await benchWorld();
  Object.assign(clients, {
    anonymous: world.anonymous,
    owner: world.owner.client,
    otherLearner: world.otherLearner.client,
    instructorA: world.instructorA.client,
    instructorB: world.instructorB.client,
    admin: world.admin,
  });
  const res = await world.owner.client.postForm('/api/uploads', photoForm(pngBytes([5, 50, 150])));
  photoId = res.body.id;
});

const signOff = () => ({ learnerId: world.owner.user.id, procedure: 'wren-160-sump', benchDate: '2026-02-03', outcome: 'redo', notes: 'matrix' });

const routes: { name: string; call: (c: Client) => Promise<{ status: number }>; expect: Record<Who, number> }[] = [
  {
    name: 'POST /api/uploads',
    call: (c) => c.postForm('/api/uploads', photoForm(pngBytes())),
    expect: { anonymous: 401, owner: 201, otherLearner: 201, instructorA: 403, instructorB: 403, admin: 403 },
  },
  {
    name: "GET /api/uploads/:id (the owner's photo)",
    call: (c) => c.get(`/api/uploads/${photoId}`),
    expect: { anonymous: 401, owner: 200, otherLearner: 404, instructorA: 200, instructorB: 404, admin: 200 },
  },
  {
    name: 'GET /api/uploads/:id (no such id, and not an id)',
    call: async (c) => {
      const a = await c.get('/api/uploads/0f6b2f7e-3c41-4d8e-9b0a-5e2d7c1a9f33');
      const b = await c.get('/api/uploads/not-an-id');
      return { status: a.status === b.status ? a.status : -1 };
    },
    expect: { anonymous: 401, owner: 404, otherLearner: 404, instructorA: 404, instructorB: 404, admin: 404 },
  },
  {
    name: "DELETE /api/uploads/:id (the owner's photo; the owner goes last and deletes it)",
    call: (c) => c.delete(`/api/uploads/${photoId}`),
    expect: { anonymous: 401, owner: 204, otherLearner: 404, instructorA: 403, instructorB: 404, admin: 403 },
  },
  {
    name: 'GET /api/me/uploads',
    call: (c) => c.get('/api/me/uploads'),
    expect: { anonymous: 401, owner: 200, otherLearner: 200, instructorA: 403, instructorB: 403, admin: 403 },
  },
  {
    name: 'GET /api/me/sign-offs',
    call: (c) => c.get('/api/me/sign-offs'),
    expect: { anonymous: 401, owner: 200, otherLearner: 200, instructorA: 403, instructorB: 403, admin: 403 },
  },
  {
    name: 'POST /api/classes/:id/sign-offs (class A)',
    call: (c) => c.post(`/api/classes/${world.classA.id}/sign-offs`, signOff()),
    expect: { anonymous: 401, owner: 403, otherLearner: 403, instructorA: 201, instructorB: 403, admin: 201 },
  },
  {
    name: 'GET /api/classes/:id/sign-offs (class A)',
    call: (c) => c.get(`/api/classes/${world.classA.id}/sign-offs`),
    expect: { anonymous: 401, owner: 403, otherLearner: 403, instructorA: 200, instructorB: 403, admin: 200 },
  },
  {
    name: 'GET /api/classes/:id/bench-photos (class A, the owner)',
    call: (c) => c.get(`/api/classes/${world.classA.id}/bench-photos?learner=${world.owner.user.id}&procedure=wren-160-sump`),
    expect: { anonymous: 401, owner: 403, otherLearner: 403, instructorA: 200, instructorB: 403, admin: 200 },
  },
  {
    name: 'POST and GET /api/classes/:id/sign-offs for a class that does not exist',
    call: async (c) => {
      const path = '/api/classes/0f6b2f7e-3c41-4d8e-9b0a-5e2d7c1a9f33/sign-offs';
      const [a, b] = [await c.post(path, signOff()), await c.get(path)];
      return { status: a.status === b.status ? a.status : -1 };
    },
    expect: { anonymous: 401, owner: 403, otherLearner: 403, instructorA: 404, instructorB: 404, admin: 404 },
  },
];

describe('upload and sign-off routes, by who calls', () => {
  for (const route of routes) {
    // The owner last, so a deleting call leaves the photo in place for everyone else's call.
    for (const who of [...EVERYONE.filter((w) => w !== 'owner'), 'owner' as const]) {
      it(`${route.name} as ${who} → ${route.expect[who]}`, async () => {
        expect((await route.call(clients[who])).status).toBe(route.expect[who]);
      });
    }
  }
});

describe('what each sees in the lists', () => {
  it("the class's sign-offs list is the same for its instructor and an admin; the learner's own list holds them", async () => {
    const forInstructor = await clients.instructorA.get(`/api/classes/${world.classA.id}/sign-offs`);
    const forAdmin = await clients.admin.get(`/api/classes/${world.classA.id}/sign-offs`);
    expect(forInstructor.body).toHaveLength(2);
    expect(forAdmin.body).toEqual(forInstructor.body);
    expect((await clients.owner.get('/api/me/sign-offs')).body).toHaveLength(2);
    expect((await clients.otherLearner.get('/api/me/sign-offs')).body).toEqual([]);
  });
});

describe('pages', () => {
  const pages = () => [
    { path: '/learn/bench', status: { anonymous: 302, owner: 200, otherLearner: 200, instructorA: 403, instructorB: 403, admin: 403 } },
    {
      path: `/teach/classes/${world.classA.id}/sign-offs`,
      status: { anonymous: 302, owner: 403, otherLearner: 403, instructorA: 200, instructorB: 403, admin: 200 },
    },
    {
      path: '/teach/classes/0f6b2f7e-3c41-4d8e-9b0a-5e2d7c1a9f33/sign-offs',
      status: { anonymous: 302, owner: 403, otherLearner: 403, instructorA: 404, instructorB: 404, admin: 404 },
    },
  ];
  it('each page answers each role as it should', async () => {
    for (const page of pages()) {
      for (const who of EVERYONE) {
        expect((await clients[who].get(page.path)).status, `${page.path} as ${who}`).toBe(page.status[who]);
      }
    }
  });
});
