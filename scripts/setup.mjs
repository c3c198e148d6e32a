// Sets up everything `npm start` and `npm test` need, using only Node's own modules:
// PostgreSQL (installed from Debian when missing), npm packages, the local cluster, the local
// mail catcher and S3 fake,
// the database, migrations, demo seed and the build. Every step is safe to run again.
import { DATABASES, bin, ROOT } from './lib/paths.mjs';
import { appEnv, ensureLocalConfig, ensureServicePorts } from './lib/config.mjs';
import { ensureChromium, ensureNodeModules } from './lib/deps.mjs';
import { runMain, SetupError, step } from './lib/log.mjs';
import { ensureCluster, ensureDatabase, ensurePostgresInstalled, startCluster } from './lib/postgres.mjs';
import { run } from './lib/run.mjs';
import { startServices } from './lib/services.mjs';

const args = new Set(process.argv.slice(2));
const mode = args.has('--mode=test') ? 'test' : 'dev';
const build = !args.has('--no-build');

runMain(async () => {
  const [major] = process.versions.node.split('.').map(Number);
  if (major < 20) throw new SetupError(`Node.js ${process.versions.node} is too old`, 'install Node.js 20 or newer');

  const binDir = ensurePostgresInstalled();
  ensureNodeModules();
  if (mode === 'test') ensureChromium();
  await ensureLocalConfig();
  await ensureServicePorts();
  ensureCluster(binDir);
  startCluster(binDir);
  ensureDatabase(binDir, DATABASES[mode], { fresh: mode === 'test' });
  await startServices(mode);

  // No telemetry: the machines this runs on may have no network but the package registries.
  const env = { ...appEnv(mode), ASTRO_TELEMETRY_DISABLED: '1' };
  step('Applying database migrations');
  run(bin('drizzle-kit'), ['migrate'], { cwd: ROOT, env, fix: 'read the error above; migrations live in drizzle/' });
  step('Seeding the demo school (Larkspur Valley Technical School)');
  run(bin('tsx'), ['scripts/seed.ts'], { cwd: ROOT, env, fix: 'read the error above' });
  if (build) {
    step('Building the app');
    run(bin('astro'), ['build'], { cwd: ROOT, env, fix: 'read the build error above' });
  }
  step(`Ready (${mode === 'test' ? 'test database' : 'demo data'})`);
});
