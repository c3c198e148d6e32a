import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { signInThrottle } from '../../src/db/schema';
import { Client, newLearner, uniqueEmail } from './helpers/client';
import { testDb } from './helpers/db';

const PASSWORD = 'correct horse battery';

describe('sign-in rate limit (counters in PostgreSQL)', () => {
  it('blocks an account after 5 failures, even with the right password, then lets it in once the window passes', async () => {
    const { email } = await newLearner('limit');
    const client = new Client();
    for (let i = 0; i < 5; i++) {
      expect((await client.post('/api/auth/sign-in', { email, password: 'wrong-password' })).status).toBe(401);
    }
    const blocked = await client.post('/api/auth/sign-in', { email, password: PASSWORD });
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers.get('retry-after'))).toBeGreaterThan(0);
    // Another address is blocked too: the account counter is shared.
    expect((await new Client().post('/api/auth/sign-in', { email, password: PASSWORD })).status).toBe(429);

    // Move the window 16 minutes into the past, as if the wait were over.
    const { db, close } = testDb();
    await db
      .update(signInThrottle)
      .set({ windowStartedAt: sql`now() - interval '16 minutes'` })
      .where(eq(signInThrottle.key, `account:${email}`));
    const after = await client.post('/api/auth/sign-in', { email, password: PASSWORD });
    expect(after.status).toBe(200);
    // A successful sign-in clears the account's counter.
    const rows = await db.select().from(signInThrottle).where(eq(signInThrottle.key, `account:${email}`));
    expect(rows).toHaveLength(0);
    await close();
  });

  it('a success before the limit resets the account count', async () => {
    const { email } = await newLearner('reset');
    const client = new Client();
    for (let i = 0; i < 4; i++) await client.post('/api/auth/sign-in', { email, password: 'wrong-password' });
    expect((await client.post('/api/auth/sign-in', { email, password: PASSWORD })).status).toBe(200);
    for (let i = 0; i < 4; i++) await client.post('/api/auth/sign-in', { email, password: 'wrong-password' });
    expect((await client.post('/api/auth/sign-in', { email, password: PASSWORD })).status).toBe(200);
  });

  it('blocks one address after 30 failures across many accounts, but not other addresses', async () => {
    const { email } = await newLearner('address');
    const noisy = new Client();
    for (let i = 0; i < 30; i++) {
      await noisy.post('/api/auth/sign-in', { email: uniqueEmail(`guess${i}`), password: 'guess-password' });
    }
    expect((await noisy.post('/api/auth/sign-in', { email, password: PASSWORD })).status).toBe(429);
    expect((await new Client().post('/api/auth/sign-in', { email, password: PASSWORD })).status).toBe(200);
  });
});
