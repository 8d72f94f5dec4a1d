import { clearLimit, currentHits, hitLimits, refundHit } from '@/db/auth-limits';
import { env } from '@/lib/env';
import { clientAddress } from './client-address';

/**
 * Limits on sign-in attempts and reset requests, per e-mail address and per client, counted in
 * PostgreSQL (db/auth-limits.ts) so they hold across restarts and app instances.
 *
 * Sign-in counts every attempt *before* the password is checked, in one atomic upsert: of n
 * parallel attempts only those whose count is within the limit reach bcrypt; the rest are refused
 * at once. A success takes its attempt back (so a shared client is not locked by good sign-ins)
 * and clears the address's counter. A locked address stays recoverable: a successful reset
 * clears its counter (lib/auth/tokens.ts). The figures are ours: common practice, no source.
 */
export const THROTTLE = {
  windowMinutes: 15,
  maxPerEmail: 8,
  maxPerClient: 30,
  /** failures before answers start to slow down */
  freeFailures: 2,
  stepMs: 300,
  maxDelayMs: 2500,
} as const;

/** Reset requests: a few per address, more per client (a household or office shares one). */
export const RESET_LIMITS = { windowMinutes: 60, maxPerEmail: 3, maxPerClient: 10 } as const;

// Bounded: the key is written to the database whatever the client sent.
const norm = (email: string) => email.trim().toLowerCase().slice(0, 320);
export const signInEmailKey = (email: string) => `signin-email:${norm(email)}`;
export const signInClientKey = (client: string) => `signin-client:${client}`;
const resetEmailKey = (email: string) => `reset-email:${norm(email)}`;
const resetClientKey = (client: string) => `reset-client:${client}`;

/** The client address of a request under this deployment's TRUSTED_PROXY setting. */
export const clientOf = (headers: Parameters<typeof clientAddress>[0]) => clientAddress(headers, env.TRUSTED_PROXY);

export type LimitVerdict = { blocked: boolean; retryAfterS: number; hits: number };

function verdict(hits: { hits: number; retryAfterS: number }[], limits: number[]): LimitVerdict {
  const over = hits.filter((h, i) => h.hits > limits[i]);
  return {
    blocked: over.length > 0,
    retryAfterS: over.length ? Math.max(...over.map((h) => h.retryAfterS)) : 0,
    hits: Math.max(...hits.map((h) => h.hits)),
  };
}

/** Counts one sign-in attempt for the address and the client; blocked: refuse without checking the password. */
export async function countSignInAttempt(email: string, client: string): Promise<LimitVerdict> {
  const hits = await hitLimits([signInEmailKey(email), signInClientKey(client)], THROTTLE.windowMinutes);
  return verdict(hits, [THROTTLE.maxPerEmail, THROTTLE.maxPerClient]);
}

/** How long to hold back the answer to a failed sign-in, from the attempts counted so far. */
export const failureDelayMs = (hits: number) => Math.min(THROTTLE.maxDelayMs, Math.max(0, hits - THROTTLE.freeFailures) * THROTTLE.stepMs);

/** The attempts counted so far in this window (the worse of the two keys). */
export async function signInHits(email: string, client: string): Promise<number> {
  const [e, c] = await Promise.all([currentHits(signInEmailKey(email), THROTTLE.windowMinutes), currentHits(signInClientKey(client), THROTTLE.windowMinutes)]);
  return Math.max(e, c);
}

/** A good sign-in: the address starts afresh and the client gets its attempt back. */
export async function signInSucceeded(email: string, client: string): Promise<void> {
  await Promise.all([clearLimit(signInEmailKey(email)), refundHit(signInClientKey(client))]);
}

/** Lifts the sign-in lock of an address (after its owner proved control of the mailbox). */
export const clearSignInLock = (email: string) => clearLimit(signInEmailKey(email));

/** Counts one reset request for the address and the client (known or not: the count itself reveals nothing). */
export async function countResetRequest(email: string, client: string): Promise<LimitVerdict> {
  const hits = await hitLimits([resetEmailKey(email), resetClientKey(client)], RESET_LIMITS.windowMinutes);
  return verdict(hits, [RESET_LIMITS.maxPerEmail, RESET_LIMITS.maxPerClient]);
}
