/** Installs or upgrades the job queue's own schema (graphile_worker); run after the knex migrations. */
import { runMigrations } from 'graphile-worker';
import { env } from '../lib/env';
import { queueConnectionString } from '../lib/jobs/connection';

runMigrations({ connectionString: queueConnectionString(env) })
  .then(() => console.log('job queue schema ready'))
  .catch((err) => {
    console.error('installing the job queue schema failed:', (err as Error).message);
    process.exitCode = 1;
  });
