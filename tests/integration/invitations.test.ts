import { describe, expect, it } from 'vitest';
import { api, mailTo, signIn, uniqueEmail, waitFor } from '../support/http';

const linkIn = (text: string) => new URL(text.match(/https?:\/\/\S+\/set-password\?token=\S+/)![0]);

describe('invitations and password reset through the mail catcher', () => {
  it('an invitation e-mail arrives, its link sets a password, the new user signs in, the link cannot be used twice', async () => {
    const coordinator = await signIn('coordinator@example.test');
    const email = uniqueEmail('newhunter');
    const r = await api('/api/invitations', { session: coordinator, body: { email, name: 'Nova Hunter', role: 'hunter' } });
    expect(r.status).toBe(201);

    const mail = await waitFor(async () => (await mailTo(email))[0]);
    expect(mail.subject).toBe('Quillon Heath Radio Club: you are invited to Quietfix');
    expect(mail.to).toEqual([email]);
    expect(mail.headers['Message-ID'] ?? mail.headers['message-id']).toBeTruthy();
    expect(mail.text).toContain('expires after 72 hours');
    const link = linkIn(mail.text);
    const token = link.searchParams.get('token')!;
    expect(Buffer.from(token, 'base64url')).toHaveLength(32); // 256 random bits

    const page = await api(`${link.pathname}${link.search}`);
    expect(page.status).toBe(200);

    const set = await api('/api/password', { body: { token, password: 'a quiet band at last', confirm: 'a quiet band at last' } });
    expect(set.status).toBe(200);
    const s = await signIn(email, 'a quiet band at last');
    const session = await api('/api/auth/session', { session: s });
    expect(session.json.user).toMatchObject({ email, role: 'hunter', name: 'Nova Hunter' });

    const again = await api('/api/password', { body: { token, password: 'another password', confirm: 'another password' } });
    expect(again.status).toBe(404);
  });

  it('refuses an invalid token with 404 and a too-short password with 400 and issues', async () => {
    const bad = await api('/api/password', { body: { token: 'x'.repeat(43), password: 'long enough one', confirm: 'long enough one' } });
    expect(bad.status).toBe(404);
    const short = await api('/api/password', { body: { token: 'x'.repeat(43), password: 'short', confirm: 'short' } });
    expect(short.status).toBe(400);
    expect(short.json.issues[0]).toMatchObject({ path: 'password' });
  });

  it('coordinators cannot invite admins; bad input is a 400 with issues; a second invitation to an existing user is a 409', async () => {
    const coordinator = await signIn('coordinator@example.test');
    expect((await api('/api/invitations', { session: coordinator, body: { email: uniqueEmail('x'), name: 'X', role: 'admin' } })).status).toBe(403);
    const bad = await api('/api/invitations', { session: coordinator, body: { email: 'not-an-address', name: '', role: 'pilot' } });
    expect(bad.status).toBe(400);
    expect(bad.json.issues.map((i: { path: string }) => i.path).sort()).toEqual(['email', 'name', 'role']);
    const dup = await api('/api/invitations', { session: coordinator, body: { email: 'member@example.test', name: 'Dup', role: 'member' } });
    expect(dup.status).toBe(409);
    const notJson = await api('/api/invitations', { session: coordinator, body: '{oops', headers: { 'content-type': 'application/json' } });
    expect(notJson.status).toBe(400);
    expect(notJson.json.error).toMatch(/JSON/);
  });

  it('forgot password: same answer for unknown addresses; the reset link works once', async () => {
    const unknown = await api('/api/password/forgot', { body: { email: 'nobody-here@example.test' } });
    expect(unknown.status).toBe(202);
    const chair = await signIn('chair@example.test');
    const email = uniqueEmail('forgetful');
    await api('/api/invitations', { session: chair, body: { email, name: 'Forgetful Fran', role: 'member' } });
    const invite = await waitFor(async () => (await mailTo(email))[0]);
    const t1 = linkIn(invite.text).searchParams.get('token');
    await api('/api/password', { body: { token: t1, password: 'first password!', confirm: 'first password!' } });

    const known = await api('/api/password/forgot', { body: { email } });
    expect(known.status).toBe(202);
    expect(known.json).toEqual(unknown.json);
    const reset = await waitFor(async () => (await mailTo(email)).find((m: { subject: string }) => m.subject.includes('new password')));
    const t2 = linkIn(reset.text).searchParams.get('token');
    expect((await api('/api/password', { body: { token: t2, password: 'second password!', confirm: 'second password!' } })).status).toBe(200);
    await signIn(email, 'second password!');
    expect((await api('/api/password', { body: { token: t2, password: 'third password!!', confirm: 'third password!!' } })).status).toBe(404);
  });
});

describe('expired links', () => {
  it('an invitation past its 72 hours is a plain 404', async () => {
    const { db } = await import('@/db');
    const chair = await signIn('chair@example.test');
    const email = uniqueEmail('late');
    await api('/api/invitations', { session: chair, body: { email, name: 'Late Larkin', role: 'member' } });
    const mail = await waitFor(async () => (await mailTo(email))[0]);
    const token = linkIn(mail.text).searchParams.get('token');
    const { hashToken } = await import('@/lib/auth/tokens');
    const row = await db('user_tokens').where({ token_hash: hashToken(token!) }).first('expires_at', 'created_at');
    // 72 hours after it was made, to the second.
    expect((row.expires_at.getTime() - row.created_at.getTime()) / 3600_000).toBeCloseTo(72, 3);
    await db('user_tokens').where({ token_hash: hashToken(token!) }).update({ expires_at: db.raw("now() - interval '1 second'") });
    const r = await api('/api/password', { body: { token, password: 'too late for this', confirm: 'too late for this' } });
    expect(r.status).toBe(404);
    await db.destroy();
  });
});
