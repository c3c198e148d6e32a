// Runs one command with the app's environment for a mode (database, SMTP and S3 settings), e.g.
//   node scripts/with-env.mjs test vitest run tests/integration/drills.test.ts
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { appEnv } from './lib/config.mjs';
import { bin } from './lib/paths.mjs';

const [mode, command, ...args] = process.argv.slice(2);
if (!['dev', 'test'].includes(mode) || !command) {
  console.error('usage: node scripts/with-env.mjs dev|test COMMAND [ARGS...]');
  process.exit(2);
}
// A tool from node_modules/.bin by its bare name, anything else as given.
const executable = existsSync(bin(command)) ? bin(command) : command;
const child = spawn(executable, args, { stdio: 'inherit', env: { ...process.env, ...appEnv(mode), ASTRO_TELEMETRY_DISABLED: '1' } });
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
