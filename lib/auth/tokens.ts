import { createHash, randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import { db, inTransaction } from '@/db';
import { createUser, getUserByEmail, setPassword } from '@/db/users';
import type { Role, User } from '@/db/types';
import { conflict, notFound } from '@/lib/errors';

export const TOKEN_TTL_HOURS = 72;
export const BCRYPT_ROUNDS = 11;

/** 256 random bits, URL-safe; only the SHA-256 of it is stored. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}
export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

export async function createInvitation(trx: Knex, p: { email: string; name: string; role: Role; createdBy: string }): Promise<string> {
  if (await getUserByEmail(p.email, trx)) throw conflict('Someone with this e-mail address already has an account.');
  const { token, hash } = newToken();
  // A new invitation replaces any earlier unused one for the same address.
  await trx('user_tokens').where({ purpose: 'invite', email: p.email }).whereNull('used_at').update({ used_at: trx.fn.now() });
  await trx('user_tokens').insert({
    purpose: 'invite',
    token_hash: hash,
    email: p.email,
    name: p.name,
    role: p.role,
    created_by: p.createdBy,
    expires_at: trx.raw(`now() + interval '${TOKEN_TTL_HOURS} hours'`),
  });
  return token;
}

export async function createPasswordReset(trx: Knex, user: User): Promise<string> {
  const { token, hash } = newToken();
  await trx('user_tokens').insert({
    purpose: 'reset',
    token_hash: hash,
    email: user.email,
    user_id: user.id,
    expires_at: trx.raw(`now() + interval '${TOKEN_TTL_HOURS} hours'`),
  });
  return token;
}

type TokenRow = { id: string; purpose: 'invite' | 'reset'; email: string; name: string | null; role: Role | null; user_id: string | null };

/** What a valid, unused, unexpired token is for; a wrong, used or expired one is a plain 404. */
export async function peekToken(token: string, q: Knex = db): Promise<TokenRow> {
  const row = await q('user_tokens')
    .select('id', 'purpose', 'email', 'name', 'role', 'user_id')
    .where({ token_hash: hashToken(token) })
    .whereNull('used_at')
    .andWhere('expires_at', '>', q.fn.now())
    .first();
  if (!row) throw notFound('This link is not valid any more. Ask for a new one.');
  return row;
}

/** Sets the password (creating the invited account) and burns the token, in one transaction. */
export async function redeemToken(token: string, password: string): Promise<{ email: string }> {
  const passwordHash = await bcrypt.hash(password, BCRYPT_ROUNDS);
  return inTransaction(async (trx) => {
    const row = await peekToken(token, trx);
    // Lock the row so two simultaneous uses cannot both succeed.
    const locked = await trx('user_tokens').where({ id: row.id }).whereNull('used_at').forUpdate().first('id');
    if (!locked) throw notFound('This link is not valid any more. Ask for a new one.');
    await trx('user_tokens').where({ id: row.id }).update({ used_at: trx.fn.now() });
    if (row.purpose === 'invite') {
      if (await getUserByEmail(row.email, trx)) throw conflict('This account already exists: sign in or reset the password.');
      await createUser(trx, { email: row.email, name: row.name ?? row.email, role: row.role ?? 'member', passwordHash });
    } else {
      await setPassword(trx, row.user_id!, passwordHash);
    }
    return { email: row.email };
  });
}
