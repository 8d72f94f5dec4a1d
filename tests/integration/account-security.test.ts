/**
 * Account links, sessions and sign-in limits against the running test app, the real
 * PostgreSQL, the outbox worker and the mail catcher's SMTP.
 * Each "client" is a real socket address (a loopback address of its own, tests/support/from-address.ts);
 * the app runs with TRUSTED_PROXY=127.0.0.9 (scripts/test.sh), so requests from that address
 * act as our reverse proxy. The limits (8 per address, 30 per client in 15 minutes; 3 resets per
 * address, 10 per client an hour) are ours: common practice, no source. The timing comparisons
 * are ratios of medians, never absolute times.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import nodemailer from 'nodemailer';
import { db, inTransaction } from '@/db';
import { createUser } from '@/db/users';
import { hashPassword } from '@/lib/auth/password';
import { LINK_SLOT } from '@/lib/auth/account-mail';
import { requestPasswordReset } from '@/lib/auth/tokens';
import { THROTTLE } from '@/lib/auth/throttle';
import { runWorkerOnce } from '@/lib/notices/outbox';
import { api, mailTo, uniqueEmail, waitFor, type Session } from '../support/http';
import { PROXY_ADDRESS, freshAddress, postJsonFrom, signInFrom } from '../support/from-address';
import { closedPort } from '../support/net';

afterAll(() => db.destroy());

const PASSWORD = 'static on forty metres';
const linkIn = (text: string) => new URL(text.match(/https?:\/\/\S+\/set-password\?token=\S+/)![0]);
const tokenIn = (mail: { text: string }) => linkIn(mail.text).searchParams.get('token')!;
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

/** An active member with a known password, written straight to the test database. */
async function member(prefix: string): Promise<string> {
  const email = uniqueEmail(prefix);
  const passwordHash = await hashPassword(PASSWORD);
  await inTransaction((trx) => createUser(trx, { email, name: `Quinn ${prefix}`, role: 'member', passwordHash }));
  return email;
}

async function signedIn(email: string, password = PASSWORD): Promise<Session> {
  const r = await signInFrom(freshAddress(), email, password);
  expect(r.status, JSON.stringify(r.json)).toBe(200);
  expect(r.cookie).toBeTruthy();
  return { cookie: r.cookie!, email };
}

const works = async (s: Session) => (await api('/api/cases', { session: s })).status;
const forgot = (email: string, from = freshAddress()) => postJsonFrom(from, '/api/password/forgot', { email });
const setPassword = (token: string, password: string) => api('/api/password', { body: { token, password, confirm: password } });
const resetMails = async (email: string) => (await mailTo(email)).filter((m: { subject: string }) => m.subject.includes('new password'));

describe('reset links and sessions retire', () => {
  it('a new reset request retires the older link; a reset ends every open session and burns the link', async () => {
    const email = await member('retire');
    const a = await signedIn(email);
    const b = await signedIn(email);
    expect(await works(a)).toBe(200);

    expect((await forgot(email)).status).toBe(202);
    const first = tokenIn(await waitFor(async () => (await resetMails(email))[0]));
    expect((await forgot(email)).status).toBe(202);
    const second = tokenIn(await waitFor(async () => ((await resetMails(email)).length === 2 ? (await resetMails(email))[0] : undefined)));
    expect(second).not.toBe(first);

    // The older link was retired by the newer request.
    expect((await setPassword(first, 'a brand new password')).status).toBe(404);
    expect(await works(a)).toBe(200);

    expect((await setPassword(second, 'a brand new password')).status).toBe(200);
    expect(await works(a)).toBe(401);
    expect(await works(b)).toBe(401);
    expect((await setPassword(second, 'yet another password')).status).toBe(404);
    expect((await signInFrom(freshAddress(), email, PASSWORD)).status).toBe(401);
    expect(await works(await signedIn(email, 'a brand new password'))).toBe(200);
  });

  it('a password change ends every session (this one too) and retires open reset links', async () => {
    const email = await member('change');
    const a = await signedIn(email);
    const b = await signedIn(email);
    expect((await forgot(email)).status).toBe(202);
    const open = tokenIn(await waitFor(async () => (await resetMails(email))[0]));

    const wrong = await api('/api/password/change', { session: a, body: { current: 'not my password', password: 'changed on purpose', confirm: 'changed on purpose' } });
    expect(wrong.status).toBe(400);
    expect(wrong.json.issues[0]).toMatchObject({ path: 'current' });
    expect(await works(a)).toBe(200);

    const ok = await api('/api/password/change', { session: a, body: { current: PASSWORD, password: 'changed on purpose', confirm: 'changed on purpose' } });
    expect(ok.status, ok.text).toBe(200);
    expect(ok.json.signInAgain).toBe(true);
    expect(await works(a)).toBe(401);
    expect(await works(b)).toBe(401);
    expect((await setPassword(open, 'through the old link')).status).toBe(404);
    expect(await works(await signedIn(email, 'changed on purpose'))).toBe(200);
    // Signed out now: the change route asks for a session.
    expect((await api('/api/password/change', { session: a, body: { current: 'changed on purpose', password: 'x'.repeat(12), confirm: 'x'.repeat(12) } })).status).toBe(401);
  });
});

describe('answers take the same time whether or not the address has an account', () => {
  let known: string[];
  beforeAll(async () => {
    known = [await member('timing'), await member('timing'), await member('timing')];
  });

  it('sign-in: a wrong password for a real account and any password for an unknown address, medians within 2x', async () => {
    // Warm both paths once (first requests compile and fill caches).
    await signInFrom(freshAddress(), known[0], 'warm-up wrong');
    await signInFrom(freshAddress(), uniqueEmail('nobody'), 'warm-up wrong');
    const k: number[] = [];
    const u: number[] = [];
    // Two wrong tries per account stay under THROTTLE.freeFailures, so no answer is held back.
    for (let round = 0; round < 2; round++) {
      for (const email of known) {
        if (round === 0 && email === known[0]) continue; // its warm-up was the first failure
        const rk = await signInFrom(freshAddress(), email, 'not the password');
        expect(rk.status).toBe(401);
        k.push(rk.ms);
        const ru = await signInFrom(freshAddress(), uniqueEmail('nobody'), 'not the password');
        expect(ru.status).toBe(401);
        u.push(ru.ms);
      }
    }
    const [mk, mu] = [median(k), median(u)];
    console.log(`[account-security] sign-in median: known ${mk.toFixed(1)} ms, unknown ${mu.toFixed(1)} ms (n=${k.length} each; ratio ${(Math.max(mk, mu) / Math.min(mk, mu)).toFixed(2)})`);
    expect(Math.max(mk, mu) / Math.min(mk, mu)).toBeLessThan(2);
  });

  it('forgot-password: medians within 2x, same answer', async () => {
    const k: number[] = [];
    const u: number[] = [];
    let knownBody: unknown, unknownBody: unknown;
    for (let round = 0; round < 2; round++) {
      for (const email of known) {
        const t0 = performance.now();
        const rk = await forgot(email);
        k.push(performance.now() - t0);
        const t1 = performance.now();
        const ru = await forgot(uniqueEmail('nobody'));
        u.push(performance.now() - t1);
        expect([rk.status, ru.status]).toEqual([202, 202]);
        [knownBody, unknownBody] = [rk.json, ru.json];
      }
    }
    expect(knownBody).toEqual(unknownBody);
    const [mk, mu] = [median(k), median(u)];
    console.log(`[account-security] forgot-password median: known ${mk.toFixed(1)} ms, unknown ${mu.toFixed(1)} ms (n=${k.length} each; ratio ${(Math.max(mk, mu) / Math.min(mk, mu)).toFixed(2)})`);
    expect(Math.max(mk, mu) / Math.min(mk, mu)).toBeLessThan(2);
  });

  it('reset requests are limited per address and per client', async () => {
    const email = known[0]; // already asked twice in the timing test above
    const third = await forgot(email);
    expect(third.status).toBe(202);
    const fourth = await forgot(email);
    expect(fourth.status).toBe(429);
    expect(fourth.json.error).toMatch(/Too many reset requests/);
    // An unknown address is limited the same way (the limit reveals nothing).
    const nobody = uniqueEmail('nobody');
    const from = freshAddress();
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await forgot(nobody, from)).status);
    expect(statuses).toEqual([202, 202, 202, 429]);
    // Per client: ten addresses from one client, then the eleventh is refused.
    const client = freshAddress();
    const spray: number[] = [];
    for (let i = 0; i < 11; i++) spray.push((await forgot(uniqueEmail('spray'), client)).status);
    expect(spray.slice(0, 10)).toEqual(Array(10).fill(202));
    expect(spray[10]).toBe(429);
  });
});

describe('sign-in limits hold under parallel bursts and forged headers', () => {
  it('40 parallel wrong passwords: at most the limit reach bcrypt; forged X-Forwarded-For changes nothing; a reset link unlocks the owner', async () => {
    const email = await member('burst');
    const attacker = freshAddress();
    const t0 = Date.now();
    const burst = await Promise.all(
      Array.from({ length: 40 }, (_, i) => signInFrom(attacker, email, `guess number ${i}`, { 'x-forwarded-for': `198.51.100.${i + 1}` })),
    );
    const evaluated = burst.filter((r) => r.status === 401).length;
    const refused = burst.filter((r) => r.status === 429).length;
    console.log(`[account-security] burst of 40 wrong passwords: ${evaluated} evaluated (401), ${refused} refused (429) in ${Date.now() - t0} ms; limit ${THROTTLE.maxPerEmail}`);
    expect(evaluated).toBeLessThanOrEqual(THROTTLE.maxPerEmail);
    expect(evaluated + refused).toBe(40);

    // The account is locked: even its right password is refused, from anywhere.
    const owner = freshAddress();
    const locked = await signInFrom(owner, email, PASSWORD);
    expect(locked.status).toBe(429);
    expect(locked.json.error).toMatch(/Forgot password/);

    // The attacking client is over its own limit too; a fresh forged header does not help.
    const other = await signInFrom(attacker, uniqueEmail('other'), 'whatever', { 'x-forwarded-for': '203.0.113.200' });
    expect(other.status).toBe(429);

    // The owner recovers by a reset link.
    expect((await forgot(email, owner)).status).toBe(202);
    const token = tokenIn(await waitFor(async () => (await resetMails(email))[0]));
    expect((await setPassword(token, 'back in after the lock')).status).toBe(200);
    const back = await signInFrom(owner, email, 'back in after the lock');
    expect(back.status).toBe(200);
    expect(back.cookie).toBeTruthy();
  });

  it('behind the trusted proxy only its own (right-most) hop counts', async () => {
    const client = `203.0.113.${10 + Math.floor(Math.random() * 200)}`;
    const viaProxy = (email: string, forged: string) => signInFrom(PROXY_ADDRESS, email, 'wrong', { 'x-forwarded-for': `${forged}, ${client}` });
    const burst = await Promise.all(Array.from({ length: THROTTLE.maxPerClient + 5 }, (_, i) => viaProxy(uniqueEmail('proxied'), `192.0.2.${i + 1}`)));
    const evaluated = burst.filter((r) => r.status === 401).length;
    console.log(`[account-security] via the proxy, ${burst.length} tries from one client with forged left-hand hops: ${evaluated} evaluated, limit ${THROTTLE.maxPerClient}`);
    expect(evaluated).toBeLessThanOrEqual(THROTTLE.maxPerClient);
    expect(burst.length - evaluated).toBeGreaterThanOrEqual(5);
    // Another client behind the same proxy is its own key.
    const neighbour = await signInFrom(PROXY_ADDRESS, uniqueEmail('neighbour'), 'wrong', { 'x-forwarded-for': `${client}, 198.51.100.250` });
    expect(neighbour.status).toBe(401);
    // A non-proxy peer's X-Forwarded-For is ignored: it cannot pose as the blocked client or escape its own count.
    const direct = await signInFrom(freshAddress(), uniqueEmail('direct'), 'wrong', { 'x-forwarded-for': client });
    expect(direct.status).toBe(401);
  });
});

describe('account mail goes through the outbox', () => {
  it('SMTP down -> reset requested -> SMTP up: the e-mail arrives exactly once, its link works, the database never held the link', async () => {
    const email = await member('outage');
    const down = nodemailer.createTransport({ host: '127.0.0.1', port: await closedPort(), connectionTimeout: 2000 });
    // Request and first try in one transaction: the row is leased by this test's worker before
    // the background worker can see it, so the first try surely meets the dead server.
    const { first, rowId } = await inTransaction(async (trx) => {
      await requestPasswordReset(email, trx);
      const row = await trx('outbox').where({ to_address: email, kind: 'account' }).first('id');
      return { rowId: String(row.id), first: await runWorkerOnce({ knex: trx, transport: down, onlyIds: [String(row.id)], backoffBaseMs: 1500 }) };
    });
    expect(first).toMatchObject({ claimed: 1, sent: 0, retrying: 1 });
    const waiting = await db('outbox').where({ id: rowId }).first();
    expect(waiting).toMatchObject({ status: 'pending', attempts: 1 });
    expect(waiting.last_error).toMatch(/ECONNREFUSED/);
    expect(await mailTo(email)).toHaveLength(0);

    // The server is back: the background worker delivers after the backoff.
    const mail = await waitFor(async () => (await mailTo(email))[0], 20_000);
    await new Promise((r) => setTimeout(r, 1500));
    expect(await mailTo(email)).toHaveLength(1);
    const sent = await db('outbox').where({ id: rowId }).first();
    expect(sent).toMatchObject({ status: 'sent', attempts: 2, last_error: null });
    expect(mail.messageId).toBe(`<account-${sent.user_token_id}@quietfix.example.test>`);
    const token = tokenIn(mail);
    expect(Buffer.from(token, 'base64url')).toHaveLength(32);
    // The outbox holds a stand-in where the link goes, never the link.
    expect(sent.text_body).toContain(LINK_SLOT);
    expect(JSON.stringify(sent)).not.toContain(token);
    expect((await setPassword(token, 'after the outage')).status).toBe(200);
  });

  it('an e-mail whose link was replaced before it could be sent is dropped, not retried', async () => {
    const email = await member('replaced');
    const down = nodemailer.createTransport({ host: '127.0.0.1', port: await closedPort(), connectionTimeout: 2000 });
    const result = await inTransaction(async (trx) => {
      await requestPasswordReset(email, trx);
      const older = await trx('outbox').where({ to_address: email, kind: 'account' }).first('id');
      await requestPasswordReset(email, trx); // retires the first link
      const r = await runWorkerOnce({ knex: trx, transport: down, onlyIds: [String(older.id)] });
      return { r, row: await trx('outbox').where({ id: older.id }).first() };
    });
    expect(result.r).toMatchObject({ claimed: 1, failed: 1 });
    expect(result.row.status).toBe('failed');
    expect(result.row.last_error).toMatch(/replaced or expired/);
    const mail = await waitFor(async () => (await mailTo(email))[0], 15_000);
    await new Promise((r) => setTimeout(r, 1000));
    expect(await mailTo(email)).toHaveLength(1);
    expect((await setPassword(tokenIn(mail), 'only the newest link')).status).toBe(200);
  });
});
