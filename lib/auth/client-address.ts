import { isIP } from 'node:net';

/**
 * Which address a request came from, for the per-client limits. Pure: no env, no I/O.
 *
 * The socket address is the only one a client cannot choose. Next's own server does not hand
 * it to route handlers: it copies it into `x-forwarded-for` only when the client sent no such
 * header (`??=` in next/dist/server/base-server.js), so that header is whatever the client
 * says. scripts/serve.ts (how `npm start` and `npm test` run the app) therefore writes the
 * socket address into PEER_HEADER on every request, replacing anything the client sent.
 *
 * `x-forwarded-for` is read only when TRUSTED_PROXY says so, and then only its right-most
 * entry: the hop our proxy appended. Everything left of it was written by the client.
 */
export const PEER_HEADER = 'x-quietfix-peer';

/** TRUSTED_PROXY: unset/'' (no proxy, use the socket), 'any' (every peer is our proxy), or a list of proxy addresses. */
export type TrustedProxy = { mode: 'none' } | { mode: 'any' } | { mode: 'list'; addresses: string[] };

export function parseTrustedProxy(raw: string | undefined): TrustedProxy {
  const v = (raw ?? '').trim();
  if (v === '' || v === 'false' || v === 'none') return { mode: 'none' };
  if (v === 'any' || v === 'true') return { mode: 'any' };
  const addresses = v.split(',').map((s) => normaliseAddress(s.trim()));
  if (addresses.some((a) => a === undefined)) throw new Error('TRUSTED_PROXY: use "any", or a comma-separated list of IP addresses.');
  return { mode: 'list', addresses: addresses as string[] };
}

/** An IP address in one spelling (IPv4-mapped IPv6 becomes plain IPv4); undefined if not an address. */
export function normaliseAddress(raw: string | undefined | null): string | undefined {
  if (!raw) return undefined;
  let a = raw.trim();
  if (a.startsWith('[') && a.includes(']')) a = a.slice(1, a.indexOf(']'));
  if (a.toLowerCase().startsWith('::ffff:') && isIP(a.slice(7)) === 4) a = a.slice(7);
  if (!isIP(a)) return undefined;
  return a.toLowerCase();
}

type HeaderSource = Headers | Record<string, string | string[] | undefined>;
const read = (h: HeaderSource, name: string): string | undefined => {
  const v = h instanceof Headers ? h.get(name) : h[name];
  return (Array.isArray(v) ? v.join(',') : v) ?? undefined;
};

/**
 * The client's address: the socket peer, or (when that peer is a trusted proxy) the right-most
 * `x-forwarded-for` entry. 'unknown' when the app runs without scripts/serve.ts and no proxy is
 * trusted: all such requests share one counter, which is safe (nobody can reset it) if coarse.
 */
export function clientAddress(headers: HeaderSource, trusted: TrustedProxy): string {
  const peer = normaliseAddress(read(headers, PEER_HEADER));
  if (trusted.mode === 'none') return peer ?? 'unknown';
  const peerIsProxy = trusted.mode === 'any' || (peer !== undefined && trusted.addresses.includes(peer));
  if (!peerIsProxy) return peer ?? 'unknown';
  const hops = (read(headers, 'x-forwarded-for') ?? '').split(',');
  return normaliseAddress(hops[hops.length - 1]) ?? peer ?? 'unknown';
}
