import { NextResponse, type NextRequest } from 'next/server';
import { getToken } from 'next-auth/jwt';
import { allowedOrigins, appIsHttps, env } from '@/lib/env';
import { assertSameOrigin } from '@/lib/api/request-guard';
import { AppError } from '@/lib/errors';
import { pathDecodes, securityHeaders } from '@/lib/api/security-headers';
import { sameOriginPath } from '@/lib/api/same-origin-path';

/** Signed-in areas: a signed-out visit goes to /sign-in and comes back. */
const SIGNED_IN_PREFIXES = ['/cases', '/admin', '/invite', '/profile', '/field', '/reports'];
const needsSession = (path: string) => SIGNED_IN_PREFIXES.some((p) => path === p || path.startsWith(`${p}/`));

const CALLBACK_COOKIES = ['next-auth.callback-url', '__Secure-next-auth.callback-url'];
/** A callback target next-auth may follow: a path on this site that decodes. */
const goodCallback = (v: string) => {
  const path = sameOriginPath(v, env.APP_URL);
  return path !== undefined && pathDecodes(path.split(/[?#]/)[0]);
};

/**
 * next-auth refuses a malformed callback URL (parameter or cookie) with a 500; drop a foreign or
 * malformed one before it gets there, so the endpoint answers as if none had been sent.
 */
function dropBadCallback(req: NextRequest): URL | undefined {
  for (const name of CALLBACK_COOKIES) {
    const v = req.cookies.get(name)?.value;
    if (v !== undefined && !goodCallback(v)) req.cookies.delete(name);
  }
  const param = req.nextUrl.searchParams.get('callbackUrl');
  if (param === null || goodCallback(param)) return undefined;
  const url = req.nextUrl.clone();
  url.searchParams.delete('callbackUrl');
  return url;
}

function withHeaders<R extends NextResponse>(res: R, own: Record<string, string>): R {
  for (const [k, v] of Object.entries(own)) res.headers.set(k, v);
  return res;
}

/**
 * Runs before every page (and the API paths named in `config` below):
 * - a path whose percent-encoding does not decode is a 400 JSON (API) or the not-found page,
 *   never Next's plain-text 500;
 * - a state-changing request to a page (a server action) passes the same Origin rule as route()
 *   (Next's own check lets a request without Origin through);
 * - security headers (CSP with a fresh nonce, nosniff, referrer policy, HSTS on https) on every answer;
 * - signed-out visits to signed-in pages are redirected. Every page, route handler and server
 *   action still checks the session itself.
 */
export async function proxy(req: NextRequest) {
  const { pathname } = req.nextUrl;
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString('base64');
  const own = securityHeaders(pathname, { nonce, https: appIsHttps, dev: env.NODE_ENV === 'development', tileUrls: [env.TILE_URL], storageOrigins: [env.S3_ENDPOINT] });
  if (!pathDecodes(pathname)) {
    if (pathname.startsWith('/api/')) {
      return withHeaders(NextResponse.json({ error: 'The address contains broken percent-encoding.' }, { status: 400, headers: { 'cache-control': 'no-store' } }), own);
    }
    return withHeaders(NextResponse.rewrite(new URL('/not-found-page', req.url)), own);
  }
  if (!pathname.startsWith('/api/')) {
    try {
      assertSameOrigin(req, allowedOrigins);
    } catch (err) {
      return withHeaders(NextResponse.json({ error: (err as AppError).message }, { status: 403 }), own);
    }
  }
  const path = pathname + req.nextUrl.search;
  if (needsSession(pathname)) {
    const token = await getToken({ req, secret: env.NEXTAUTH_SECRET, secureCookie: appIsHttps });
    if (!token) {
      const url = req.nextUrl.clone();
      url.pathname = '/sign-in';
      url.search = `?next=${encodeURIComponent(path)}`;
      return withHeaders(NextResponse.redirect(url), own);
    }
  }
  const rewriteTo = pathname.startsWith('/api/auth/') ? dropBadCallback(req) : undefined;
  const headers = new Headers(req.headers);
  headers.set('x-quietfix-path', path);
  headers.set('x-nonce', nonce);
  // Next reads the nonce from the request's policy and puts it on the scripts it renders.
  headers.set('content-security-policy', own['Content-Security-Policy']);
  return withHeaders(rewriteTo ? NextResponse.rewrite(rewriteTo, { request: { headers } }) : NextResponse.next({ request: { headers } }), own);
}

/**
 * Every path but Next's static files and the API: route() gives each API answer its headers and
 * checks its origin, so the proxy's per-request cost is spared there. It still sees next-auth's
 * endpoints (callback checks) and any API path with a percent sign (broken encodings -> 400 JSON).
 */
export const config = { matcher: ['/((?!_next/static|_next/image|api/(?!auth(?:/|$))[^%]*$).*)'] };
