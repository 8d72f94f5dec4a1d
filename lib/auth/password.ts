import bcrypt from 'bcryptjs';

/** bcrypt cost of every stored password (2^11 rounds, about 100 ms here). */
export const BCRYPT_ROUNDS = 11;

/**
 * A bcrypt hash of a random string nobody knows, at BCRYPT_ROUNDS. Checking a password against
 * it costs the same as checking a real one, so an answer for an unknown address (or an account
 * without a password, or a deactivated one) takes as long as a wrong password for a real account.
 */
export const DUMMY_HASH = '$2b$11$hwO8rJOKdN.GTHbKWq/7AuboqhJguNw0n0PAhK0FtNIyAPTGgq0FK';

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_ROUNDS);

/**
 * Always does one bcrypt comparison: against `hash` when the account may sign in, against
 * DUMMY_HASH otherwise (and then the answer is false whatever the password).
 */
export async function verifyPassword(password: string, hash: string | null | undefined, allowed: boolean): Promise<boolean> {
  const usable = allowed && !!hash;
  const ok = await bcrypt.compare(password, usable ? hash : DUMMY_HASH);
  return usable && ok;
}
