import { describe, expect, it } from 'vitest';
import bcrypt from 'bcryptjs';
import { BCRYPT_ROUNDS, DUMMY_HASH, hashPassword, verifyPassword } from '@/lib/auth/password';

describe('verifyPassword', () => {
  it('the dummy hash has the cost of real ones, so an unknown address costs one real comparison', async () => {
    expect(bcrypt.getRounds(DUMMY_HASH)).toBe(BCRYPT_ROUNDS);
    expect(bcrypt.getRounds(await hashPassword('a quiet band'))).toBe(BCRYPT_ROUNDS);
  });

  it('accepts the right password of an allowed account only', async () => {
    const hash = await hashPassword('a quiet band');
    expect(await verifyPassword('a quiet band', hash, true)).toBe(true);
    expect(await verifyPassword('a noisy band', hash, true)).toBe(false);
    expect(await verifyPassword('a quiet band', hash, false)).toBe(false); // deactivated
    expect(await verifyPassword('a quiet band', null, true)).toBe(false); // no password yet
    expect(await verifyPassword('', undefined, true)).toBe(false);
  });
});
