import { randomBytes, randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { db, inTransaction } from '@/db';
import { createUser, getCredentials, getUserByEmail, setPassword } from '@/db/users';
import { findOpenToken, insertUserToken, markTokenUsed, retireInvitations, retireResetTokens, type UserToken } from '@/db/user-tokens';
import type { Role, User } from '@/db/types';
import { badRequest, conflict, notFound } from '@/lib/errors';
import { invitationMail, passwordResetMail } from '@/lib/mail/account-messages';
import { queueAccountMail } from './account-mail';
import { deriveAccountToken, hashToken } from './account-link';
import { hashPassword, verifyPassword } from './password';
import { clearSignInLock } from './throttle';

export const TOKEN_TTL_HOURS = 72;
export { BCRYPT_ROUNDS } from './password';
export { hashToken } from './account-link';

async function newAccountToken(trx: Knex, t: Omit<Parameters<typeof insertUserToken>[1], 'id' | 'tokenHash' | 'nonce' | 'ttlHours'>) {
  const id = randomUUID();
  const nonce = randomBytes(32).toString('base64url');
  await insertUserToken(trx, { ...t, id, nonce, tokenHash: hashToken(deriveAccountToken(id, nonce)), ttlHours: TOKEN_TTL_HOURS });
  return id;
}

/** Stores an invitation (replacing any earlier open one to the address) and queues its e-mail, in the caller's transaction. */
export async function createInvitation(
  trx: Knex,
  p: { email: string; name: string; role: Role; createdBy: string; inviterName: string; clubName: string },
): Promise<void> {
  if (await getUserByEmail(p.email, trx)) throw conflict('Someone with this e-mail address already has an account.');
  await retireInvitations(trx, p.email);
  const id = await newAccountToken(trx, { purpose: 'invite', email: p.email, name: p.name, role: p.role, createdBy: p.createdBy });
  const mail = { name: p.name, clubName: p.clubName, inviterName: p.inviterName, role: p.role };
  await queueAccountMail(trx, { tokenId: id, to: p.email, mail: (link) => invitationMail({ ...mail, link }) });
}

/**
 * A reset for an active account: every older reset link of the account is retired, a new one
 * stored and its e-mail queued, in one transaction. Unknown or inactive addresses: nothing is
 * written (the caller answers the same either way).
 */
export async function requestPasswordReset(email: string, q: Knex = db): Promise<void> {
  const user = await getUserByEmail(email, q);
  if (!user?.active) return;
  await q.transaction(async (trx) => {
    await retireResetTokens(trx, user.id);
    const id = await newAccountToken(trx, { purpose: 'reset', email: user.email, userId: user.id });
    await queueAccountMail(trx, { tokenId: id, to: user.email, mail: (link) => passwordResetMail({ name: user.name, link }) });
  });
}

const goneLink = () => notFound('This link is not valid any more. Ask for a new one.');

/** What a valid, unused, unexpired link is for; a wrong, used, retired or expired one is a plain 404. */
export async function peekToken(token: string, q: Knex = db): Promise<UserToken> {
  const row = await findOpenToken(q, hashToken(token));
  if (!row) throw goneLink();
  return row;
}

/**
 * Sets the password from a link and burns it, in one transaction. A reset also retires every
 * other open reset link of the account, ends its sessions (setPassword bumps the session
 * version) and lifts its sign-in lock, so the owner of a locked account gets back in.
 */
export async function redeemToken(token: string, password: string): Promise<{ email: string }> {
  const passwordHash = await hashPassword(password);
  const { email, purpose } = await inTransaction(async (trx) => {
    // Locked, so two simultaneous uses cannot both succeed.
    const row = await findOpenToken(trx, hashToken(token), true);
    if (!row) throw goneLink();
    await markTokenUsed(trx, row.id);
    if (row.purpose === 'invite') {
      if (await getUserByEmail(row.email, trx)) throw conflict('This account already exists: sign in or reset the password.');
      await createUser(trx, { email: row.email, name: row.name ?? row.email, role: row.role ?? 'member', passwordHash });
    } else {
      await setPassword(trx, row.userId!, passwordHash);
      await retireResetTokens(trx, row.userId!);
    }
    return { email: row.email, purpose: row.purpose };
  });
  if (purpose === 'reset') await clearSignInLock(email);
  return { email };
}

/**
 * A signed-in user changes their own password: the current one must match. Every session of the
 * account ends (this one too: sign in again with the new password) and open reset links retire.
 */
export async function changePassword(me: User, current: string, next: string): Promise<void> {
  const cred = await getCredentials(me.email);
  if (!(await verifyPassword(current, cred?.passwordHash, !!cred?.active))) {
    throw badRequest('The current password is not right.', { issues: [{ path: 'current', message: 'This is not your current password.', code: 'custom' }] });
  }
  const passwordHash = await hashPassword(next);
  await inTransaction(async (trx) => {
    await setPassword(trx, me.id, passwordHash);
    await retireResetTokens(trx, me.id);
  });
}
