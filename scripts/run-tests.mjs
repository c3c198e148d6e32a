// Runs Vitest (unit + integration) and Playwright against the test database,
// prints each runner's summary, and fails when either has a failure.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { appEnv } from './lib/config.mjs';
import { bin, ROOT } from './lib/paths.mjs';

const OUT = join(ROOT, 'test-results');
mkdirSync(OUT, { recursive: true });
const env = { ...process.env, ...appEnv('test'), ASTRO_TELEMETRY_DISABLED: '1' };

function runner(name, cmd, args) {
  console.log(`\n\x1b[1m▸ ${name}\x1b[0m`);
  const result = spawnSync(cmd, args, { stdio: 'inherit', env, cwd: ROOT });
  return result.status ?? 1;
}

function readJson(file) {
  try {
    return existsSync(file) ? JSON.parse(readFileSync(file, 'utf8')) : null;
  } catch {
    return null;
  }
}

const vitestFile = join(OUT, 'vitest.json');
const vitestCode = runner('Vitest: unit and integration', bin('vitest'), [
  'run',
  '--reporter=default',
  '--reporter=json',
  `--outputFile.json=${vitestFile}`,
]);
const playwrightCode = runner('Playwright: end to end in Chromium', bin('playwright'), ['test']);

const v = readJson(vitestFile);
const p = readJson(join(OUT, 'playwright.json'));
const counts = {
  vitest: { passed: v?.numPassedTests ?? 0, failed: v?.numFailedTests ?? 0, skipped: v?.numPendingTests ?? 0 },
  playwright: {
    passed: p?.stats?.expected ?? 0,
    failed: (p?.stats?.unexpected ?? 0) + (p?.stats?.flaky ?? 0),
    skipped: p?.stats?.skipped ?? 0,
  },
};
const failedRun = vitestCode !== 0 || playwrightCode !== 0;

console.log('\n\x1b[1mSummary\x1b[0m');
for (const [name, c] of Object.entries(counts)) {
  console.log(`  ${name.padEnd(10)} ${c.passed} passed, ${c.failed} failed, ${c.skipped} skipped`);
}
const total = {
  passed: counts.vitest.passed + counts.playwright.passed,
  failed: counts.vitest.failed + counts.playwright.failed,
};
// A runner that crashed before reporting still fails the run.
if (failedRun && total.failed === 0) total.failed = 1;
console.log(`${total.passed} passed, ${total.failed} failed`);
process.exit(failedRun ? 1 : 0);
