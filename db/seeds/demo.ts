import type { Knex } from 'knex';
import bcrypt from 'bcryptjs';
import { appendEvent, insertCase } from '../cases';

/**
 * The demo scenario: a fictional club in the fictional town of Quillon, placed on open,
 * uninhabited plain so no real home is pointed at. Addresses under example.test,
 * call signs starting with Q (no country issues those).
 */
export const DEMO_PASSWORD = 'quietfix-demo';
export const DEMO_CENTRE = { lat: -31.052, lon: 129.748 };

export const DEMO_USERS = [
  { email: 'chair@example.test', name: 'Ada Fenwick', callSign: 'QA1CHR', role: 'admin' },
  { email: 'coordinator@example.test', name: 'Bram Ostrander', callSign: 'QB2COR', role: 'coordinator' },
  { email: 'hunter@example.test', name: 'Cleo Marchetti', callSign: 'QC3HNT', role: 'hunter' },
  { email: 'member@example.test', name: 'Dov Pellinger', callSign: 'QD4MEM', role: 'member' },
] as const;

export async function seedDemo(trx: Knex): Promise<void> {
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
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

  const open = await insertCase(trx, {
    title: 'Rasping hash on 80 m and 40 m in the evenings',
    description: 'A rough buzz with 100 Hz spacing covers 3.5–3.8 MHz and most of 40 m from about 18:00 to 23:00, S7 on the meter. Started in spring.',
    reporterId: ids.member,
    reportedLat: DEMO_CENTRE.lat + 0.004,
    reportedLon: DEMO_CENTRE.lon - 0.006,
    bands: ['80m', '40m'],
    assigneeId: ids.hunter,
  });
  await appendEvent(trx, { caseId: open.id, actorId: ids.member, kind: 'reported', data: { title: open.title } });
  await appendEvent(trx, { caseId: open.id, actorId: ids.coordinator, kind: 'assigned', data: { assigneeId: ids.hunter } });

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
  await appendEvent(trx, { caseId: located.id, actorId: ids.member, kind: 'reported', data: { title: located.title } });
  await appendEvent(trx, { caseId: located.id, actorId: ids.hunter, kind: 'status-changed', data: { from: 'open', to: 'located', why: 'premises confirmed on foot' } });

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
  await appendEvent(trx, { caseId: resolved.id, actorId: ids.coordinator, kind: 'reported', data: { title: resolved.title } });
  await appendEvent(trx, {
    caseId: resolved.id,
    actorId: ids.coordinator,
    kind: 'status-changed',
    data: { from: 'notified', to: 'resolved', outcome: 'fixed-by-owner', levelBeforeDbm: -85, levelAfterDbm: -103 },
  });
}
