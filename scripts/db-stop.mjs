// Stops the local PostgreSQL that `npm start` / `npm test` started.
import { runMain } from './lib/log.mjs';
import { ensurePostgresInstalled, stopCluster } from './lib/postgres.mjs';

runMain(async () => stopCluster(ensurePostgresInstalled()));
