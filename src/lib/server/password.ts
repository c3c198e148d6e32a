import { hash, verify } from '@node-rs/argon2';

// argon2id with the OWASP minimum profile (19 MiB, 2 passes, 1 lane).
const OPTIONS = { memoryCost: 19456, timeCost: 2, outputLen: 32, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  // algorithm 2 = Argon2id; the const enum is not importable under isolatedModules.
  return hash(password, { ...OPTIONS, algorithm: 2 });
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    // A malformed stored hash is a failed check, not a crash.
    return false;
  }
}
