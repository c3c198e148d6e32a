// Serves the built app against the local database that setup.mjs prepared.
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { appEnv } from './lib/config.mjs';
import { ROOT } from './lib/paths.mjs';

const entry = join(ROOT, 'dist', 'server', 'entry.mjs');
if (!existsSync(entry)) {
  console.error('The app is not built yet. Run `npm start` (it builds first) or `npm run build`.');
  process.exit(1);
}

const host = process.env.HOST ?? '127.0.0.1';
const port = process.env.PORT ?? '4321';
const shownHost = host === '127.0.0.1' || host === '0.0.0.0' ? 'localhost' : host;
console.log(`\n  Benchwright is running at http://${shownHost}:${port}  (Ctrl+C stops it; npm run db:stop stops PostgreSQL and the local mail and S3 stand-ins)\n`);

const child = spawn(process.execPath, [entry], {
  stdio: 'inherit',
  env: { ...appEnv('dev'), ...process.env, HOST: host, PORT: port },
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
