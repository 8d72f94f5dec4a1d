import type { Knex } from 'knex';
import { env } from './lib/env';
import { knexConfig } from './db/config';

/**
 * development: the demo database (npm start); test: a separate database that `npm test`
 * recreates on its own cluster; production: whatever the environment says.
 */
const config: Record<string, Knex.Config> = {
  development: knexConfig(env),
  production: knexConfig(env),
  test: knexConfig({ ...env, DB_NAME: process.env.DB_NAME ?? 'quietfix_test', DB_PORT: Number(process.env.DB_PORT ?? 54339) }),
};

export default config;
