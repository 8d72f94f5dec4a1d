import { NextResponse, type NextRequest } from 'next/server';
import { allowedOrigins, appIsHttps } from '@/lib/env';
import { badRequest, payloadTooLarge, toErrorBody } from '@/lib/errors';
import { assertBodyKind, assertSameOrigin, type BodyKind } from './request-guard';
import { apiSecurityHeaders } from './security-headers';

export type RouteContext<P = Record<string, string>> = { params: Promise<P> };
type Handler<P> = (req: NextRequest, ctx: RouteContext<P>) => Promise<Response>;

export type RouteOptions = {
  /** What the body is (default `json`): a route that reads a form or a file says so here. */
  body?: BodyKind;
  /**
   * The route checks a CSRF token of its own (next-auth's endpoints): a request with neither
   * Origin nor Referer goes on to that check instead of a 403. A foreign Origin is still refused.
   */
  ownCsrfToken?: boolean;
  /** Cache-Control of a successful answer when the route sets none (default `no-store`: answers carry personal data). */
  cache?: string;
};

/**
 * Wraps a route handler: refuses cross-site state-changing requests (403) and bodies of the
 * wrong kind (415) before anything else runs, answers `Cache-Control: no-store` unless told
 * otherwise, and sends every error through the one mapping in lib/errors.ts.
 * Order inside a handler: params -> who is asking and may they -> body -> write -> status.
 */
export function route<P = Record<string, string>>(fn: Handler<P>): Handler<P>;
export function route<P = Record<string, string>>(options: RouteOptions, fn: Handler<P>): Handler<P>;
export function route<P = Record<string, string>>(a: RouteOptions | Handler<P>, b?: Handler<P>): Handler<P> {
  const options: RouteOptions = typeof a === 'function' ? {} : a;
  const fn = typeof a === 'function' ? a : b!;
  const cache = options.cache ?? 'no-store';
  return async (req, ctx) => {
    let res: Response;
    try {
      assertSameOrigin(req, allowedOrigins, { ownToken: options.ownCsrfToken });
      assertBodyKind(req, options.body ?? 'json');
      res = await fn(req, ctx);
    } catch (err) {
      const { status, body } = toErrorBody(err, `${req.method} ${req.nextUrl.pathname}`);
      const headers: Record<string, string> = {};
      if (status === 429 && typeof body.retryAfterS === 'number') headers['Retry-After'] = String(body.retryAfterS);
      res = NextResponse.json(body, { status, headers });
    }
    return withDefaults(res, { 'cache-control': cache, ...apiSecurityHeaders(req.nextUrl.pathname, appIsHttps) });
  };
}

/** Sets each header the answer does not carry yet; an immutable Response (e.g. Response.redirect) is copied. */
function withDefaults(res: Response, defaults: Record<string, string>): Response {
  const missing = Object.entries(defaults).filter(([k]) => !res.headers.has(k));
  try {
    for (const [k, v] of missing) res.headers.set(k, v);
    return res;
  } catch {
    const headers = new Headers(res.headers);
    for (const [k, v] of missing) headers.set(k, v);
    return new Response(res.body, { status: res.status, statusText: res.statusText, headers });
  }
}

/** Largest JSON body a route reads, in bytes (UTF-8); more is a 413. */
export const MAX_JSON_BYTES = 1_000_000;
/** Deepest nesting of arrays/objects a JSON body may have; more is a 400. */
export const MAX_JSON_DEPTH = 32;

async function readCapped(req: Request, max: number): Promise<Uint8Array> {
  const tooLarge = () => payloadTooLarge(`The request body is larger than ${Math.round(max / 1000)} kB.`);
  if (Number(req.headers.get('content-length') ?? 0) > max) throw tooLarge();
  if (!req.body) return new Uint8Array();
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > max) {
      await reader.cancel().catch(() => {});
      throw tooLarge();
    }
    chunks.push(value);
  }
  const all = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    all.set(c, at);
    at += c.byteLength;
  }
  return all;
}

/** True when arrays/objects in `value` nest deeper than `max` levels. */
function nestedDeeperThan(value: unknown, max: number): boolean {
  const stack: [unknown, number][] = [[value, 1]];
  while (stack.length) {
    const [v, depth] = stack.pop()!;
    if (v === null || typeof v !== 'object') continue;
    if (depth > max) return true;
    for (const child of Object.values(v)) stack.push([child, depth + 1]);
  }
  return false;
}

/**
 * Reads a JSON body: over MAX_JSON_BYTES is a 413; not UTF-8 JSON, or nested deeper than
 * MAX_JSON_DEPTH, is a 400 with a plain message.
 */
export async function readJson(req: Request): Promise<unknown> {
  const bytes = await readCapped(req, MAX_JSON_BYTES);
  let value: unknown;
  try {
    value = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes));
  } catch {
    throw badRequest('The request body must be JSON.');
  }
  if (nestedDeeperThan(value, MAX_JSON_DEPTH)) throw badRequest(`The request body nests deeper than ${MAX_JSON_DEPTH} levels.`);
  return value;
}

export const json = (data: unknown, status = 200) => NextResponse.json(data, { status });

/** A text body (a CSV upload, say) as UTF-8, capped like JSON bodies (413 beyond `max` bytes, 400 when not UTF-8). */
export async function readText(req: Request, max = MAX_JSON_BYTES): Promise<string> {
  const bytes = await readCapped(req, max);
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw badRequest('The body is not UTF-8 text.');
  }
}
