import type { Knex } from 'knex';
import { db } from './index';
import type { Role, User } from './types';
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

/** Only for sign-in: the hash never leaves db/ otherwise. */
export async function getCredentials(email: string): Promise<(User & { passwordHash: string | null }) | undefined> {
  return db('users').select({ ...COLUMNS, passwordHash: 'password_hash' }).whereRaw('lower(email) = lower(?)', [email]).first();
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

export async function setPassword(trx: Knex, id: string, passwordHash: string): Promise<void> {
  await trx('users').where({ id }).update({ password_hash: passwordHash, updated_at: trx.fn.now() });
}

export async function countActiveAdmins(trx: Knex = db): Promise<number> {
  const [{ count }] = await trx('users').where({ role: 'admin', active: true }).count<{ count: string }[]>({ count: '*' });
  return Number(count);
}
