// Starts the local stand-ins for hosted services (SMTP catcher, S3 fake) in the background, once:
// a second run finds them answering and leaves them be. `npm run db:stop` stops them.
import { spawn } from 'node:child_process';
import { closeSync, existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { connect } from 'node:net';
import { join } from 'node:path';
import { S3_BUCKET, localConfig } from './config.mjs';
import { DATA_DIR, ROOT } from './paths.mjs';
import { note, SetupError, step } from './log.mjs';

function answers(port) {
  return new Promise((resolve) => {
    const socket = connect({ port, host: '127.0.0.1' });
    socket.once('connect', () => socket.end(() => resolve(true)));
    socket.once('error', () => resolve(false));
  });
}

async function waitFor(port, ms) {
  const deadline = Date.now() + ms;
  while (Date.now() < deadline) {
    if (await answers(port)) return true;
    await new Promise((r) => setTimeout(r, 150));
  }
  return false;
}

const pidFile = (name, mode) => join(DATA_DIR, `${name}-${mode}.pid`);

function services(mode) {
  const ports = localConfig().services[mode];
  return [
    {
      name: 'mail-catcher',
      label: 'mail catcher (SMTP)',
      port: ports.mailApi,
      args: ['scripts/fakes/mail-catcher.mjs', `--smtp-port=${ports.smtp}`, `--http-port=${ports.mailApi}`],
    },
    {
      name: 's3',
      label: 'S3 fake',
      port: ports.s3,
      args: ['scripts/fakes/s3.mjs', `--port=${ports.s3}`, `--directory=${join(DATA_DIR, 's3', mode)}`, `--bucket=${S3_BUCKET}`],
    },
  ];
}

export async function startServices(mode) {
  for (const service of services(mode)) {
    if (await answers(service.port)) {
      note(`${service.label} already running on port ${service.port}`);
      continue;
    }
    step(`Starting the ${service.label} on 127.0.0.1:${service.port}`);
    mkdirSync(join(DATA_DIR, 's3', mode), { recursive: true });
    const logFile = join(DATA_DIR, `${service.name}-${mode}.log`);
    const out = openSync(logFile, 'a');
    const child = spawn(process.execPath, service.args, { cwd: ROOT, detached: true, stdio: ['ignore', out, out] });
    closeSync(out);
    child.unref();
    writeFileSync(pidFile(service.name, mode), String(child.pid));
    if (!(await waitFor(service.port, 15_000))) {
      throw new SetupError(`The ${service.label} did not start`, `read ${logFile}`);
    }
  }
}

export function stopServices() {
  for (const mode of ['dev', 'test']) {
    for (const name of ['mail-catcher', 's3']) {
      const file = pidFile(name, mode);
      if (!existsSync(file)) continue;
      try {
        process.kill(Number(readFileSync(file, 'utf8')), 'SIGTERM');
        note(`stopped ${name} (${mode})`);
      } catch {
        // already gone
      }
      rmSync(file, { force: true });
    }
  }
}
