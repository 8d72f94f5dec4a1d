/**
 * Security headers on pages and API answers of the running app. Header meanings: CSP Level 3
 * (W3C), Referrer Policy (W3C), Fetch's X-Content-Type-Options: nosniff.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, signIn, type Session } from '../support/http';

let coordinator: Session;
beforeAll(async () => {
  coordinator = await signIn('coordinator@example.test');
});

const get = (path: string, session?: Session) => fetch(`${BASE_URL}${path}`, { redirect: 'manual', headers: session ? { cookie: session.cookie } : {} });

/** The directives of a CSP header as a map name -> sources. */
function directives(csp: string | null): Map<string, string[]> {
  expect(csp).toBeTruthy();
  return new Map(csp!.split(';').map((d) => d.trim().split(/\s+/)).map(([name, ...sources]) => [name, sources]));
}

describe('pages', () => {
  const PAGES: [path: string, signedIn: boolean, referrer: string][] = [
    ['/', false, 'strict-origin-when-cross-origin'],
    ['/sign-in', false, 'strict-origin-when-cross-origin'],
    ['/cautions', false, 'strict-origin-when-cross-origin'],
    ['/cases', true, 'strict-origin-when-cross-origin'],
    [`/r/${'Z'.repeat(43)}`, false, 'no-referrer'],
    ['/set-password?token=abc', false, 'no-referrer'],
  ];
  it.each(PAGES)('%s: nonce CSP on every script, no framing, nosniff, referrer policy', async (path, signedIn, referrer) => {
    const res = await get(path, signedIn ? coordinator : undefined);
    expect(res.status).toBeLessThan(500);
    const csp = directives(res.headers.get('content-security-policy'));
    const nonce = csp.get('script-src')!.find((s) => s.startsWith("'nonce-"))!.slice(7, -1);
    expect(nonce.length).toBeGreaterThanOrEqual(16);
    expect(csp.get('script-src')).toContain("'strict-dynamic'");
    expect(csp.get('script-src')).not.toContain("'unsafe-inline'");
    expect(csp.get('frame-ancestors')).toEqual(["'none'"]);
    expect(csp.get('object-src')).toEqual(["'none'"]);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('referrer-policy')).toBe(referrer);
    expect(res.headers.get('strict-transport-security')).toBeNull(); // the test app runs on http
    const html = await res.text();
    const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
  });

  it('makes a fresh nonce for every request', async () => {
    const [a, b] = await Promise.all([get('/sign-in'), get('/sign-in')]);
    expect(a.headers.get('content-security-policy')).not.toBe(b.headers.get('content-security-policy'));
  });
});

describe('API answers', () => {
  const ANSWERS: [path: string, signedIn: boolean, status: number, referrer: string][] = [
    ['/api/cases', true, 200, 'strict-origin-when-cross-origin'],
    ['/api/profile', true, 200, 'strict-origin-when-cross-origin'],
    ['/api/cases', false, 401, 'strict-origin-when-cross-origin'],
    ['/api/health', false, 200, 'strict-origin-when-cross-origin'],
    ['/api/auth/session', true, 200, 'strict-origin-when-cross-origin'],
    [`/api/r/${'Z'.repeat(43)}`, false, 404, 'no-referrer'],
    ['/api/cases/%FF', true, 400, 'strict-origin-when-cross-origin'],
    ['/api/no-such-resource', true, 404, 'strict-origin-when-cross-origin'],
    ['/api/cases/no/such/depth', false, 404, 'strict-origin-when-cross-origin'],
  ];
  it.each(ANSWERS)('%s (signed in: %s) -> %i: no-store, nosniff, nothing loads, never framed', async (path, signedIn, status, referrer) => {
    const res = await get(path, signedIn ? coordinator : undefined);
    expect(res.status).toBe(status);
    expect(res.headers.get('cache-control')).toMatch(/no-store/);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('referrer-policy')).toBe(referrer);
    const csp = directives(res.headers.get('content-security-policy'));
    expect(csp.get('default-src')).toEqual(["'none'"]);
    expect(csp.get('frame-ancestors')).toEqual(["'none'"]);
  });

  it('sets the session cookie HttpOnly and SameSite=Lax (Secure only on https, which the test app is not)', async () => {
    const csrf = await get('/api/auth/csrf');
    const cookies = csrf.headers.getSetCookie();
    expect(cookies.length).toBeGreaterThan(0);
    for (const c of cookies) {
      expect(c).toMatch(/HttpOnly/i);
      expect(c).toMatch(/SameSite=Lax/i);
      expect(c).not.toMatch(/;\s*Secure/i);
    }
  });
});
