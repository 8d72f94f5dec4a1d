/**
 * Which address a request counts against. The rule is ours, following how X-Forwarded-For is
 * built: each proxy appends the address it received the request from, so only the right-most
 * entry, the one our own proxy appended, is not the client's word (RFC 7239 section 5.2
 * describes the same append-per-hop rule for its Forwarded header; X-Forwarded-For is the
 * de-facto form of it: common practice).
 */
import { describe, expect, it } from 'vitest';
import { PEER_HEADER, clientAddress, normaliseAddress, parseTrustedProxy } from '@/lib/auth/client-address';

const none = parseTrustedProxy(undefined);
const any = parseTrustedProxy('any');
const list = parseTrustedProxy('10.0.0.5, 10.0.0.6');

describe('clientAddress', () => {
  it.each([
    // [trusted, peer, x-forwarded-for, expected]
    ['none', '192.0.2.10', undefined, '192.0.2.10'],
    ['none', '192.0.2.10', '198.51.100.1', '192.0.2.10'], // a client-sent header changes nothing
    ['none', '192.0.2.10', '198.51.100.1, 198.51.100.2', '192.0.2.10'],
    ['none', '::ffff:192.0.2.10', undefined, '192.0.2.10'], // IPv4-mapped IPv6: one spelling
    ['none', undefined, '198.51.100.1', 'unknown'], // not behind scripts/serve.ts: one shared counter
    ['list', '10.0.0.5', '198.51.100.1', '198.51.100.1'],
    ['list', '10.0.0.5', 'forged-by-client, 203.0.113.7', '203.0.113.7'], // only the hop our proxy added
    ['list', '10.0.0.5', '198.51.100.1, 203.0.113.7', '203.0.113.7'],
    ['list', '10.0.0.6', ' 203.0.113.8 ', '203.0.113.8'],
    ['list', '192.0.2.10', '198.51.100.1', '192.0.2.10'], // the peer is not our proxy: its header is ignored
    ['list', '10.0.0.5', 'not-an-address', '10.0.0.5'], // garbage from the proxy: fall back to the peer
    ['list', '10.0.0.5', undefined, '10.0.0.5'],
    ['any', undefined, '198.51.100.1, 203.0.113.9', '203.0.113.9'],
    ['any', '10.1.1.1', '[2001:db8::1]', '2001:db8::1'],
  ] as const)('%s proxy, peer %s, x-forwarded-for %s -> %s', (mode, peer, xff, expected) => {
    const trusted = { none, any, list }[mode];
    const headers = new Headers();
    if (peer) headers.set(PEER_HEADER, peer);
    if (xff) headers.set('x-forwarded-for', xff);
    expect(clientAddress(headers, trusted)).toBe(expected);
    // next-auth hands authorize() the headers as a plain object: same answer.
    expect(clientAddress(Object.fromEntries(headers), trusted)).toBe(expected);
  });

  it('changing X-Forwarded-For does not change the key without a trusted proxy', () => {
    const keys = new Set(Array.from({ length: 20 }, (_, i) => clientAddress(new Headers({ [PEER_HEADER]: '192.0.2.33', 'x-forwarded-for': `198.51.100.${i}` }), none)));
    expect([...keys]).toEqual(['192.0.2.33']);
  });
});

describe('parseTrustedProxy', () => {
  it.each([
    [undefined, { mode: 'none' }],
    ['', { mode: 'none' }],
    ['false', { mode: 'none' }],
    ['any', { mode: 'any' }],
    ['true', { mode: 'any' }],
    ['127.0.0.9', { mode: 'list', addresses: ['127.0.0.9'] }],
    ['10.0.0.5,::ffff:10.0.0.6', { mode: 'list', addresses: ['10.0.0.5', '10.0.0.6'] }],
  ])('%s', (raw, expected) => expect(parseTrustedProxy(raw)).toEqual(expected));

  it('refuses what is not an address', () => {
    expect(() => parseTrustedProxy('proxy.example.test')).toThrow(/TRUSTED_PROXY/);
    expect(() => parseTrustedProxy('10.0.0.5,')).toThrow(/TRUSTED_PROXY/);
  });
});

describe('normaliseAddress', () => {
  it.each([
    ['192.0.2.1', '192.0.2.1'],
    ['::FFFF:192.0.2.1', '192.0.2.1'],
    ['2001:DB8::1', '2001:db8::1'],
    ['[2001:db8::1]:443', '2001:db8::1'],
    ['', undefined],
    ['300.1.1.1', undefined],
    ['unknown', undefined],
  ])('%s -> %s', (raw, expected) => expect(normaliseAddress(raw)).toBe(expected));
});
