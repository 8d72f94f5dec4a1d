import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { db } from '@/db';
import { dataRevision } from '@/db/revisions';
import { api, APP_ORIGIN, BASE_URL, signIn, type Session } from '../support/http';

/**
 * The queue and the map of all cases are kept under the data revision (lib/cache/by-revision.ts,
 * migrations/20261202130000_data_revisions.ts): every write must show at once, on both app
 * instances, whichever instance or process made it.
 */
const B = process.env.TEST_BASE_URL_B ?? `http://127.0.0.1:${Number(new URL(BASE_URL).port) + 1}`;
const TAG = `ctag${Date.now().toString(36)}`;
let coordinator: Session;
let caseId: string;
let hunterId: string;

const onBoth = async (path: string) => {
  const a = await api(path, { session: coordinator });
  const b = await fetch(`${B}${path}`, { headers: { cookie: coordinator.cookie } });
  expect(a.status, a.text).toBe(200);
  expect(b.status).toBe(200);
  return [a.json, await b.json()];
};
const titles = async () => (await onBoth(`/api/cases?q=${TAG}`)).map((page) => page.items.map((i: { title: string }) => i.title));

beforeAll(async () => {
  coordinator = await signIn('coordinator@example.test');
  const member = await db('users').where({ email: 'member@example.test' }).first();
  hunterId = (await db('users').where({ email: 'hunter@example.test' }).first()).id;
  caseId = randomUUID();
  await db('cases').insert({
    id: caseId, reference: `QC-${TAG}`, title: `${TAG} first title`, status: 'open', reporter_id: member.id, assignee_id: hunterId,
    reported_lat: -31.4, reported_lon: 129.3, bands: ['40m'],
  });
});

afterAll(async () => {
  await db('cases').where({ id: caseId }).delete();
});

describe('the data revision', () => {
  it('rises by one for each committed transaction that writes cases, however many rows it writes', async () => {
    const before = BigInt(await dataRevision('cases'));
    await db.transaction(async (trx) => {
      for (let i = 0; i < 3; i++) await trx('cases').where({ id: caseId }).update({ description: `edit ${i}` });
    });
    expect(BigInt(await dataRevision('cases'))).toBe(before + 1n);
  });

  it('stays for a transaction rolled back, and for one that writes no case', async () => {
    const before = await dataRevision('cases');
    await expect(
      db.transaction(async (trx) => {
        await trx('cases').where({ id: caseId }).update({ description: 'never' });
        throw new Error('changed my mind');
      }),
    ).rejects.toThrow('changed my mind');
    await db.transaction(async (trx) => trx('saved_filters').where({ id: randomUUID() }).delete());
    expect(await dataRevision('cases')).toBe(before);
  });

  it("rises when a person's name changes (the queue shows the assignee's name)", async () => {
    const before = BigInt(await dataRevision('cases'));
    const { name } = await db('users').where({ id: hunterId }).first();
    await db('users').where({ id: hunterId }).update({ name: `${name} ` });
    await db('users').where({ id: hunterId }).update({ name });
    expect(BigInt(await dataRevision('cases'))).toBe(before + 2n);
  });
});

describe('kept lists show every write at once, on both instances', () => {
  it('a title changed by another process (not through the app)', async () => {
    expect(await titles()).toEqual([[`${TAG} first title`], [`${TAG} first title`]]);
    await db('cases').where({ id: caseId }).update({ title: `${TAG} second title` });
    expect(await titles()).toEqual([[`${TAG} second title`], [`${TAG} second title`]]);
  });

  it('an edit through one instance, read on the other straight after', async () => {
    for (const [writer, reader] of [[BASE_URL, B], [B, BASE_URL]]) {
      const { version } = await db('cases').where({ id: caseId }).first();
      const title = `${TAG} via ${new URL(writer).port}`;
      await fetch(`${reader}/api/cases?q=${TAG}`, { headers: { cookie: coordinator.cookie } }); // kept on the reader
      const patch = await fetch(`${writer}/api/cases/${caseId}`, {
        method: 'PATCH',
        headers: { cookie: coordinator.cookie, origin: APP_ORIGIN, 'content-type': 'application/json' }, // both instances serve APP_URL
        body: JSON.stringify({ version, title }),
      });
      expect(patch.status, await patch.text()).toBe(200);
      const page = await (await fetch(`${reader}/api/cases?q=${TAG}`, { headers: { cookie: coordinator.cookie } })).json();
      expect(page.items.map((i: { title: string }) => i.title)).toEqual([title]);
    }
  });

  it("the assignee's new name, and the map's cell for a case that moved", async () => {
    const { name } = await db('users').where({ id: hunterId }).first();
    const names = async () => (await onBoth(`/api/cases?q=${TAG}`)).map((page) => page.items[0].assigneeName);
    expect(await names()).toEqual([name, name]);
    await db('users').where({ id: hunterId }).update({ name: `${name} (renamed)` });
    try {
      expect(await names()).toEqual([`${name} (renamed)`, `${name} (renamed)`]);
    } finally {
      await db('users').where({ id: hunterId }).update({ name });
    }

    const map = (lat: number, lon: number) => `/api/cases/map?bbox=${lon - 0.0005},${lat - 0.0005},${lon + 0.0005},${lat + 0.0005}&zoom=18&q=${TAG}`;
    const count = async (lat: number, lon: number) => (await onBoth(map(lat, lon))).map((m) => m.cells.reduce((s: number, c: { count: number }) => s + c.count, 0));
    expect(await count(-31.4, 129.3)).toEqual([1, 1]);
    expect(await count(-31.41, 129.31)).toEqual([0, 0]);
    await db('cases').where({ id: caseId }).update({ reported_lat: -31.41, reported_lon: 129.31 });
    expect(await count(-31.4, 129.3)).toEqual([0, 0]);
    expect(await count(-31.41, 129.31)).toEqual([1, 1]);
  });
});
