import { beforeAll, describe, expect, it } from 'vitest';
import { Client, demoUser, newLearner, uniqueEmail } from './helpers/client';

// Who may use the class e-mail routes and pages: the class's own instructors and admins; nobody else.

let owner: Client;
let classId: string;

beforeAll(async () => {
  owner = (await demoUser('instructor@larkspur.example')).client;
  const created = await owner.post('/api/classes', { name: 'Small Engines (access)' });
  expect(created.status).toBe(201);
  classId = created.body.id;
});

describe('who may invite and import', () => {
  type Who = 'anonymous' | 'learner' | 'otherInstructor' | 'owner' | 'admin';
  const clients = {} as Record<Who, Client>;
  beforeAll(async () => {
    clients.anonymous = new Client();
    clients.learner = (await newLearner('mail-matrix')).client;
    clients.otherInstructor = (await demoUser('instructor2@larkspur.example')).client;
    clients.owner = owner;
    clients.admin = (await demoUser('admin@larkspur.example')).client;
  });

  const routes: { name: string; call: (c: Client, id: string) => Promise<{ status: number }>; ok: number }[] = [
    { name: 'GET invitations', call: (c, id) => c.get(`/api/classes/${id}/invitations`), ok: 200 },
    { name: 'POST invitations', call: (c, id) => c.post(`/api/classes/${id}/invitations`, { invites: [{ email: uniqueEmail('matrix-invite') }] }), ok: 201 },
    { name: 'POST roster/preview', call: (c, id) => c.post(`/api/classes/${id}/roster/preview`, { csv: `Someone,${uniqueEmail('matrix-preview')}` }), ok: 200 },
    { name: 'POST roster/import', call: (c, id) => c.post(`/api/classes/${id}/roster/import`, { csv: `Someone,${uniqueEmail('matrix-import')}` }), ok: 200 },
  ];
  const expected: Record<Who, (ok: number) => number> = {
    anonymous: () => 401,
    learner: () => 403,
    otherInstructor: () => 403,
    owner: (ok) => ok,
    admin: (ok) => ok,
  };

  for (const route of routes) {
    for (const who of Object.keys(expected) as Who[]) {
      it(`${route.name} as ${who} → ${expected[who](route.ok)}`, async () => {
        expect((await route.call(clients[who], classId)).status).toBe(expected[who](route.ok));
      });
    }
    it(`${route.name} on a class id that is not a UUID, or names no class → 404`, async () => {
      expect((await route.call(owner, 'not-a-class')).status).toBe(404);
      expect((await route.call(owner, '00000000-0000-4000-8000-000000000000')).status).toBe(404);
    });
  }
});

describe('the sent-mail page is for admins; the reset pages are for anyone', () => {
  it('/admin/mail', async () => {
    const anon = await new Client().get('/admin/mail');
    expect(anon.status).toBe(302);
    expect(anon.headers.get('location')).toBe('/sign-in?next=%2Fadmin%2Fmail');
    expect((await (await newLearner('mail-page')).client.get('/admin/mail')).status).toBe(403);
    expect((await owner.get('/admin/mail')).status).toBe(403);
    const admin = await (await demoUser('admin@larkspur.example')).client.get('/admin/mail');
    expect(admin.status).toBe(200);
    expect(admin.body).toContain('data-testid="mail-count"');
  });

  it('/forgot-password and /reset-password', async () => {
    for (const path of ['/forgot-password', '/reset-password']) {
      expect((await new Client().get(path)).status).toBe(200);
      expect((await owner.get(path)).status).toBe(200);
    }
  });
});
