// `astro dev` with hot reload against the local development database.
import { spawn } from 'node:child_process';
import { appEnv } from './lib/config.mjs';
import { bin, ROOT } from './lib/paths.mjs';

const child = spawn(bin('astro'), ['dev'], {
  stdio: 'inherit',
  cwd: ROOT,
  env: { ...appEnv('dev'), ...process.env, ASTRO_TELEMETRY_DISABLED: '1' },
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal));
child.on('exit', (code) => process.exit(code ?? 1));
