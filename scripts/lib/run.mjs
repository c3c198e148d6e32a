import { spawnSync } from 'node:child_process';
import { SetupError } from './log.mjs';

export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

/** Runs a command with output shown; throws a SetupError with the given fix when it fails. */
export function run(cmd, args, { fix, env, cwd, quiet = false } = {}) {
  const result = spawnSync(cmd, args, {
    stdio: quiet ? ['ignore', 'pipe', 'pipe'] : 'inherit',
    env: env ? { ...process.env, ...env } : process.env,
    cwd,
    encoding: 'utf8',
  });
  if (result.error || result.status !== 0) {
    const detail = quiet ? `\n${result.stdout ?? ''}${result.stderr ?? ''}`.trimEnd() : '';
    throw new SetupError(`\`${cmd} ${args.join(' ')}\` failed${result.error ? `: ${result.error.message}` : ''}${detail}`, fix);
  }
  return result.stdout ?? '';
}

/** Runs a command and returns {status, stdout, stderr} without throwing. */
export function probe(cmd, args, { env } = {}) {
  const result = spawnSync(cmd, args, { encoding: 'utf8', env: env ? { ...process.env, ...env } : process.env });
  return { status: result.error ? -1 : result.status, stdout: result.stdout ?? '', stderr: result.stderr ?? '' };
}

/** Installs Debian packages; only root can, so others get the command to run. */
export function aptInstall(packages, why) {
  if (!isRoot) {
    throw new SetupError(`${why} is missing`, `run: sudo apt-get install -y ${packages.join(' ')}`);
  }
  const env = { DEBIAN_FRONTEND: 'noninteractive' };
  run('apt-get', ['update'], { env, fix: 'check that Debian package sources are reachable' });
  run('apt-get', ['install', '-y', '--no-install-recommends', ...packages], {
    env,
    fix: `install by hand: apt-get install -y ${packages.join(' ')}`,
  });
}
