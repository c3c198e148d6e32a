import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ROOT } from '../lib/paths.mjs';
import { freeLoopbackPort, startServer, type RunningServer } from './child-server';

// The two servers under test, each in its own process so neither shares an event loop with autocannon.

export const APP_ENTRY = join(ROOT, 'dist', 'server', 'entry.mjs');
const BASELINE_ENTRY = fileURLToPath(new URL('./baseline-server.ts', import.meta.url));

export const appIsBuilt = () => existsSync(APP_ENTRY);

/** The built Astro app, as `npm start` serves it, against the given database. */
export async function startApp(databaseUrl: string): Promise<RunningServer> {
  const port = await freeLoopbackPort();
  return startServer({
    name: 'app',
    args: [APP_ENTRY],
    env: { HOST: '127.0.0.1', PORT: String(port), DATABASE_URL: databaseUrl },
    port,
    readyPath: '/api/health',
  });
}

/** The bare node:http server doing the same database and scoring work, for the learners given. */
export async function startBaseline(databaseUrl: string, userIds: string[]): Promise<RunningServer> {
  const port = await freeLoopbackPort();
  return startServer({
    name: 'baseline',
    args: ['--import', 'tsx', BASELINE_ENTRY],
    env: { PORT: String(port), DATABASE_URL: databaseUrl, BENCH_USER_IDS: userIds.join(',') },
    port,
    readyPath: '/health',
  });
}
