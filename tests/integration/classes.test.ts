import { describe, expect, it } from 'vitest';
import { Client, demoUser, newLearner } from './helpers/client';

describe('classes and join codes', () => {
  it('an instructor creates a class and gets a join code; a learner joins with it', async () => {
    const { client: instructor } = await demoUser('instructor@larkspur.example');
    const created = await instructor.post('/api/classes', { name: 'Small Engines II' });
    expect(created.status).toBe(201);
    expect(created.body).toEqual({ id: expect.any(String), name: 'Small Engines II', joinCode: expect.stringMatching(/^[A-Z2-9]{8}$/) });

    const { client: learner } = await newLearner('joiner');
    // Codes read off a board arrive in lower case with spaces; they still work.
    const spaced = created.body.joinCode.toLowerCase().replace(/(.{4})/, '$1 ');
    const joined = await learner.post('/api/classes/join', { joinCode: spaced });
    expect(joined.status).toBe(200);
    expect(joined.body.classId).toBe(created.body.id);

    // Joining twice is harmless.
    expect((await learner.post('/api/classes/join', { joinCode: created.body.joinCode })).status).toBe(200);

    const mine = await learner.get('/api/classes');
    expect(mine.body).toEqual([expect.objectContaining({ id: created.body.id, name: 'Small Engines II', learners: 1 })]);
    expect(mine.body[0].joinCode).toBeUndefined();

    const taught = await instructor.get('/api/classes');
    expect(taught.body.find((c: { id: string }) => c.id === created.body.id)).toMatchObject({ learners: 1 });
  });

  it('an unknown join code is 404, a malformed one 400', async () => {
    const { client } = await newLearner('badcode');
    expect((await client.post('/api/classes/join', { joinCode: 'ZZZZZZZZ' })).status).toBe(404);
    const bad = await client.post('/api/classes/join', { joinCode: 'no!' });
    expect(bad.status).toBe(400);
    expect(bad.body.fields.joinCode).toBeDefined();
    expect((await client.post('/api/classes/join', {})).status).toBe(400);
  });

  it('a class name is required', async () => {
    const { client } = await demoUser('instructor@larkspur.example');
    const res = await client.post('/api/classes', { name: ' ' });
    expect(res.status).toBe(400);
    expect(res.body.fields.name).toBeDefined();
  });

  it('the class page is for its own instructors and admins only', async () => {
    const { client: owner } = await demoUser('instructor@larkspur.example');
    const { body } = await owner.post('/api/classes', { name: 'Owned class' });
    expect((await owner.get(`/teach/classes/${body.id}`)).status).toBe(200);
    const { client: other } = await demoUser('instructor2@larkspur.example');
    expect((await other.get(`/teach/classes/${body.id}`)).status).toBe(403);
    const { client: admin } = await demoUser('admin@larkspur.example');
    expect((await admin.get(`/teach/classes/${body.id}`)).status).toBe(200);
    expect((await owner.get('/teach/classes/not-a-class')).status).toBe(404);
  });
});

describe('admin: people and roles', () => {
  it('lists people and changes a role', async () => {
    const { client: admin } = await demoUser('admin@larkspur.example');
    const { user, client: promoted } = await newLearner('promote');
    const list = await admin.get('/api/admin/users');
    expect(list.status).toBe(200);
    expect(list.body.some((u: { id: string }) => u.id === user.id)).toBe(true);
    expect(list.body[0].passwordHash).toBeUndefined();

    const changed = await admin.patch(`/api/admin/users/${user.id}`, { role: 'instructor' });
    expect(changed.status).toBe(200);
    expect(changed.body.role).toBe('instructor');
    // The new role applies to the person's existing session at once.
    expect((await promoted.post('/api/classes', { name: 'Promoted class' })).status).toBe(201);
  });

  it('refuses an unknown role (400), an unknown person (404) and demoting the last admin (409)', async () => {
    const { client: admin, user } = await demoUser('admin@larkspur.example');
    expect((await admin.patch(`/api/admin/users/${user.id}`, { role: 'superuser' })).status).toBe(400);
    expect((await admin.patch('/api/admin/users/nobody', { role: 'learner' })).status).toBe(404);
    expect((await admin.patch(`/api/admin/users/${user.id}`, { role: 'learner' })).status).toBe(409);
  });
});

describe('health', () => {
  it('reports the database up', async () => {
    const res = await new Client().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: 'up' });
  });
});
