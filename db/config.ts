import type { Knex } from 'knex';
import type { Env } from '../lib/env';

/** Knex settings for one database; shared by db/index.ts and knexfile.ts. */
export function knexConfig(env: Pick<Env, 'DB_HOST' | 'DB_PORT' | 'DB_USER' | 'DB_PASSWORD' | 'DB_NAME' | 'DB_POOL_MAX'>): Knex.Config {
  return {
    client: 'pg',
    connection: {
      host: env.DB_HOST,
      port: env.DB_PORT,
      user: env.DB_USER,
      password: env.DB_PASSWORD,
      database: env.DB_NAME,
      connectionTimeoutMillis: 3000,
      application_name: 'quietfix',
    },
    // Fail fast when PostgreSQL is down: the API answers 503 instead of hanging.
    acquireConnectionTimeout: 4000,
    pool: { min: 0, max: env.DB_POOL_MAX },
    migrations: { directory: './migrations', extension: 'ts', loadExtensions: ['.ts'], tableName: 'knex_migrations' },
  };
}
