import { describe, expect, it } from 'vitest';
import { hashPassword, verifyPassword } from '../../src/lib/server/password';

describe('password hashing', () => {
  it('round-trips and refuses a wrong password', async () => {
    const hash = await hashPassword('gap the plug at 0.76 mm');
    expect(await verifyPassword(hash, 'gap the plug at 0.76 mm')).toBe(true);
    expect(await verifyPassword(hash, 'gap the plug at 0.75 mm')).toBe(false);
  });

  it('uses argon2id with 19 MiB, 2 passes, 1 lane (PHC string format)', async () => {
    // Parameters per the OWASP Password Storage Cheat Sheet's argon2id minimum.
    const hash = await hashPassword('x'.repeat(12));
    expect(hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
  });

  it('salts: the same password hashes differently each time', async () => {
    expect(await hashPassword('same-password')).not.toBe(await hashPassword('same-password'));
  });

  it('treats a malformed stored hash as a failed check', async () => {
    expect(await verifyPassword('not-a-hash', 'anything')).toBe(false);
  });
});
