import { chmodSync, chownSync, existsSync, mkdirSync, readdirSync, statSync, unlinkSync, writeFileSync, appendFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { DATA_DIR, PG_DIR, PG_LOG } from './paths.mjs';
import { localConfig } from './config.mjs';
import { note, SetupError, step } from './log.mjs';
import { aptInstall, isRoot, probe, run } from './run.mjs';

/** Newest PostgreSQL server binaries Debian installed, or null. */
function findBinDir() {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return null;
  const versions = readdirSync(base)
    .filter((v) => existsSync(join(base, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? join(base, versions[0], 'bin') : null;
}

export function ensurePostgresInstalled() {
  step('Checking for PostgreSQL');
  let binDir = findBinDir();
  if (!binDir) {
    note('PostgreSQL is not installed; installing it from Debian packages');
    aptInstall(['postgresql'], 'PostgreSQL');
    binDir = findBinDir();
    if (!binDir) throw new SetupError('PostgreSQL installed but initdb was not found', 'check /usr/lib/postgresql/*/bin');
  }
  note(`using ${binDir}`);
  return binDir;
}

// initdb and postgres refuse to run as root, so as root we run them as the postgres user.
function pgRun(binDir, tool, args, opts = {}) {
  const cmd = join(binDir, tool);
  return isRoot ? run('runuser', ['-u', 'postgres', '--', cmd, ...args], opts) : run(cmd, args, opts);
}

function pgProbe(binDir, tool, args) {
  const cmd = join(binDir, tool);
  return isRoot ? probe('runuser', ['-u', 'postgres', '--', cmd, ...args]) : probe(cmd, args);
}

/** As root, the postgres user must own the cluster and be able to walk down to it. */
function handToPostgresUser(path) {
  if (!isRoot) return;
  const uid = Number(probe('id', ['-u', 'postgres']).stdout.trim());
  const gid = Number(probe('id', ['-g', 'postgres']).stdout.trim());
  if (!Number.isInteger(uid)) throw new SetupError('There is no postgres user', 'reinstall the postgresql package');
  chownSync(path, uid, gid);
  for (let dir = dirname(path); dir !== dirname(dir); dir = dirname(dir)) {
    const mode = statSync(dir).mode;
    if ((mode & 0o001) === 0) chmodSync(dir, mode | 0o001);
  }
  return { uid, gid };
}

export function ensureCluster(binDir) {
  const { port, user, password } = localConfig();
  if (existsSync(join(PG_DIR, 'PG_VERSION'))) {
    note(`database cluster found in .data/pg`);
    return;
  }
  step('Creating a PostgreSQL cluster in .data/pg');
  mkdirSync(PG_DIR, { recursive: true, mode: 0o700 });
  const owner = handToPostgresUser(PG_DIR);
  const pwFile = join(DATA_DIR, '.initdb-pw');
  writeFileSync(pwFile, password + '\n', { mode: 0o600 });
  if (owner) chownSync(pwFile, owner.uid, owner.gid);
  try {
    pgRun(
      binDir,
      'initdb',
      ['-D', PG_DIR, '-U', user, `--pwfile=${pwFile}`, '--auth-host=scram-sha-256', '--auth-local=peer', '-E', 'UTF8', '--locale=C.UTF-8'],
      { quiet: true, fix: 'remove the .data/pg folder and run the command again' },
    );
  } finally {
    unlinkSync(pwFile);
  }
  // Loopback only, a port of our own, and no Unix socket (its default folder may not exist here).
  appendFileSync(
    join(PG_DIR, 'postgresql.conf'),
    `\n# Benchwright local settings\nlisten_addresses = '127.0.0.1'\nport = ${port}\nunix_socket_directories = ''\n`,
  );
}

export function startCluster(binDir) {
  const { port } = localConfig();
  const status = pgProbe(binDir, 'pg_ctl', ['status', '-D', PG_DIR]);
  if (status.status === 0) {
    note(`PostgreSQL already running on 127.0.0.1:${port}`);
    return;
  }
  step(`Starting PostgreSQL on 127.0.0.1:${port}`);
  if (!existsSync(PG_LOG)) writeFileSync(PG_LOG, '');
  handToPostgresUser(PG_LOG);
  pgRun(binDir, 'pg_ctl', ['start', '-D', PG_DIR, '-l', PG_LOG, '-w', '-t', '60'], {
    quiet: true,
    fix: `read .data/postgres.log; if port ${port} is taken, set BW_PG_PORT and delete .data/local.json and .data/pg`,
  });
}

export function stopCluster(binDir) {
  const status = pgProbe(binDir, 'pg_ctl', ['status', '-D', PG_DIR]);
  if (status.status !== 0) {
    note('PostgreSQL is not running');
    return;
  }
  step('Stopping PostgreSQL');
  pgRun(binDir, 'pg_ctl', ['stop', '-D', PG_DIR, '-m', 'fast', '-w'], { quiet: true, fix: 'read .data/postgres.log' });
}

function psql(binDir, sql) {
  const { port, user, password } = localConfig();
  return run(join(binDir, 'psql'), ['-h', '127.0.0.1', '-p', String(port), '-U', user, '-d', 'postgres', '-v', 'ON_ERROR_STOP=1', '-tAc', sql], {
    quiet: true,
    env: { PGPASSWORD: password },
    fix: 'check that PostgreSQL is running (read .data/postgres.log)',
  }).trim();
}

/** Creates the database when missing; `fresh` drops it first (the test database). */
export function ensureDatabase(binDir, name, { fresh = false } = {}) {
  if (!/^[a-z_]+$/.test(name)) throw new SetupError(`Bad database name ${name}`);
  if (fresh) {
    step(`Recreating the database ${name}`);
    psql(binDir, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
  }
  if (psql(binDir, `SELECT 1 FROM pg_database WHERE datname = '${name}'`) !== '1') {
    if (!fresh) step(`Creating the database ${name}`);
    psql(binDir, `CREATE DATABASE ${name}`);
  } else {
    note(`database ${name} exists`);
  }
}
