import { createHash } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { Client, newLearner, uniqueEmail } from './helpers/client';
import { testDb } from './helpers/db';
import { BASE_URL } from './helpers/server';
import { linkIn, mailTo, waitForMail } from '../support/mail-catcher';
import { passwordResetTokens, users } from '../../src/db/schema';

const { db, close } = testDb();
afterAll(close);

const OLD_PASSWORD = 'correct horse battery';

/** Asks for a reset of `email` and returns the token from the newest reset mail once it arrives. */
async function requestToken(email: string, mailsBefore = 0): Promise<string> {
  const res = await new Client().post('/api/auth/password-reset', { email });
  expect(res.status).toBe(202);
  const [newest] = await waitForMail(email, mailsBefore + 1);
  const link = linkIn(newest!, '/reset-password');
  return link.searchParams.get('token')!;
}

describe('password reset through the e-mailed link', () => {
  it('sets a new password, signs out every session, and the link works once', async () => {
    const { client: firstDevice, email } = await newLearner('reset');
    const secondDevice = new Client();
    expect((await secondDevice.post('/api/auth/sign-in', { email, password: OLD_PASSWORD })).status).toBe(200);

    const asked = await new Client().post('/api/auth/password-reset', { email });
    expect(asked.status).toBe(202);
    const [mail] = await waitForMail(email);
    expect(mail!.subject).toBe('Set a new Benchwright password');
    const link = linkIn(mail!, '/reset-password');
    // Without APP_URL the link points where the request came in.
    expect(link.origin).toBe(BASE_URL);
    const token = link.searchParams.get('token')!;
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);

    // Only the SHA-256 of the token is stored.
    const [user] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
    const stored = await db.select().from(passwordResetTokens).where(eq(passwordResetTokens.userId, user!.id));
    expect(stored.map((t) => t.tokenHash)).toEqual([createHash('sha256').update(token).digest('hex')]);

    const confirmed = await new Client().post('/api/auth/password-reset/confirm', { token, password: 'a brand new password' });
    expect(confirmed.status).toBe(204);

    expect((await firstDevice.get('/api/me')).status).toBe(401);
    expect((await secondDevice.get('/api/me')).status).toBe(401);
    expect((await new Client().post('/api/auth/sign-in', { email, password: OLD_PASSWORD })).status).toBe(401);
    const signedIn = new Client();
    expect((await signedIn.post('/api/auth/sign-in', { email, password: 'a brand new password' })).status).toBe(200);
    expect((await signedIn.get('/api/me')).body.email).toBe(email);

    const again = await new Client().post('/api/auth/password-reset/confirm', { token, password: 'yet another password' });
    expect(again.status).toBe(400);
    expect(again.body.error).toBe('This reset link has already been used. Ask for a new one if you still need it.');
    expect(again.body.fields.token).toBeDefined();
    // The second use changed nothing.
    expect((await new Client().post('/api/auth/sign-in', { email, password: 'a brand new password' })).status).toBe(200);
  });

  it('answers an unknown address exactly like a known one and sends it nothing', async () => {
    const { email: known } = await newLearner('reset-known');
    const unknown = uniqueEmail('nobody');
    const forUnknown = await new Client().post('/api/auth/password-reset', { email: unknown });
    const forKnown = await new Client().post('/api/auth/password-reset', { email: known });
    expect(forUnknown.status).toBe(202);
    expect(forKnown.status).toBe(202);
    expect(forUnknown.body).toEqual(forKnown.body);
    expect(forUnknown.body).toEqual({ message: expect.stringContaining('If an account uses this address') });
    // The known address's mail was asked for after the unknown one's; once it is here, nothing else is coming.
    await waitForMail(known);
    expect(await mailTo(unknown)).toEqual([]);
  });

  it('refuses an expired link and leaves the password as it was', async () => {
    const { email } = await newLearner('reset-expired');
    const token = await requestToken(email);
    const hash = createHash('sha256').update(token).digest('hex');
    await db
      .update(passwordResetTokens)
      .set({ expiresAt: sql`now() - interval '1 minute'` })
      .where(eq(passwordResetTokens.tokenHash, hash));

    const res = await new Client().post('/api/auth/password-reset/confirm', { token, password: 'a brand new password' });
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('This reset link has expired: links work for 1 hour. Ask for a new one.');
    expect((await new Client().post('/api/auth/sign-in', { email, password: OLD_PASSWORD })).status).toBe(200);
  });

  it('a newer request makes the older link stop working', async () => {
    const { email } = await newLearner('reset-twice');
    const first = await requestToken(email);
    const second = await requestToken(email, 1);
    expect(second).not.toBe(first);
    const old = await new Client().post('/api/auth/password-reset/confirm', { token: first, password: 'a brand new password' });
    expect(old.status).toBe(400);
    expect(old.body.error).toBe('This reset link is not valid. Ask for a new one.');
    expect((await new Client().post('/api/auth/password-reset/confirm', { token: second, password: 'a brand new password' })).status).toBe(204);
  });

  it('sends one address at most 3 reset mails an hour, and still answers 202', async () => {
    const { email } = await newLearner('reset-flood');
    for (let i = 1; i <= 3; i++) await requestToken(email, i - 1);
    const fourth = await new Client().post('/api/auth/password-reset', { email });
    expect(fourth.status).toBe(202);
    // A mail asked for after the fourth request arrives; the fourth one never does.
    const { email: control } = await newLearner('reset-control');
    expect((await new Client().post('/api/auth/password-reset', { email: control })).status).toBe(202);
    await waitForMail(control);
    expect(await mailTo(email)).toHaveLength(3);
  });

  it('a made-up token of the right shape is 400 and costs no password change', async () => {
    const res = await new Client().post('/api/auth/password-reset/confirm', { token: 'A'.repeat(43), password: 'a brand new password' });
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('This reset link is not valid. Ask for a new one.');
  });
});

describe('password reset: malformed requests are 400 with the field named', () => {
  it('the request needs one well-formed e-mail', async () => {
    const client = new Client();
    expect((await client.post('/api/auth/password-reset', {})).body.fields.email).toBeDefined();
    const bad = await client.post('/api/auth/password-reset', { email: 'not-an-address' });
    expect(bad.status).toBe(400);
    expect(bad.body.fields.email).toEqual(['Enter a valid e-mail address']);
    expect((await client.request('POST', '/api/auth/password-reset', '{"email":', { 'content-type': 'application/json' })).status).toBe(400);
    expect((await client.post('/api/auth/password-reset', [1])).status).toBe(400);
  });

  it('the confirmation needs a token of the right shape and a password sign-up would accept', async () => {
    const client = new Client();
    const shortToken = await client.post('/api/auth/password-reset/confirm', { token: 'abc', password: 'a brand new password' });
    expect(shortToken.status).toBe(400);
    expect(shortToken.body.fields.token).toEqual(['This reset link is not valid. Ask for a new one.']);
    const shortPassword = await client.post('/api/auth/password-reset/confirm', { token: 'A'.repeat(43), password: 'short' });
    expect(shortPassword.status).toBe(400);
    expect(shortPassword.body.fields.password).toEqual(['Password needs at least 10 characters']);
    expect((await client.post('/api/auth/password-reset/confirm', {})).status).toBe(400);
  });
});

describe('pages', () => {
  it('the reset page says when a link is not valid, and the sign-in page links to the forgot page', async () => {
    const client = new Client();
    const reset = await client.get('/reset-password?token=nonsense');
    expect(reset.status).toBe(200);
    expect(reset.body).toContain('This reset link is not valid');
    const signIn = await client.get('/sign-in');
    expect(signIn.body).toContain('href="/forgot-password"');
    expect((await client.get('/forgot-password')).status).toBe(200);
  });
});
