import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { api, waitFor } from '../support/http';

const pgScript = path.resolve(import.meta.dirname, '../../scripts/pg.sh');
const cluster = process.env.QUIETFIX_TEST_PG ?? 'pg-test';
const port = process.env.DB_PORT ?? '54339';

describe('GET /api/health', () => {
  it('reads PostgreSQL: 200 {ok, db: up}', async () => {
    const r = await api('/api/health');
    expect(r.status).toBe(200);
    expect(r.json).toEqual({ ok: true, db: 'up' });
  });

  it('answers 503 promptly while the database is stopped, and recovers when it is back', async () => {
    execFileSync('bash', [pgScript, 'down', cluster], { stdio: 'inherit' });
    try {
      const t0 = Date.now();
      const down = await api('/api/health');
      expect(down.status).toBe(503);
      expect(down.json).toEqual({ ok: false, db: 'down' });
      expect(Date.now() - t0).toBeLessThan(8000); // no hang
      // Other routes answer 503 with the plain message, not a stack trace.
      const other = await api('/api/auth/callback/credentials', {
        method: 'POST',
        headers: { 'content-type': 'application/x-www-form-urlencoded' },
        body: 'email=chair%40example.test&password=x&csrfToken=x',
      });
      expect(other.status).toBe(503);
      expect(other.json).toEqual({ error: 'database unavailable' });
    } finally {
      execFileSync('bash', [pgScript, 'up', cluster, port], { stdio: 'inherit' });
    }
    const up = await waitFor(async () => {
      const r = await api('/api/health');
      return r.status === 200 ? r : undefined;
    }, 20_000);
    expect(up.json).toEqual({ ok: true, db: 'up' });
  });
});
