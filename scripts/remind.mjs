// @ts-check
// `npm run remind`: mails the day-before reminders for drills (scripts/remind.ts does the work).
// A scheduler sets DATABASE_URL, SMTP_* and APP_URL; without DATABASE_URL the local dev database and
// mail catcher are used, as `npm start` set them up.
import { spawn } from 'node:child_process';
import { appEnv } from './lib/config.mjs';
import { bin, ROOT } from './lib/paths.mjs';

const env = process.env.DATABASE_URL ? process.env : { ...appEnv('dev'), ...process.env };
const child = spawn(bin('tsx'), ['scripts/remind.ts', ...process.argv.slice(2)], { stdio: 'inherit', cwd: ROOT, env });
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
