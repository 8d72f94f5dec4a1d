/**
 * Notices end to end through the running app, the real PostgreSQL, the outbox worker and the
 * mail catcher's real SMTP: content and headers as received, escaping, response links (404s,
 * expiry, no reporter data), answers, idempotent sends, an SMTP outage, two workers at once, a
 * worker killed mid-batch, hand delivery, reminders and the template editor.
 * The background worker of scripts/test.sh runs the whole time: every assertion holds with any
 * number of workers. Limits (5 answers per link per hour, 20 per client) are ours: common
 * practice, no source.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import knex, { type Knex } from 'knex';
import nodemailer from 'nodemailer';
import { db, inTransaction } from '@/db';
import { knexConfig } from '@/db/config';
import { getUserByEmail } from '@/db/users';
import { env } from '@/lib/env';
import { runWorkerOnce } from '@/lib/notices/outbox';
import { queueSend } from '@/lib/notices/service';
import { deriveToken } from '@/lib/notices/token';
import { api, CATCHER_URL, mailTo, signIn, uniqueEmail, waitFor, type Session } from '../support/http';
import { closedPort } from '../support/net';

let chair: Session, coordinator: Session, member: Session, hunter: Session;
const catcherTransport = () => nodemailer.createTransport({ host: env.SMTP_HOST, port: env.SMTP_PORT, ignoreTLS: true, secure: false });

let filed = 0;
/** A fresh located case: filed, premises confirmed in a comment, located by a coordinator. */
async function locatedCase(by: Session = coordinator, over: Record<string, unknown> = {}): Promise<{ id: string; reference: string }> {
  const r = await api('/api/cases', {
    session: by,
    body: {
      title: `Notice test case ${++filed}`,
      sound: 'carriers',
      soundNote: '',
      description: 'Carriers every 15 kHz (test).',
      frequencies: [{ value: 14.2, unit: 'MHz' }],
      schedule: { days: ['mon'], pattern: 'continuous', note: '' },
      position: { lat: -31.3 - filed * 0.02, lon: 129.2 + (Date.now() % 1000) / 1e4, source: 'map' },
      consentShareName: false,
      ...over,
    },
  });
  expect(r.status, r.text).toBe(201);
  const id = r.json.case.id;
  const cm = await api(`/api/cases/${id}/comments`, { session: coordinator, body: { text: 'Premises confirmed from the lane.', premisesConfirmed: true } });
  expect(cm.status, cm.text).toBe(201);
  const c = (await api(`/api/cases/${id}`, { session: coordinator })).json;
  const t = await api(`/api/cases/${id}/transitions`, { session: coordinator, body: { to: 'located', version: c.version, evidence: 'premises' } });
  expect(t.status, t.text).toBe(200);
  return { id, reference: c.reference };
}

let houses = 0;
async function draft(caseId: string, over: Record<string, unknown> = {}, s: Session = coordinator) {
  const r = await api(`/api/cases/${caseId}/notices`, {
    session: s,
    body: { templateKey: 'first-notice', recipientName: 'The householder', postalAddress: `${++houses} Test Row, Quillon ${Date.now()}`, email: uniqueEmail('household'), ...over },
  });
  expect(r.status, r.text).toBe(201);
  return r.json.notice;
}

async function approved(caseId: string, over: Record<string, unknown> = {}, approver: Session = coordinator) {
  const n = await draft(caseId, over);
  const r = await api(`/api/cases/${caseId}/notices/${n.id}/approve`, { session: approver, body: { version: n.version } });
  expect(r.status, r.text).toBe(200);
  return r.json.notice;
}

const send = (caseId: string, noticeId: string, key = `key-${noticeId}`) =>
  api(`/api/cases/${caseId}/notices/${noticeId}/send`, { session: coordinator, body: { idempotencyKey: key } });

/** The link the worker puts into the e-mail, derived the same way from the stored nonce. */
async function linkFor(noticeId: string): Promise<string> {
  const { token_nonce } = await db('notices').where({ id: noticeId }).first('token_nonce');
  return `${env.APP_URL}/r/${deriveToken(noticeId, token_nonce)}`;
}

/** A header as received, unfolded (RFC 5322 §2.2.3: a line break before white space is folding). */
const header = (m: { headers: Record<string, string> }, name: string) =>
  Object.entries(m.headers)
    .find(([k]) => k.toLowerCase() === name.toLowerCase())?.[1]
    .replace(/\r?\n(?=[ \t])/g, '');

/** Every caught message, newest first (the catcher caps a page at 1000). */
async function allMail(): Promise<any[]> {
  return (await (await fetch(`${CATCHER_URL}/api/v2/messages?limit=1000`)).json()).items;
}

beforeAll(async () => {
  [chair, coordinator, member, hunter] = await Promise.all(['chair', 'coordinator', 'member', 'hunter'].map((w) => signIn(`${w}@example.test`)));
});

describe('composing and sending a notice', () => {
  it('delivers the message with the headers and links exactly as the mail server received them', async () => {
    const c = await locatedCase();
    const email = uniqueEmail('household');
    const n = await approved(c.id, { email, recipientName: 'Morgan Example', personalNote: 'We are happy to bring ferrite clips.' });
    const t0 = Date.now();
    const r = await send(c.id, n.id);
    expect(r.status, r.text).toBe(202);
    expect(r.json.messageId).toBe(`<notice-${n.id}@quietfix.example.test>`);
    const m = await waitFor(async () => (await mailTo(email))[0], 15_000);
    const tookMs = Date.now() - t0;
    const link = await linkFor(n.id);

    expect(header(m, 'From')).toBe(env.MAIL_FROM);
    expect(header(m, 'To')).toBe(email);
    expect(m.subject).toBe('A friendly note from Quillon Heath Radio Club about radio reception near you');
    expect(header(m, 'Subject')).toBe(m.subject);
    expect(header(m, 'Message-ID')).toBe(`<notice-${n.id}@quietfix.example.test>`);
    expect(m.messageId).toBe(`<notice-${n.id}@quietfix.example.test>`);
    expect(header(m, 'Reply-To')).toBe('committee@example.test');
    expect(link).toMatch(/\/r\/[A-Za-z0-9_-]{43}$/);
    expect(m.text).toContain(`\n${link}\n`);
    expect(m.html).toContain(`<a href="${link}">${link}</a>`);
    // Calm wording, plain explanation, no authority claimed.
    expect(m.text).toContain('Dear Morgan Example,');
    expect(m.text).toContain('a device near you may be where it comes from');
    expect(m.text).toContain('ferrite choke');
    expect(m.text).toContain('The club has no authority');
    expect(m.text).toContain('We are happy to bring ferrite clips.');
    expect(m.text).toContain(c.reference);
    expect(m.text).not.toContain('Bram Ostrander, one of our members'); // no consent given

    // The case moved located -> notified with a timeline entry everyone on the case may read.
    const cs = await waitFor(async () => {
      const x = (await api(`/api/cases/${c.id}`, { session: coordinator })).json;
      return x.status === 'notified' ? x : undefined;
    });
    expect(cs.status).toBe('notified');
    const events = (await api(`/api/cases/${c.id}/events`, { session: coordinator })).json.items;
    const sent = events.filter((e: any) => e.kind === 'notice-sent');
    expect(sent).toHaveLength(1);
    expect(sent[0]).toMatchObject({ visibility: 'all', data: { noticeId: n.id, via: 'e-mail', from: 'located', to: 'notified' } });
    const list = (await api(`/api/cases/${c.id}/notices`, { session: coordinator })).json.items;
    expect(list.find((x: any) => x.id === n.id)).toMatchObject({ status: 'sent', statusLabel: 'sent' });
    console.log(`[notices] send -> message in the catcher: ${tookMs} ms (background worker polling every 300 ms)`);
  });

  it('keeps HTML typed into a name as text in the HTML part', async () => {
    const c = await locatedCase();
    const email = uniqueEmail('escape');
    const name = '<b onmouseover="x()">Kim</b> & Sam';
    const n = await approved(c.id, { email, recipientName: name, personalNote: '<script>alert(1)</script>' });
    await send(c.id, n.id);
    const m = await waitFor(async () => (await mailTo(email))[0], 15_000);
    expect(m.html).toContain('Dear &lt;b onmouseover=&quot;x()&quot;&gt;Kim&lt;/b&gt; &amp; Sam,');
    expect(m.html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(m.html).not.toContain('<script>');
    expect(m.html).not.toContain('<b onmouseover');
    expect(m.text).toContain(`Dear ${name},`);
  });

  it('sends one message for two simultaneous clicks (and a repeated key)', async () => {
    const c = await locatedCase();
    const email = uniqueEmail('twice');
    const n = await approved(c.id, { email });
    const results = await Promise.all([send(c.id, n.id, 'click-one-abc'), send(c.id, n.id, 'click-two-abc'), send(c.id, n.id, 'click-one-abc')]);
    for (const r of results) expect([200, 202], r.text).toContain(r.status);
    expect(results.filter((r) => r.status === 202)).toHaveLength(1);
    expect(new Set(results.map((r) => r.json.messageId)).size).toBe(1);
    expect(await db('outbox').where({ notice_id: n.id }).count<{ count: string }[]>({ count: '*' })).toEqual([{ count: '1' }]);
    await waitFor(async () => ((await mailTo(email)).length ? true : undefined), 15_000);
    await new Promise((r) => setTimeout(r, 1500)); // give any second delivery time to show up
    expect(await mailTo(email)).toHaveLength(1);
  });

  it('allows one active notice per household on a case and warns about other cases', async () => {
    const a = await locatedCase();
    const b = await locatedCase();
    const address = `7 Duplicate Lane, Quillon ${Date.now()}`;
    await draft(a.id, { postalAddress: address });
    const again = await api(`/api/cases/${a.id}/notices`, { session: coordinator, body: { templateKey: 'first-notice', recipientName: 'Someone', postalAddress: address.toUpperCase().replace(/ /g, '  ') } });
    expect(again.status).toBe(409);
    expect(again.json.error).toMatch(/already has a notice/);
    const check = await api(`/api/cases/${b.id}/notices?address=${encodeURIComponent(address.replace(',', ''))}`, { session: coordinator });
    expect(check.json.sameAddressElsewhere).toEqual([expect.objectContaining({ caseId: a.id, reference: a.reference })]);
    const bad = await api(`/api/cases/${a.id}/notices`, { session: coordinator, body: { templateKey: 'first-notice', recipientName: '', postalAddress: '', email: 'nope' } });
    expect(bad.status).toBe(400);
    expect([...new Set(bad.json.issues.map((i: any) => i.path))].sort()).toEqual(['email', 'postalAddress', 'recipientName']);
  });

  it('needs approval before sending, and 409s a stale edit', async () => {
    const c = await locatedCase();
    const n = await draft(c.id);
    const early = await send(c.id, n.id);
    expect(early.status).toBe(422);
    expect(early.json.error).toMatch(/approves the notice before/);
    const ok = await api(`/api/cases/${c.id}/notices/${n.id}`, { method: 'PATCH', session: coordinator, body: { version: n.version, personalNote: 'Hello' } });
    expect(ok.status, ok.text).toBe(200);
    const stale = await api(`/api/cases/${c.id}/notices/${n.id}`, { method: 'PATCH', session: coordinator, body: { version: n.version, personalNote: 'Again' } });
    expect(stale.status).toBe(409);
    const pv = await api(`/api/cases/${c.id}/notices/${n.id}/preview`, { session: coordinator });
    expect(pv.json.text).toContain('Hello');
    expect(pv.json.html).toContain('<p>');
  });
});

describe('the printed letter and hand delivery', () => {
  it('makes a PDF with the link, and "delivered" moves the case to notified once', async () => {
    const c = await locatedCase();
    const n = await approved(c.id, { email: '', recipientName: 'Jo Ĺetter “Quotes” ✓', postalAddress: `3 Print Street\nQuillon ${Date.now()}` });
    const mail = await send(c.id, n.id);
    expect(mail.status).toBe(422);
    expect(mail.json.error).toMatch(/print the letter/);
    const res = await fetch(`${process.env.TEST_BASE_URL ?? 'http://127.0.0.1:3100'}/api/cases/${c.id}/notices/${n.id}/letter`, { headers: { cookie: coordinator.cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const pdf = Buffer.from(await res.arrayBuffer());
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdf.length).toBeGreaterThan(3000);
    const today = new Date().toISOString().slice(0, 10);
    const future = await api(`/api/cases/${c.id}/notices/${n.id}/delivered`, { session: coordinator, body: { deliveredOn: '2999-01-01' } });
    expect(future.status).toBe(422);
    const d = await api(`/api/cases/${c.id}/notices/${n.id}/delivered`, { session: coordinator, body: { deliveredOn: today } });
    expect(d.status, d.text).toBe(200);
    expect(d.json.notice).toMatchObject({ status: 'hand-delivered', deliveredOn: today });
    const cs = (await api(`/api/cases/${c.id}`, { session: coordinator })).json;
    expect(cs.status).toBe('notified');
    const events = (await api(`/api/cases/${c.id}/events`, { session: coordinator })).json.items;
    expect(events.filter((e: any) => e.kind === 'status-changed' && e.data.to === 'notified')).toEqual([
      expect.objectContaining({ data: expect.objectContaining({ method: 'hand-delivered', deliveredOn: today }) }),
    ]);
    const twice = await api(`/api/cases/${c.id}/notices/${n.id}/delivered`, { session: coordinator, body: { deliveredOn: today } });
    expect(twice.status).toBe(422);
  });
});

describe('the response link', () => {
  it('answers a wrong, made-up or expired token with the same plain 404 (page and API)', async () => {
    const c = await locatedCase();
    const n = await approved(c.id);
    const good = (await linkFor(n.id)).split('/r/')[1];
    expect((await api(`/api/r/${good}`)).status).toBe(200);
    const wrong = await api('/api/r/not-a-token');
    const madeUp = await api(`/api/r/${'A'.repeat(43)}`);
    const answer = await api(`/api/r/${'B'.repeat(43)}/answers`, { body: { kind: 'fixed-it' } });
    await db('notices').where({ id: n.id }).update({ token_expires_at: db.raw("now() - interval '1 minute'") });
    const expired = await api(`/api/r/${good}`);
    for (const r of [wrong, madeUp, answer, expired]) {
      expect(r.status).toBe(404);
      expect(r.json).toEqual(wrong.json);
    }
    const page = await fetch(`${process.env.TEST_BASE_URL ?? 'http://127.0.0.1:3100'}/r/${good}`);
    expect(page.status).toBe(404);
  });

  it('shows no reporter data without consent, and the name only with it', async () => {
    // The coordinator reports (no consent), the chair approves: the reporter must not appear.
    const c = await locatedCase(coordinator);
    const n = await approved(c.id, {}, chair);
    const token = (await linkFor(n.id)).split('/r/')[1];
    const j = await api(`/api/r/${token}`);
    const page = await (await fetch(`${process.env.TEST_BASE_URL ?? 'http://127.0.0.1:3100'}/r/${token}`)).text();
    const row = await db('cases').where({ id: c.id }).first('reported_lat', 'reported_lon', 'reporter_id');
    for (const body of [j.text, page]) {
      for (const secret of ['Bram Ostrander', 'coordinator@example.test', 'QB2COR', row.reporter_id, String(row.reported_lat), String(row.reported_lon)]) {
        expect(body).not.toContain(secret);
      }
    }
    expect(page).toContain('Ada Fenwick'); // the approving coordinator signs it
    expect(Object.keys(j.json).sort()).toEqual(['answers', 'clubContactEmail', 'clubName', 'expiresOn', 'html', 'noticeDate', 'subject', 'text']);

    const consenting = await locatedCase(coordinator, { consentShareName: true });
    const n2 = await approved(consenting.id, {}, chair);
    const j2 = await api(`/api/r/${(await linkFor(n2.id)).split('/r/')[1]}`);
    expect(j2.json.text).toContain('Bram Ostrander, one of our members, first noticed the noise');
  });

  it('puts answers on the timeline, e-mails the coordinators and limits repeats', async () => {
    const c = await locatedCase();
    const n = await approved(c.id, { recipientName: 'Pat Answerer' });
    const token = (await linkFor(n.id)).split('/r/')[1];
    const missing = await api(`/api/r/${token}/answers`, { body: { kind: 'contact-me', contact: '' } });
    expect(missing.status).toBe(400);
    expect(missing.json.issues[0].path).toBe('contact');
    const r = await api(`/api/r/${token}/answers`, { body: { kind: 'contact-me', contact: '0123 456 789', message: 'Evenings are best.' } });
    expect(r.status, r.text).toBe(201);
    const events = (await api(`/api/cases/${c.id}/events`, { session: coordinator })).json.items;
    expect(events.find((e: any) => e.kind === 'recipient-answered')).toMatchObject({
      visibility: 'committee',
      data: { noticeId: n.id, answer: 'contact-me', contact: '0123 456 789', text: 'Evenings are best.' },
    });
    const alert = await waitFor(async () => (await mailTo('coordinator@example.test')).find((m) => m.subject.startsWith(`${c.reference}: Pat Answerer answered`)), 15_000);
    expect(alert.text).toContain('How to reach them: 0123 456 789');
    expect(header(alert, 'Message-ID')).toMatch(/^<alert-[0-9a-f-]{36}@quietfix\.example\.test>$/);
    for (let i = 0; i < 4; i++) expect((await api(`/api/r/${token}/answers`, { body: { kind: 'will-check' } })).status).toBe(201);
    const limited = await api(`/api/r/${token}/answers`, { body: { kind: 'fixed-it' } });
    expect(limited.status).toBe(429);
    expect(limited.json.error).toMatch(/try again later/);
    expect(limited.headers.get('retry-after')).toBe('3600');
  });
});

describe('what the assigned hunter sees of notices', () => {
  it('that a notice exists and its status; never the household, the link or other cases', async () => {
    const mine = await locatedCase();
    const elsewhere = await locatedCase();
    const hunterId = (await api('/api/auth/session', { session: hunter })).json.user.id;
    const c = (await api(`/api/cases/${mine.id}`, { session: coordinator })).json;
    expect((await api(`/api/cases/${mine.id}`, { method: 'PATCH', session: coordinator, body: { version: c.version, assigneeId: hunterId } })).status).toBe(200);
    const address = `9 Quiet Close, Quillon ${Date.now()}`;
    await draft(elsewhere.id, { recipientName: 'Robin Elsewhere', postalAddress: address });
    const n = await approved(mine.id, { recipientName: 'Sam Private', postalAddress: address, personalNote: 'Happy to help.' });
    const token = (await linkFor(n.id)).split('/r/')[1];
    expect((await api(`/api/r/${token}/answers`, { body: { kind: 'contact-me', contact: '0123 999 000', message: 'Call after six.' } })).status).toBe(201);

    // The committee sees everything, the other case included.
    const asCoordinator = await api(`/api/cases/${mine.id}/notices?address=${encodeURIComponent(address)}`, { session: coordinator });
    expect(asCoordinator.json.items[0]).toMatchObject({ recipientName: 'Sam Private', postalAddress: address, answers: 1 });
    expect(asCoordinator.json.sameAddressElsewhere).toEqual([expect.objectContaining({ caseId: elsewhere.id })]);

    const list = await api(`/api/cases/${mine.id}/notices?address=${encodeURIComponent(address)}`, { session: hunter });
    expect(list.status, list.text).toBe(200);
    expect(list.json.items).toEqual([expect.objectContaining({ id: n.id, status: 'approved', statusLabel: 'approved, not sent', templateKey: 'first-notice' })]);
    expect(list.json.can).toEqual({ read: true, contact: false, draft: false, decide: false });
    const one = await api(`/api/cases/${mine.id}/notices/${n.id}`, { session: hunter });
    expect(one.status).toBe(200);
    const events = await api(`/api/cases/${mine.id}/events`, { session: hunter });
    expect(events.json.items.find((e: any) => e.kind === 'recipient-answered')).toMatchObject({ data: { noticeId: n.id, answer: 'contact-me' } });
    for (const r of [list, one, events]) {
      for (const secret of ['Sam Private', 'Robin Elsewhere', address, '0123 999 000', 'Call after six.', 'Happy to help.', token, elsewhere.id, elsewhere.reference]) {
        expect(r.text).not.toContain(secret);
      }
      expect(r.text).not.toMatch(/sameAddressElsewhere|postalAddress|recipientName/);
    }
    for (const part of ['preview', 'letter']) expect((await api(`/api/cases/${mine.id}/notices/${n.id}/${part}`, { session: hunter })).status).toBe(403);
    const hunterDraft = await api(`/api/cases/${mine.id}/notices`, { session: hunter, body: { templateKey: 'first-notice', recipientName: 'X Y', postalAddress: '1 Some Row' } });
    expect(hunterDraft.status).toBe(403);
  });
});

describe('the outbox', () => {
  let pools: Knex[] = [];
  const pool = () => {
    const k = knex(knexConfig({ ...env, DB_POOL_MAX: 3 }));
    pools.push(k);
    return k;
  };
  const children: ChildProcess[] = [];
  afterAll(async () => {
    for (const ch of children) if (ch.exitCode === null) ch.kill('SIGKILL');
    await Promise.all(pools.map((p) => p.destroy()));
    pools = [];
  });

  /** Approves `count` notices and queues them all in one transaction, so workers see them at once. */
  async function queueMany(caseId: string, count: number, tag: string): Promise<{ ids: string[]; emails: string[] }> {
    const notices: { id: string; email: string }[] = [];
    for (let i = 0; i < count; i++) notices.push(await approved(caseId, { email: uniqueEmail(`${tag}-${i}`), postalAddress: `${i} ${tag} Close, Quillon` }));
    const me = (await getUserByEmail('coordinator@example.test'))!;
    await inTransaction(async (trx) => {
      for (const n of notices) await queueSend(trx, me, caseId, n.id, `bulk-${n.id}`);
    });
    return { ids: notices.map((n) => n.id), emails: notices.map((n) => n.email) };
  }

  async function countsFor(emails: string[]): Promise<Map<string, any[]>> {
    const wanted = new Set(emails);
    const out = new Map<string, any[]>(emails.map((e) => [e, []]));
    for (const m of await allMail()) for (const to of m.to) if (wanted.has(to)) out.get(to)!.push(m);
    return out;
  }

  it('keeps a notice through an SMTP outage and delivers it exactly once when the server is back', async () => {
    const c = await locatedCase();
    const email = uniqueEmail('outage');
    const n = await approved(c.id, { email });
    const me = (await getUserByEmail('coordinator@example.test'))!;
    const down = nodemailer.createTransport({ host: '127.0.0.1', port: await closedPort(), connectionTimeout: 2000 });
    const t0 = Date.now();
    // Queue and make the first try inside one transaction: the row is leased by this test's
    // worker before any other worker can see it, so the first try surely meets the dead server.
    const first = await inTransaction(async (trx) => {
      await queueSend(trx, me, c.id, n.id, `outage-${n.id}`);
      return runWorkerOnce({ knex: trx, transport: down, onlyCaseIds: [c.id], backoffBaseMs: 1500 });
    });
    expect(first).toMatchObject({ claimed: 1, sent: 0, retrying: 1 });
    const waiting = (await api(`/api/cases/${c.id}/notices/${n.id}`, { session: coordinator })).json.notice;
    expect(waiting.statusLabel).toBe('waiting to send');
    expect(waiting.delivery.attempts).toBe(1);
    expect(waiting.delivery.lastError).toMatch(/ECONNREFUSED/);
    expect(await mailTo(email)).toHaveLength(0);
    const row = await db('outbox').where({ notice_id: n.id }).first();
    expect(new Date(row.next_attempt_at).getTime() - new Date(row.last_attempt_at).getTime()).toBeGreaterThanOrEqual(1400);
    // The server is back: our worker and the background one both try; exactly one delivers.
    const up = catcherTransport();
    const w = pool();
    await waitFor(async () => {
      await runWorkerOnce({ knex: w, transport: up, onlyCaseIds: [c.id] });
      return (await mailTo(email)).length ? true : undefined;
    }, 20_000);
    const deliveredMs = Date.now() - t0;
    await new Promise((r) => setTimeout(r, 1500));
    const got = await mailTo(email);
    expect(got).toHaveLength(1);
    expect(got[0].messageId).toBe(`<notice-${n.id}@quietfix.example.test>`);
    const after = await db('outbox').where({ notice_id: n.id }).first();
    expect(after).toMatchObject({ status: 'sent', attempts: 2, last_error: null });
    const cs = await waitFor(async () => ((await api(`/api/cases/${c.id}`, { session: coordinator })).json.status === 'notified' ? true : undefined));
    expect(cs).toBe(true);
    console.log(`[notices] outage: first try refused at once; delivered ${deliveredMs} ms after queueing (backoff 1500 ms)`);
  });

  it('marks a notice failed after the last try and lets a coordinator retry it', async () => {
    const c = await locatedCase();
    const email = uniqueEmail('gives-up');
    const n = await approved(c.id, { email });
    const me = (await getUserByEmail('coordinator@example.test'))!;
    const down = nodemailer.createTransport({ host: '127.0.0.1', port: await closedPort() });
    await inTransaction(async (trx) => {
      await queueSend(trx, me, c.id, n.id, `gives-up-${n.id}`);
      return runWorkerOnce({ knex: trx, transport: down, onlyCaseIds: [c.id], maxAttempts: 1 });
    });
    const failed = (await api(`/api/cases/${c.id}/notices/${n.id}`, { session: coordinator })).json.notice;
    expect(failed).toMatchObject({ status: 'failed', statusLabel: 'sending failed' });
    const r = await api(`/api/cases/${c.id}/notices/${n.id}/retry`, { session: coordinator, body: {} });
    expect(r.status, r.text).toBe(202);
    const m = await waitFor(async () => (await mailTo(email))[0], 15_000);
    expect(m.messageId).toBe(`<notice-${n.id}@quietfix.example.test>`);
  });

  it('two workers at once over 50 queued notices deliver each exactly once', async () => {
    const c = await locatedCase();
    const { emails } = await queueMany(c.id, 50, 'pair');
    const t0 = Date.now();
    const loop = async (k: Knex, id: string) => {
      const t = catcherTransport();
      let sent = 0;
      for (;;) {
        const r = await runWorkerOnce({ knex: k, transport: t, workerId: id, onlyCaseIds: [c.id], batchSize: 5 });
        sent += r.sent;
        if (r.claimed === 0 && Number((await k('outbox').where({ case_id: c.id, status: 'pending' }).count({ n: '*' }))[0].n) === 0) return sent;
        if (r.claimed === 0) await new Promise((res) => setTimeout(res, 100));
      }
    };
    const [a, b] = await Promise.all([loop(pool(), 'test-worker-a'), loop(pool(), 'test-worker-b')]);
    const ms = Date.now() - t0;
    await new Promise((r) => setTimeout(r, 1000));
    const counts = await countsFor(emails);
    for (const [to, list] of counts) expect(list.length, to).toBe(1);
    const rows = await db('outbox').where({ case_id: c.id, kind: 'notice' });
    expect(rows.every((r) => r.status === 'sent' && r.attempts === 1)).toBe(true);
    console.log(`[notices] 50 notices, two test workers (+ background): a sent ${a}, b sent ${b}, background ${50 - a - b}; ${ms} ms`);
  });

  it('a worker killed mid-batch and a fresh one deliver every notice; repeats only in the documented window', async () => {
    const c = await locatedCase();
    const workerEnv = { ...process.env, OUTBOX_POLL_MS: '50', OUTBOX_BATCH_SIZE: '25', OUTBOX_LEASE_MS: '2000' };
    const start = (args: string[]) => {
      const ch = spawn(process.execPath, ['--import', 'tsx', 'scripts/outbox-worker.ts', ...args], { env: workerEnv, stdio: ['ignore', 'pipe', 'pipe'] });
      children.push(ch);
      return ch;
    };
    const a = start([]);
    await new Promise<void>((resolve) => a.stdout!.on('data', (d) => String(d).includes('started') && resolve()));
    const { ids, emails } = await queueMany(c.id, 50, 'kill');
    // Kill the worker as soon as a few of these have arrived: it holds a leased batch in flight.
    await waitFor(async () => {
      const n = [...(await countsFor(emails)).values()].filter((l) => l.length > 0).length;
      return n >= 3 ? n : undefined;
    }, 20_000);
    a.kill('SIGKILL');
    const leasedByDead = await db('outbox').whereIn('notice_id', ids).where({ status: 'pending' }).whereNotNull('lease_until').count<{ n: string }[]>({ n: '*' });
    const t0 = Date.now();
    const b = start(['--drain']);
    const code = await new Promise<number | null>((r) => b.on('exit', r));
    expect(code).toBe(0);
    await waitFor(async () => ((await db('outbox').whereIn('notice_id', ids).whereNot({ status: 'sent' })).length === 0 ? true : undefined), 30_000);
    await new Promise((r) => setTimeout(r, 1000));
    const counts = await countsFor(emails);
    const repeats = [...counts.values()].filter((l) => l.length > 1);
    for (const [to, list] of counts) expect(list.length, to).toBeGreaterThanOrEqual(1);
    for (const list of repeats) expect(new Set(list.map((m) => m.messageId)).size).toBe(1);
    expect(repeats.length).toBeLessThanOrEqual(25); // at most the batch in flight
    const effects = await db('case_events').where({ case_id: c.id, kind: 'notice-sent' }).count<{ n: string }[]>({ n: '*' });
    expect(Number(effects[0].n)).toBe(50); // each notice recorded sent once
    console.log(`[notices] kill test: ${leasedByDead[0].n} rows leased by the killed worker, all 50 delivered ${Date.now() - t0} ms after the restart; repeats: ${repeats.length}`);
  });
});

describe('reminders', () => {
  it('prepares one follow-up draft when a notice gets no answer, and tells the committee', async () => {
    const c = await locatedCase();
    const email = uniqueEmail('quiet');
    const n = await approved(c.id, { email, recipientName: 'Robin Quiet' });
    await send(c.id, n.id);
    await waitFor(async () => ((await db('notices').where({ id: n.id }).first('status')).status === 'sent' ? true : undefined), 15_000);
    await db('notices').where({ id: n.id }).update({ sent_at: db.raw("now() - interval '30 days'") });
    await runWorkerOnce({ transport: catcherTransport() });
    await runWorkerOnce({ transport: catcherTransport() });
    const drafts = await db('notices').where({ follow_up_of: n.id });
    expect(drafts).toHaveLength(1);
    expect(drafts[0]).toMatchObject({ status: 'draft', template_key: 'follow-up', email, recipient_name: 'Robin Quiet' });
    const alert = await waitFor(async () => (await mailTo('coordinator@example.test')).find((m) => m.subject === `${c.reference}: no answer yet, a follow-up draft is ready`), 15_000);
    expect(alert.text).toContain('Nothing is sent until a coordinator approves it.');
    const pv = await api(`/api/cases/${c.id}/notices/${drafts[0].id}/preview`, { session: coordinator });
    expect(pv.json.text).toMatch(/On \d{1,2} \w+ \d{4} we wrote to you/);
  });
});

describe('templates', () => {
  it('lets an admin edit a template, refusing unescaped tags and stale versions', async () => {
    const list = await api('/api/templates', { session: chair });
    expect(list.json.items.map((t: any) => t.key)).toEqual(['first-notice', 'follow-up', 'thank-you', 'utility-referral']);
    expect((await api('/api/templates', { session: coordinator })).status).toBe(403);
    const t = (await api('/api/templates/thank-you', { session: chair })).json;
    const raw = await api('/api/templates/thank-you', { method: 'PUT', session: chair, body: { version: t.version, subject: t.subject, body: `${t.body}\n{{{recipientName}}}` } });
    expect(raw.status).toBe(400);
    expect(raw.json.issues[0].path).toBe('body');
    const ok = await api('/api/templates/thank-you', { method: 'PUT', session: chair, body: { version: t.version, subject: 'Thank you, {{recipientName}}', body: t.body } });
    expect(ok.status, ok.text).toBe(200);
    expect(ok.json).toMatchObject({ version: t.version + 1, updatedByName: 'Ada Fenwick' });
    const stale = await api('/api/templates/thank-you', { method: 'PUT', session: chair, body: { version: t.version, subject: t.subject, body: t.body } });
    expect(stale.status).toBe(409);
    await api('/api/templates/thank-you', { method: 'PUT', session: chair, body: { version: t.version + 1, subject: t.subject, body: t.body } });
  });

  it('is not readable by members', async () => {
    expect((await api('/api/templates/first-notice', { session: member })).status).toBe(403);
  });
});
