import { describe, expect, it } from 'vitest';
import { api, APP_ORIGIN, BASE_URL, signIn } from '../support/http';

/**
 * Two instances of the app against one PostgreSQL (scripts/test.sh starts the second on TEST_PORT_B):
 * a session made on one is good on the other (JWT sessions, no server-side session store), and a
 * write through one is read back through the other.
 */
const B = process.env.TEST_BASE_URL_B ?? `http://127.0.0.1:${Number(new URL(BASE_URL).port) + 1}`;

describe('more than one app instance', () => {
  it('signs in on one instance and uses the session on the other', async () => {
    const s = await signIn('coordinator@example.test');
    const onB = await fetch(`${B}/api/auth/session`, { headers: { cookie: s.cookie } });
    expect(onB.status).toBe(200);
    expect((await onB.json()).user.email).toBe('coordinator@example.test');

    const name = `two instances ${Date.now()}`;
    const saved = await fetch(`${B}/api/saved-filters`, {
      method: 'POST',
      headers: { cookie: s.cookie, origin: APP_ORIGIN, 'content-type': 'application/json' },
      body: JSON.stringify({ name, query: 'status=open' }),
    });
    expect(saved.status).toBe(201);
    const onA = await api('/api/saved-filters', { session: s });
    expect(onA.json.items.map((i: { name: string }) => i.name)).toContain(name);
    const id = (await saved.json()).id;
    expect((await api(`/api/saved-filters/${id}`, { method: 'DELETE', session: s })).status).toBe(200);
  });

  it('a signed-out request is refused on both', async () => {
    for (const base of [BASE_URL, B]) expect((await fetch(`${base}/api/cases`)).status).toBe(401);
  });
});
