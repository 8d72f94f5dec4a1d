import type { Knex } from 'knex';
import { db } from './index';
import { revisionColumn } from './revisions';
import type { Profile, Role, User } from './types';
import type { Page, Paging } from '@/lib/api/paging';

const COLUMNS = {
  id: 'id',
  email: 'email',
  name: 'name',
  callSign: 'call_sign',
  role: 'role',
  active: 'active',
  createdAt: 'created_at',
  updatedAt: 'updated_at',
} as const;
const RETURNING = Object.entries(COLUMNS).map(([k, c]) => `${c} as ${k}`);

export async function getUserById(id: string, q: Knex = db): Promise<User | undefined> {
  return q('users').select(COLUMNS).where({ id }).first();
}

export async function getUserByEmail(email: string, q: Knex = db): Promise<User | undefined> {
  return q('users').select(COLUMNS).whereRaw('lower(email) = lower(?)', [email]).first();
}

/** A user with the session version their sessions must carry (lib/auth/session.ts). */
export type SessionUser = User & { sessionVersion: number };

export async function getSessionUser(id: string, q: Knex = db): Promise<SessionUser | undefined> {
  return q('users').select({ ...COLUMNS, sessionVersion: 'session_version' }).where({ id }).first();
}

/** The same, with the committed revision of the case lists read in the same query (db/revisions.ts). */
export async function getSessionUserAndCasesRevision(id: string, q: Knex = db): Promise<(SessionUser & { casesRevision: string }) | undefined> {
  return q('users').select({ ...COLUMNS, sessionVersion: 'session_version' }, revisionColumn('cases', 'casesRevision', q)).where({ id }).first();
}

/** Only for sign-in and password changes: the hash never leaves db/ otherwise. */
export async function getCredentials(email: string, q: Knex = db): Promise<(SessionUser & { passwordHash: string | null }) | undefined> {
  return q('users')
    .select({ ...COLUMNS, sessionVersion: 'session_version', passwordHash: 'password_hash' })
    .whereRaw('lower(email) = lower(?)', [email])
    .first();
}

export async function listUsers(paging: Paging): Promise<Page<User>> {
  const [{ count }] = await db('users').count<{ count: string }[]>({ count: '*' });
  const items = await db('users')
    .select(COLUMNS)
    .orderBy([{ column: 'active', order: 'desc' }, { column: 'name' }])
    .limit(paging.pageSize)
    .offset((paging.page - 1) * paging.pageSize);
  return { items, total: Number(count), ...paging };
}

export async function createUser(
  trx: Knex,
  u: { email: string; name: string; role: Role; passwordHash: string; callSign?: string | null },
): Promise<User> {
  const [row] = await trx('users')
    .insert({ email: u.email.toLowerCase(), name: u.name, role: u.role, password_hash: u.passwordHash, call_sign: u.callSign ?? null })
    .returning(RETURNING);
  return row;
}

export async function updateUser(trx: Knex, id: string, patch: { role?: Role; active?: boolean; name?: string; callSign?: string | null }): Promise<User | undefined> {
  const cols: Record<string, unknown> = { updated_at: trx.fn.now() };
  if (patch.role !== undefined) cols.role = patch.role;
  if (patch.active !== undefined) cols.active = patch.active;
  if (patch.name !== undefined) cols.name = patch.name;
  if (patch.callSign !== undefined) cols.call_sign = patch.callSign;
  const [row] = await trx('users').where({ id }).update(cols).returning(RETURNING);
  return row;
}

/**
 * Sets a new password and ends every existing session of the account: the session version
 * goes up, and requireUser refuses a session that carries an older one.
 */
export async function setPassword(trx: Knex, id: string, passwordHash: string): Promise<void> {
  await trx('users')
    .where({ id })
    .update({ password_hash: passwordHash, session_version: trx.raw('session_version + 1'), updated_at: trx.fn.now() });
}

export async function countActiveAdmins(trx: Knex = db): Promise<number> {
  const [{ count }] = await trx('users').where({ role: 'admin', active: true }).count<{ count: string }[]>({ count: '*' });
  return Number(count);
}

const PROFILE_COLUMNS = {
  name: 'name',
  email: 'email',
  callSign: 'call_sign',
  role: 'role',
  loopShape: 'loop_shape',
  loopSizeM: 'loop_size_m',
  loopCircumferenceM: 'loop_circumference_m',
  sMeterOffsetDb: 's_meter_offset_db',
  bearingReference: 'bearing_reference',
} as const;

export async function getProfile(id: string, q: Knex = db): Promise<Profile | undefined> {
  return q('users').select(PROFILE_COLUMNS).where({ id }).first();
}

/** Writes the profile fields given; an undefined field keeps its value (knex leaves undefined out of the update). */
export async function updateProfile(
  trx: Knex,
  id: string,
  p: Partial<Omit<Profile, 'email' | 'role'>>,
): Promise<void> {
  await trx('users').where({ id }).update({
    name: p.name,
    call_sign: p.callSign,
    loop_shape: p.loopShape,
    loop_size_m: p.loopSizeM,
    loop_circumference_m: p.loopCircumferenceM,
    s_meter_offset_db: p.sMeterOffsetDb,
    bearing_reference: p.bearingReference,
    updated_at: trx.fn.now(),
  });
}

/** Loop circumference (metres) per author, for the loop-size warning. */
export async function loopCircumferences(ids: string[], q: Knex = db): Promise<Map<string, number>> {
  if (ids.length === 0) return new Map();
  const rows: { id: string; c: number | null }[] = await q('users').select({ id: 'id', c: 'loop_circumference_m' }).whereIn('id', ids);
  return new Map(rows.filter((r) => r.c !== null).map((r) => [r.id, r.c as number]));
}

export async function listActiveHunters(): Promise<{ id: string; name: string; callSign: string | null }[]> {
  return db('users').select({ id: 'id', name: 'name', callSign: 'call_sign' }).where({ active: true }).whereIn('role', ['hunter', 'coordinator', 'admin']).orderBy('name');
}

/** A user's row locked for a role change, with what the last-admin rule needs. */
export async function lockUserForChange(trx: Knex.Transaction, id: string): Promise<Pick<User, 'id' | 'role' | 'active'> | undefined> {
  return trx('users').where({ id }).forUpdate().first('id', 'role', 'active');
}

/** Serialises changes that could remove an admin, so two admins cannot demote each other at once. */
export async function lockAdminChanges(trx: Knex.Transaction): Promise<void> {
  await trx.raw('select pg_advisory_xact_lock(4711)');
}
