import type { Knex } from 'knex';
import { db } from './index';
import type { Role } from './types';

/**
 * Invitation and reset links (table user_tokens). A link is derived from the row's id and
 * nonce with the server secret (lib/auth/tokens.ts); the row stores the nonce and the link's
 * SHA-256, never the link itself.
 */
export type UserToken = {
  id: string;
  purpose: 'invite' | 'reset';
  email: string;
  name: string | null;
  role: Role | null;
  userId: string | null;
  nonce: string | null;
  usedAt: Date | null;
  expiresAt: Date;
};

const COLUMNS = {
  id: 'id',
  purpose: 'purpose',
  email: 'email',
  name: 'name',
  role: 'role',
  userId: 'user_id',
  nonce: 'nonce',
  usedAt: 'used_at',
  expiresAt: 'expires_at',
} as const;

export async function insertUserToken(
  trx: Knex,
  t: { id: string; purpose: 'invite' | 'reset'; tokenHash: string; nonce: string; email: string; name?: string; role?: Role; userId?: string; createdBy?: string; ttlHours: number },
): Promise<void> {
  await trx('user_tokens').insert({
    id: t.id,
    purpose: t.purpose,
    token_hash: t.tokenHash,
    nonce: t.nonce,
    email: t.email,
    name: t.name ?? null,
    role: t.role ?? null,
    user_id: t.userId ?? null,
    created_by: t.createdBy ?? null,
    expires_at: trx.raw(`now() + (? * interval '1 hour')`, [t.ttlHours]),
  });
}

/** Retires every open reset link of an account (a newer one was asked for, or the password changed). */
export async function retireResetTokens(trx: Knex, userId: string): Promise<number> {
  return trx('user_tokens').where({ purpose: 'reset', user_id: userId }).whereNull('used_at').update({ used_at: trx.fn.now() });
}

/** Retires every open invitation to an address (a newer one replaces it). */
export async function retireInvitations(trx: Knex, email: string): Promise<number> {
  return trx('user_tokens').where({ purpose: 'invite' }).whereRaw('lower(email) = lower(?)', [email]).whereNull('used_at').update({ used_at: trx.fn.now() });
}

/** An unused, unexpired link by the hash of its token; `lock` takes the row for the redeeming transaction. */
export async function findOpenToken(q: Knex, tokenHash: string, lock = false): Promise<UserToken | undefined> {
  const b = q('user_tokens').select(COLUMNS).where({ token_hash: tokenHash }).whereNull('used_at').andWhere('expires_at', '>', q.fn.now());
  return (lock ? b.forUpdate() : b).first();
}

export async function markTokenUsed(trx: Knex, id: string): Promise<void> {
  await trx('user_tokens').where({ id }).update({ used_at: trx.fn.now() });
}

/** The link row behind an account e-mail, open or not (the worker skips a retired one). */
export async function getUserToken(id: string, q: Knex = db): Promise<UserToken | undefined> {
  return q('user_tokens').select(COLUMNS).where({ id }).first();
}
