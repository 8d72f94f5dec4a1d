import type { Knex } from 'knex';
import { env } from './lib/env';
import { knexConfig } from './db/config';

/** development: the demo database; test: a separate one that `npm test` creates and wipes. */
const config: Record<string, Knex.Config> = {
  development: knexConfig(env),
  test: knexConfig({ ...env, DB_NAME: process.env.DB_NAME ?? 'quietfix_test' }),
};

export default config;
