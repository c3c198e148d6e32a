// Stops the local PostgreSQL, mail catcher and S3 fake that `npm start` / `npm test` started.
import { runMain } from './lib/log.mjs';
import { ensurePostgresInstalled, stopCluster } from './lib/postgres.mjs';
import { stopServices } from './lib/services.mjs';

runMain(async () => {
  stopServices();
  stopCluster(ensurePostgresInstalled());
});
