import { beforeAll, describe, expect, it } from 'vitest';
import { Client, demoUser, newLearner } from './helpers/client';

type Who = 'anonymous' | 'learner' | 'instructor' | 'admin';

const clients = {} as Record<Who, Client>;
let someUserId = '';

beforeAll(async () => {
  clients.anonymous = new Client();
  const learner = await newLearner('matrix');
  clients.learner = learner.client;
  someUserId = learner.user.id;
  clients.instructor = (await demoUser('instructor2@larkspur.example')).client;
  clients.admin = (await demoUser('admin@larkspur.example')).client;
});

// Each route of the foundation, called by each role, with the status it must answer.
// A role-change PATCH keeps the learner a learner, so the matrix leaves the data as it found it.
const routes: { name: string; call: (c: Client) => Promise<{ status: number }>; expect: Record<Who, number> }[] = [
  { name: 'GET /api/health', call: (c) => c.get('/api/health'), expect: { anonymous: 200, learner: 200, instructor: 200, admin: 200 } },
  { name: 'GET /api/me', call: (c) => c.get('/api/me'), expect: { anonymous: 401, learner: 200, instructor: 200, admin: 200 } },
  { name: 'GET /api/classes', call: (c) => c.get('/api/classes'), expect: { anonymous: 401, learner: 200, instructor: 200, admin: 200 } },
  {
    name: 'POST /api/classes',
    call: (c) => c.post('/api/classes', { name: 'Matrix class' }),
    expect: { anonymous: 401, learner: 403, instructor: 201, admin: 403 },
  },
  {
    name: 'POST /api/classes/join (demo code)',
    call: (c) => c.post('/api/classes/join', { joinCode: 'WREN4SMA' }),
    expect: { anonymous: 401, learner: 200, instructor: 403, admin: 403 },
  },
  { name: 'GET /api/admin/users', call: (c) => c.get('/api/admin/users'), expect: { anonymous: 401, learner: 403, instructor: 403, admin: 200 } },
  {
    name: 'PATCH /api/admin/users/:id',
    call: (c) => c.patch(`/api/admin/users/${someUserId}`, { role: 'learner' }),
    expect: { anonymous: 401, learner: 403, instructor: 403, admin: 200 },
  },
  {
    name: 'POST /api/auth/sign-out (last: ends sessions)',
    call: (c) => c.post('/api/auth/sign-out'),
    expect: { anonymous: 204, learner: 204, instructor: 204, admin: 204 },
  },
];

describe('role matrix', () => {
  for (const route of routes) {
    for (const who of ['anonymous', 'learner', 'instructor', 'admin'] as Who[]) {
      it(`${route.name} as ${who} → ${route.expect[who]}`, async () => {
        expect((await route.call(clients[who])).status).toBe(route.expect[who]);
      });
    }
  }
});

describe('pages send the signed-out to sign-in and the wrong role to a 403 page', () => {
  const pages: { path: string; allowed: Who[] }[] = [
    { path: '/learn', allowed: ['learner'] },
    { path: '/teach', allowed: ['instructor', 'admin'] },
    { path: '/admin/users', allowed: ['admin'] },
  ];
  for (const page of pages) {
    it(`${page.path}`, async () => {
      const fresh: Record<Who, Client> = {
        anonymous: new Client(),
        learner: (await newLearner('pages')).client,
        instructor: (await demoUser('instructor@larkspur.example')).client,
        admin: (await demoUser('admin@larkspur.example')).client,
      };
      const anon = await fresh.anonymous.get(page.path);
      expect(anon.status).toBe(302);
      expect(anon.headers.get('location')).toBe(`/sign-in?next=${encodeURIComponent(page.path)}`);
      for (const who of ['learner', 'instructor', 'admin'] as Who[]) {
        expect((await fresh[who].get(page.path)).status, who).toBe(page.allowed.includes(who) ? 200 : 403);
      }
    });
  }
});
