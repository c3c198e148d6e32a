import { describe, expect, it } from 'vitest';
import { Client, newLearner, uniqueEmail } from './helpers/client';

describe('sign-up, sign-in, sign-out', () => {
  it('signs up a learner, sets a session cookie and answers /api/me', async () => {
    const client = new Client();
    const email = uniqueEmail('signup');
    const res = await client.post('/api/auth/sign-up', { name: 'Rosa Quill', email, password: 'a-long-password' });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ id: expect.any(String), name: 'Rosa Quill', email, role: 'learner' });
    const me = await client.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.email).toBe(email);
  });

  it('stores e-mails in lower case and refuses a second account for the same address', async () => {
    const email = uniqueEmail('dupe');
    const first = await new Client().post('/api/auth/sign-up', { name: 'A', email: email.toUpperCase(), password: 'a-long-password' });
    expect(first.status).toBe(201);
    expect(first.body.email).toBe(email);
    const second = await new Client().post('/api/auth/sign-up', { name: 'B', email, password: 'another-password' });
    expect(second.status).toBe(409);
    expect(second.body.fields.email).toBeDefined();
  });

  it('answers bad sign-up input with 400 and the field errors', async () => {
    const res = await new Client().post('/api/auth/sign-up', { name: '', email: 'not-an-email', password: 'short' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fields).sort()).toEqual(['email', 'name', 'password']);
  });

  it('answers a body that is not JSON with 400, never 500', async () => {
    const client = new Client();
    const broken = await client.request('POST', '/api/auth/sign-in', '{"email":', { 'content-type': 'application/json' });
    expect(broken.status).toBe(400);
    const wrongType = await client.request('POST', '/api/auth/sign-up', 'name=x', { 'content-type': 'text/csv' });
    expect(wrongType.status).toBe(400);
    const array = await client.post('/api/auth/sign-in', [1, 2, 3]);
    expect(array.status).toBe(400);
  });

  it('signs in with the right password and sets an httpOnly, same-site session cookie', async () => {
    const { email } = await newLearner('signin');
    const client = new Client();
    const res = await client.post('/api/auth/sign-in', { email, password: 'correct horse battery' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ email, role: 'learner' });
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('bw_session='))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Path=\//);
  });

  it('gives the same 401 for a wrong password and an unknown e-mail', async () => {
    const { email } = await newLearner('wrongpw');
    const wrong = await new Client().post('/api/auth/sign-in', { email, password: 'not the password' });
    const unknown = await new Client().post('/api/auth/sign-in', { email: uniqueEmail('nobody'), password: 'whatever-it-is' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('signs out: 204, and the old session no longer works', async () => {
    const { client } = await newLearner('signout');
    expect((await client.get('/api/me')).status).toBe(200);
    const out = await client.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect(client.hasSession).toBe(false);
    expect((await client.get('/api/me')).status).toBe(401);
  });

  it('does not accept a made-up session cookie', async () => {
    const res = await new Client().request('GET', '/api/me', undefined, { cookie: 'bw_session=forged-session-id' });
    expect(res.status).toBe(401);
  });
});

describe('cross-origin form posts', () => {
  it('refuses a form post from another origin', async () => {
    const res = await new Client().request('POST', '/sign-in', 'email=a%40b.example&password=x', {
      'content-type': 'application/x-www-form-urlencoded',
      origin: 'http://elsewhere.example',
    });
    expect(res.status).toBe(403);
  });
});
