import type { Knex } from 'knex';
import { hashPassword } from '@/lib/auth/password';
import { appendEvent, insertCase } from '../cases';
import { insertBearing } from '../bearings';
import { recomputeFix } from '@/lib/hunt/fix';
import { seedDemoTown } from './demo-town';
// GeographicLib itself (Karney 2013), not lib/df's internals: the seed only places invented spots.
import geographiclib from 'geographiclib-geodesic';

const WGS84 = geographiclib.Geodesic.WGS84;

/**
 * The demo scenario: a fictional club in the fictional town of Quillon, placed on open,
 * uninhabited plain so no real home is pointed at. Addresses under example.test,
 * call signs starting with Q (no country issues those).
 */
export const DEMO_PASSWORD = 'quietfix-demo';
export const DEMO_CENTRE = { lat: -31.052, lon: 129.748 };
/** Where the demo's made-up noise sources are (the open and the located case). */
export const DEMO_SOURCES = {
  open: { lat: DEMO_CENTRE.lat + 0.0012, lon: DEMO_CENTRE.lon + 0.0021 },
  located: { lat: DEMO_CENTRE.lat - 0.0062, lon: DEMO_CENTRE.lon + 0.0114 },
};

export const DEMO_USERS = [
  { email: 'chair@example.test', name: 'Ada Fenwick', callSign: 'QA1CHR', role: 'admin' },
  { email: 'coordinator@example.test', name: 'Bram Ostrander', callSign: 'QB2COR', role: 'coordinator' },
  { email: 'hunter@example.test', name: 'Cleo Marchetti', callSign: 'QC3HNT', role: 'hunter' },
  { email: 'member@example.test', name: 'Dov Pellinger', callSign: 'QD4MEM', role: 'member' },
] as const;

/**
 * Demo bearings toward a made-up source: observers placed with GeographicLib's Direct problem,
 * each bearing the Inverse azimuth to the source plus a small fixed error (degrees).
 */
async function seedBearings(
  trx: Knex.Transaction,
  caseId: string,
  authorId: string,
  source: { lat: number; lon: number },
  spots: { fromSourceDeg: number; rangeM: number; errorDeg: number; sigmaDeg: number; frequencyKhz: number }[],
) {
  for (const [i, s] of spots.entries()) {
    const d = WGS84.Direct(source.lat, source.lon, s.fromSourceDeg, s.rangeM);
    const o = { lat: d.lat2!, lon: d.lon2! };
    const az = (((WGS84.Inverse(o.lat, o.lon, source.lat, source.lon).azi1! + s.errorDeg) % 360) + 360) % 360;
    const id = await insertBearing(trx, caseId, authorId, {
      lat: o.lat,
      lon: o.lon,
      positionSource: 'device',
      positionAccuracyM: 6,
      azimuthEnteredDeg: az,
      reference: 'true',
      declinationDeg: 0,
      azimuthTrueDeg: az,
      sigmaDeg: s.sigmaDeg,
      frequencyKhz: s.frequencyKhz,
      oneWay: false,
      note: `demo spot ${i + 1}`,
      takenAt: new Date(Date.now() - (spots.length - i) * 15 * 60_000),
    });
    await appendEvent(trx, { caseId, actorId: authorId, kind: 'bearing-added', data: { bearingId: id, azimuthTrueDeg: az, sigmaDeg: s.sigmaDeg, reference: 'true' } });
    await recomputeFix(trx, caseId, `bearing-added ${id}`);
  }
}

export async function seedDemo(trx: Knex.Transaction): Promise<void> {
  // The same cost as every other password, so a demo account answers a wrong password as slowly as any.
  const hash = await hashPassword(DEMO_PASSWORD);
  const ids: Record<string, string> = {};
  for (const u of DEMO_USERS) {
    const [row] = await trx('users')
      .insert({ email: u.email, name: u.name, call_sign: u.callSign, role: u.role, password_hash: hash })
      .returning('id');
    ids[u.role] = row.id;
  }
  await trx('club_settings')
    .insert({ id: 1, club_name: 'Quillon Heath Radio Club', contact_email: 'committee@example.test', locate_threshold_m: 75, reminder_days: 14 })
    .onConflict('id')
    .ignore();
  await seedDemoTown(trx, DEMO_SOURCES.open, DEMO_SOURCES.located);

  const open = await insertCase(trx, {
    title: 'Rasping hash on 80 m and 40 m in the evenings',
    description: 'A rough buzz with 100 Hz spacing covers 3.5–3.8 MHz and most of 40 m from about 18:00 to 23:00, S7 on the meter. Started in spring.',
    reporterId: ids.member,
    reportedLat: DEMO_CENTRE.lat + 0.004,
    reportedLon: DEMO_CENTRE.lon - 0.006,
    bands: ['80m', '40m'],
    assigneeId: ids.hunter,
    report: {
      sound: 'buzz',
      soundNote: '100 Hz spacing, rough',
      frequenciesKhz: [3650, 7100],
      levelDbm: -85,
      schedule: { days: ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'], fromHour: 18, toHour: 23, pattern: 'continuous', note: '' },
    },
  });
  await appendEvent(trx, { caseId: open.id, actorId: ids.member, kind: 'reported', data: { title: open.title }, visibility: 'all' });
  await appendEvent(trx, { caseId: open.id, actorId: ids.coordinator, kind: 'assigned', data: { assigneeId: ids.hunter, assigneeName: 'Cleo Marchetti' } });
  await seedBearings(trx, open.id, ids.hunter, DEMO_SOURCES.open, [
    { fromSourceDeg: 250, rangeM: 650, errorDeg: 1.5, sigmaDeg: 4, frequencyKhz: 3650 },
    { fromSourceDeg: 330, rangeM: 800, errorDeg: -2, sigmaDeg: 4, frequencyKhz: 7100 },
  ]);

  const located = await insertCase(trx, {
    title: 'Warbling carriers every 15 kHz across 20 m',
    description: 'Steady carriers that drift slowly, loudest at midday, gone at night. Sounds like a solar inverter.',
    reporterId: ids.member,
    reportedLat: DEMO_CENTRE.lat - 0.008,
    reportedLon: DEMO_CENTRE.lon + 0.01,
    bands: ['20m', '17m'],
    assigneeId: ids.hunter,
    status: 'located',
  });
  await appendEvent(trx, { caseId: located.id, actorId: ids.member, kind: 'reported', data: { title: located.title }, visibility: 'all' });
  await seedBearings(trx, located.id, ids.hunter, DEMO_SOURCES.located, [
    { fromSourceDeg: 20, rangeM: 420, errorDeg: 0.6, sigmaDeg: 2, frequencyKhz: 14150 },
    { fromSourceDeg: 115, rangeM: 380, errorDeg: -0.8, sigmaDeg: 2, frequencyKhz: 14150 },
    { fromSourceDeg: 205, rangeM: 510, errorDeg: 0.3, sigmaDeg: 2, frequencyKhz: 18100 },
    { fromSourceDeg: 290, rangeM: 300, errorDeg: -0.4, sigmaDeg: 2, frequencyKhz: 14150 },
  ]);
  await appendEvent(trx, { caseId: located.id, actorId: ids.hunter, kind: 'status-changed', data: { from: 'open', to: 'located', evidence: 'fix' }, visibility: 'all' });

  const resolved = await insertCase(trx, {
    title: 'Wideband hiss on 160 m after dark',
    description: 'A smooth hiss that lifts the noise floor by about two S-units on top band.',
    reporterId: ids.coordinator,
    reportedLat: DEMO_CENTRE.lat + 0.012,
    reportedLon: DEMO_CENTRE.lon + 0.004,
    bands: ['160m'],
    assigneeId: ids.hunter,
    status: 'resolved',
  });
  await appendEvent(trx, { caseId: resolved.id, actorId: ids.coordinator, kind: 'reported', data: { title: resolved.title }, visibility: 'all' });
  await appendEvent(trx, {
    caseId: resolved.id,
    actorId: ids.coordinator,
    kind: 'status-changed',
    data: { from: 'notified', to: 'resolved', outcome: 'fixed-by-owner', levelBeforeDbm: -85, levelAfterDbm: -103 },
    visibility: 'all',
  });
  await trx('cases').where({ id: resolved.id }).update({ outcome: 'fixed-by-owner', level_before_dbm: -85, level_after_dbm: -103, resolved_at: trx.fn.now() });
}

/** Whether the database already has people in it (then the demo is not seeded again). */
export async function alreadySeeded(q: Knex): Promise<boolean> {
  const [{ count }] = await q('users').count<{ count: string }[]>({ count: '*' });
  return Number(count) > 0;
}
