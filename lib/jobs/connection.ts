import type { Env } from '@/lib/env';

/** The queue's PostgreSQL address: the app's own database (graphile-worker keeps its schema there). */
export function queueConnectionString(e: Pick<Env, 'DB_HOST' | 'DB_PORT' | 'DB_USER' | 'DB_PASSWORD' | 'DB_NAME'>): string {
  const u = encodeURIComponent;
  return `postgres://${u(e.DB_USER)}:${u(e.DB_PASSWORD)}@${e.DB_HOST}:${e.DB_PORT}/${u(e.DB_NAME)}`;
}
