import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT } from './paths.mjs';
import { note, step } from './log.mjs';
import { aptInstall, run } from './run.mjs';

const STAMP = join(ROOT, 'node_modules', '.benchwright-lock-sha256');

/** `npm ci` when node_modules is absent or was installed from another package-lock.json. */
export function ensureNodeModules() {
  const lock = readFileSync(join(ROOT, 'package-lock.json'));
  const digest = createHash('sha256').update(lock).digest('hex');
  if (existsSync(STAMP) && readFileSync(STAMP, 'utf8').trim() === digest) {
    note('node_modules matches package-lock.json');
    return;
  }
  step('Installing npm packages (npm ci)');
  run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: ROOT, fix: 'check the npm registry is reachable, then run npm ci' });
  writeFileSync(STAMP, digest + '\n');
}

export const CHROMIUM = '/usr/bin/chromium';

export function ensureChromium() {
  if (existsSync(CHROMIUM)) {
    note(`Chromium found at ${CHROMIUM}`);
    return;
  }
  step("Installing Debian's chromium for the browser tests");
  aptInstall(['chromium'], 'Chromium');
}
