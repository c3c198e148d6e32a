// Vitest global setup: serves the built app on its own port against the test database.
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';

// Another checkout running its tests at the same time picks its own port with BW_TEST_PORT.
export const INTEGRATION_PORT = Number(process.env.BW_TEST_PORT ?? 4330);
export const BASE_URL = `http://127.0.0.1:${INTEGRATION_PORT}`;

let server: ChildProcess | undefined;

async function waitForHealth(timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      const res = await fetch(`${BASE_URL}/api/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`The app did not answer on ${BASE_URL} within ${timeoutMs} ms`);
}

export async function setup(): Promise<void> {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run the tests with `npm test`');
  if (!existsSync('dist/server/entry.mjs')) throw new Error('Build the app first (`npm test` does)');
  server = spawn(process.execPath, ['dist/server/entry.mjs'], {
    stdio: ['ignore', 'ignore', 'inherit'],
    // Trusting X-Forwarded-For lets each test act from an address of its own.
    env: { ...process.env, HOST: '127.0.0.1', PORT: String(INTEGRATION_PORT), TRUST_PROXY: 'true' },
  });
  await waitForHealth(30_000);
}

export async function teardown(): Promise<void> {
  server?.kill('SIGTERM');
}
