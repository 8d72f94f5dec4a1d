/**
 * Pure rules the notices and the error mapping rest on: the household key, the outbox's backoff
 * (exponential with a cap: common practice, no source) and what counts as "database unavailable"
 * (node's errno names and PostgreSQL's SQLSTATE classes 08 and 57P, PostgreSQL 15 manual, Appendix A).
 */
import { describe, expect, it } from 'vitest';
import { addressKey } from '@/lib/notices/address-key';
import { backoffMs } from '@/lib/notices/backoff';
import { isDatabaseUnavailable } from '@/lib/errors';

describe('addressKey', () => {
  it.each([
    ['12 Mill Lane,  Quillon', '12 mill lane quillon'],
    ['12 mill lane quillon', '12 mill lane quillon'],
    ['12 MILL LANE\nQuillon', '12 mill lane quillon'],
    ['  Flat 3, 7 Ösel Road ', 'flat 3 7 osel road'],
    ['Rue de l’Église 4', 'rue de l eglise 4'],
    ['---', ''],
  ])('%j -> %j', (address, key) => expect(addressKey(address)).toBe(key));

  it('tells different houses apart', () => {
    expect(addressKey('12 Mill Lane')).not.toBe(addressKey('21 Mill Lane'));
  });
});

describe('backoffMs', () => {
  it.each([
    [1, 5000],
    [2, 10_000],
    [3, 20_000],
    [4, 40_000],
    [8, 640_000],
    [9, 900_000], // capped
    [30, 900_000],
    [0, 5000], // before any failure: the base
  ])('after %i failed tries waits %i ms (base 5 s, cap 15 min)', (attempts, ms) => expect(backoffMs(attempts, 5000, 900_000)).toBe(ms));
});

describe('isDatabaseUnavailable', () => {
  const cases: [string, unknown, boolean][] = [
    ['connection refused', Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:5432'), { code: 'ECONNREFUSED' }), true],
    ['reset', { code: 'ECONNRESET' }, true],
    ['admin shutdown (57P01)', { code: '57P01', message: 'terminating connection due to administrator command' }, true],
    ['cannot connect now (57P03)', { code: '57P03' }, true],
    ['connection failure (08006)', { code: '08006' }, true],
    ['pool timeout', { name: 'KnexTimeoutError', message: 'Knex: Timeout acquiring a connection.' }, true],
    ['terminated by message only', new Error('Connection terminated unexpectedly'), true],
    ['IPv4 and IPv6 both refused', Object.assign(new AggregateError([{ code: 'ECONNREFUSED' }, { code: 'ECONNREFUSED' }]), {}), true],
    ['unique violation (23505)', { code: '23505', message: 'duplicate key value' }, false],
    ['syntax error (42601)', { code: '42601' }, false],
    ['a plain bug', new TypeError("Cannot read properties of undefined (reading 'id')"), false],
    ['nothing', undefined, false],
    ['a string', 'ECONNREFUSED', false],
    ['an aggregate of other errors', new AggregateError([new Error('x')]), false],
  ];
  it.each(cases)('%s -> %s', (_name, err, down) => expect(isDatabaseUnavailable(err)).toBe(down));
});
