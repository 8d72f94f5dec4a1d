import { afterAll, describe, expect, it } from 'vitest';
import { api, postCredentials, signIn, uniqueEmail } from '../support/http';
import { freshAddress, signInFrom } from '../support/from-address';
import { THROTTLE } from '@/lib/auth/throttle';
import { db } from '@/db';

afterAll(() => db.destroy());

describe('sign-in through the real next-auth endpoints', () => {
  it.each([
    ['chair@example.test', 'admin'],
    ['coordinator@example.test', 'coordinator'],
    ['hunter@example.test', 'hunter'],
    ['member@example.test', 'member'],
  ])('%s signs in and the session carries the role %s', async (email, role) => {
    const s = await signIn(email);
    const session = await api('/api/auth/session', { session: s });
    expect(session.json.user).toMatchObject({ email, role });
    expect(session.json.user.id).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('refuses a wrong password (no session cookie)', async () => {
    const { res, cookie } = await postCredentials('member@example.test', 'not-the-password', { 'x-forwarded-for': '198.51.100.7' });
    expect(res.status).toBe(401);
    expect(cookie).not.toContain('next-auth.session-token');
  });

  it('slows repeated failures for one address and then refuses with 429 and a plain message', async () => {
    const email = uniqueEmail('throttled');
    const from = freshAddress();
    const times: number[] = [];
    for (let i = 0; i < THROTTLE.maxPerEmail; i++) {
      const t0 = Date.now();
      const r = await signInFrom(from, email, 'wrong-password');
      times.push(Date.now() - t0);
      expect(r.status).toBe(401);
    }
    // Later failures are held back longer than the first ones.
    expect(times.at(-1)! - times[0]).toBeGreaterThan(1000);
    const r = await signInFrom(from, email, 'wrong-password');
    expect(r.status).toBe(429);
    expect(r.json.error).toMatch(/Too many sign-in attempts/);
    const retryAfter = Number(r.retryAfter);
    expect(retryAfter).toBeGreaterThan(THROTTLE.windowMinutes * 60 - 60);
    expect(retryAfter).toBeLessThanOrEqual(THROTTLE.windowMinutes * 60);
  });

  it('refuses a client that failed too often, whatever address it tries', async () => {
    const from = freshAddress();
    // In parallel: answers to later failures are held back, one after another would take minutes.
    const tries = await Promise.all(Array.from({ length: THROTTLE.maxPerClient }, () => signInFrom(from, uniqueEmail('spray'), 'wrong-password')));
    expect(tries.map((t) => t.status)).toEqual(tries.map(() => 401));
    expect((await signInFrom(from, 'chair@example.test', 'quietfix-demo')).status).toBe(429);
    // Another client is not affected.
    expect((await signInFrom(freshAddress(), 'chair@example.test', 'quietfix-demo')).cookie).toBeTruthy();
  });

  it('a deactivated account cannot sign in and its open session stops working', async () => {
    const chair = await signIn('chair@example.test');
    const email = uniqueEmail('leaver');
    await api('/api/invitations', { session: chair, body: { email, name: 'Leaving Member', role: 'member' } });
    const token = await inviteToken(email);
    expect((await api('/api/password', { body: { token, password: 'long-enough-pass', confirm: 'long-enough-pass' } })).status).toBe(200);
    const s = await signIn(email, 'long-enough-pass');
    expect((await api('/api/cases', { session: s })).status).toBe(200);
    const users = await api('/api/users?pageSize=100', { session: chair });
    const id = users.json.items.find((u: { email: string }) => u.email === email).id;
    expect((await api(`/api/users/${id}`, { method: 'PATCH', session: chair, body: { active: false } })).status).toBe(200);
    expect((await api('/api/cases', { session: s })).status).toBe(401);
    expect((await signInFrom(freshAddress(), email, 'long-enough-pass')).status).toBe(401);
  });

  it('keeps the last active admin', async () => {
    const chair = await signIn('chair@example.test');
    const me = (await api('/api/auth/session', { session: chair })).json.user;
    const r = await api(`/api/users/${me.id}`, { method: 'PATCH', session: chair, body: { role: 'member' } });
    expect(r.status).toBe(409);
    expect(r.json.error).toMatch(/last active admin/);
  });
});

async function inviteToken(email: string): Promise<string> {
  const { mailTo, waitFor } = await import('../support/http');
  const mail = await waitFor(async () => (await mailTo(email))[0]);
  return new URL(mail.text.match(/https?:\/\/\S+/)[0]).searchParams.get('token')!;
}
