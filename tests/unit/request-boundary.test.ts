/**
 * The request boundary's pure rules: same-origin redirects (WHATWG URL parsing), the one text
 * schema, the Origin and body-kind checks, the security headers, and source rules every route
 * keeps (checked by reading the files).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import { sameOriginPath } from '@/lib/api/same-origin-path';
import { safeText } from '@/lib/validation/text';
import { assertBodyKind, assertSameOrigin } from '@/lib/api/request-guard';
import { pagePolicy, pathDecodes, securityHeaders, tileSource } from '@/lib/api/security-headers';
import { AppError } from '@/lib/errors';

const ORIGIN = 'http://127.0.0.1:3000';

describe('sameOriginPath (WHATWG URL parser decides)', () => {
  const CASES: [string | null, string][] = [
    ['/cases?status=open#top', '/cases?status=open#top'],
    ['/profile', '/profile'],
    ['cases', '/cases'],
    [`${ORIGIN}/admin/users`, '/admin/users'],
    ['/%09/evil.example.test/', '/%09/evil.example.test/'], // still encoded: a path on this site
    ['/\t/evil.example.test/', '/cases'], // tab removed by the parser -> //evil... -> another host
    ['/\\evil.example.test/x', '/cases'],
    ['\\\\evil.example.test', '/cases'],
    ['//evil.example.test/x', '/cases'],
    ['///evil.example.test/x', '/cases'],
    ['https://evil.example.test/', '/cases'],
    ['http://127.0.0.1:3001/cases', '/cases'], // another port is another origin
    ['javascript:alert(1)', '/cases'],
    ['http://[', '/cases'],
    ['', '/cases'],
    [null, '/cases'],
  ];
  it.each(CASES)('%j -> %s', (next, want) => {
    expect(sameOriginPath(next, ORIGIN, '/cases')).toBe(want);
  });

  it('never answers something a browser would resolve to another origin', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 40 }), fc.constantFrom('', '/', '//', '/\\', '\\', 'http://x.example.test', ' '), (s, prefix) => {
        const p = sameOriginPath(prefix + s, ORIGIN, '/cases');
        expect(new URL(p, ORIGIN).origin).toBe(ORIGIN);
        expect(p.startsWith('/')).toBe(true);
      }),
      { numRuns: 500 },
    );
  });
});

describe('safeText', () => {
  const s = safeText().trim().max(50);
  it('keeps ordinary text, tabs, newlines and characters outside the BMP', () => {
    for (const ok of ['Hash on 40 m', 'line one\nline two\r\n\tindented', 'Grüße – ☂ 😀 𝄞', '']) expect(s.parse(ok)).toBe(ok.trim());
  });
  it('refuses NUL, other C0 controls, DEL and lone surrogates with a message', () => {
    for (const bad of ['a\u0000b', '\u0001', 'x\u001by', 'del\u007f', 'half \ud83d', '\ude00 half', 'swap \ude00\ud83d']) {
      const r = s.safeParse(bad);
      expect(r.success, JSON.stringify(bad)).toBe(false);
      expect(r.error!.issues[0].message).toMatch(/control characters|broken character/);
    }
  });
  it('agrees with the engine on every string: accepted exactly when well-formed (ES2024 isWellFormed) and free of controls', () => {
    const isControl = (c: number) => (c < 32 && c !== 9 && c !== 10 && c !== 13) || c === 127;
    const oracle = (t: string) => (t as string & { isWellFormed(): boolean }).isWellFormed() && ![...t].some((ch) => isControl(ch.charCodeAt(0)));
    const text = fc.string({ unit: 'grapheme', maxLength: 30 });
    const bad = fc.oneof(fc.integer({ min: 0, max: 31 }), fc.constant(127), fc.integer({ min: 0xd800, max: 0xdfff })).map((c) => String.fromCharCode(c));
    fc.assert(
      fc.property(text, fc.option(bad), fc.nat(), (t, b, pos) => {
        const i = pos % (t.length + 1);
        const value = b === null ? t : t.slice(0, i) + b + t.slice(i);
        expect(safeText().safeParse(value).success, JSON.stringify(value)).toBe(oracle(value));
      }),
      { numRuns: 500 },
    );
  });
});

const req = (method: string, headers: Record<string, string>, body?: string) => new Request(`${ORIGIN}/api/x`, { method, headers, body });
const status = (fn: () => void) => {
  try {
    fn();
    return 'ok';
  } catch (e) {
    return (e as AppError).status;
  }
};

describe('assertSameOrigin', () => {
  const allowed = new Set([ORIGIN, 'https://club.example.test']);
  const CASES: [string, Record<string, string>, number | 'ok'][] = [
    ['GET', {}, 'ok'],
    ['HEAD', { origin: 'https://evil.example.test' }, 'ok'],
    ['POST', { origin: ORIGIN }, 'ok'],
    ['PATCH', { origin: 'https://club.example.test' }, 'ok'],
    ['POST', { referer: `${ORIGIN}/cases/1` }, 'ok'],
    ['POST', { origin: 'https://evil.example.test' }, 403],
    ['PUT', { origin: 'http://127.0.0.1:3001' }, 403],
    ['DELETE', { origin: 'null' }, 403],
    ['POST', { origin: 'null', referer: `${ORIGIN}/x` }, 403], // an Origin, when sent, decides
    ['POST', { referer: 'https://evil.example.test/x' }, 403],
    ['POST', { referer: 'not a url' }, 403],
    ['POST', {}, 403],
  ];
  it.each(CASES)('%s %j -> %s', (method, headers, want) => {
    expect(status(() => assertSameOrigin(req(method, headers), allowed))).toBe(want);
  });
  // A route with its own CSRF token (next-auth) lets a script without Origin reach that check; foreign stays refused.
  const OWN_TOKEN: [Record<string, string>, number | 'ok'][] = [
    [{}, 'ok'],
    [{ origin: ORIGIN }, 'ok'],
    [{ origin: 'https://evil.example.test' }, 403],
    [{ origin: 'null' }, 403],
    [{ referer: 'https://evil.example.test/x' }, 403],
  ];
  it.each(OWN_TOKEN)('with its own token: POST %j -> %s', (headers, want) => {
    expect(status(() => assertSameOrigin(req('POST', headers), allowed, { ownToken: true }))).toBe(want);
  });
});

describe('assertBodyKind', () => {
  const CASES: [string, Record<string, string>, string | undefined, 'json' | 'form' | 'raw', number | 'ok'][] = [
    ['POST', { 'content-type': 'application/json' }, '{}', 'json', 'ok'],
    ['POST', { 'content-type': 'application/json; charset=utf-8' }, '{}', 'json', 'ok'],
    ['POST', {}, undefined, 'json', 'ok'], // no body at all (e.g. retry)
    ['POST', { 'content-type': 'text/plain' }, '{}', 'json', 415],
    ['POST', { 'content-type': 'application/x-www-form-urlencoded' }, 'a=1', 'json', 415],
    ['PATCH', { 'content-type': 'multipart/form-data; boundary=x' }, '--x--', 'json', 415],
    ['POST', { 'content-type': 'application/x-www-form-urlencoded' }, 'a=1', 'form', 'ok'],
    ['POST', { 'content-type': 'application/json' }, '{}', 'form', 415],
    ['POST', { 'content-type': 'image/png' }, 'x', 'raw', 'ok'],
    ['GET', { 'content-type': 'text/plain' }, undefined, 'json', 'ok'],
  ];
  it.each(CASES)('%s %j %j as %s -> %s', (method, headers, body, kind, want) => {
    expect(status(() => assertBodyKind(req(method, headers, body), kind))).toBe(want);
  });
});

describe('security headers', () => {
  const o = { nonce: 'bm9uY2Vub25jZQ==', https: false, dev: false, tileUrls: [] as string[] };
  it('gives pages a nonce policy without unsafe-inline scripts, and API answers a load-nothing policy', () => {
    const page = securityHeaders('/cases', o);
    expect(page['Content-Security-Policy']).toContain("script-src 'self' 'nonce-bm9uY2Vub25jZQ==' 'strict-dynamic'");
    expect(page['Content-Security-Policy']).toContain("frame-ancestors 'none'");
    expect(page['Content-Security-Policy']).not.toContain('unsafe-eval');
    expect(securityHeaders('/api/cases', o)['Content-Security-Policy']).toMatch(/^default-src 'none'/);
    expect(page['Strict-Transport-Security']).toBeUndefined();
  });
  it('sends HSTS and upgrades requests on https', () => {
    const h = securityHeaders('/', { ...o, https: true });
    expect(h['Strict-Transport-Security']).toMatch(/max-age=\d{7,}/);
    expect(h['Content-Security-Policy']).toContain('upgrade-insecure-requests');
  });
  it('keeps the Referer off token pages only', () => {
    expect(securityHeaders('/r/abc', o)['Referrer-Policy']).toBe('no-referrer');
    expect(securityHeaders('/api/r/abc/answers', o)['Referrer-Policy']).toBe('no-referrer');
    expect(securityHeaders('/set-password', o)['Referrer-Policy']).toBe('no-referrer');
    expect(securityHeaders('/sign-in', o)['Referrer-Policy']).toBe('strict-origin-when-cross-origin');
    expect(securityHeaders('/rules', o)['Referrer-Policy']).toBe('strict-origin-when-cross-origin');
  });
  it('lets map tiles load from the configured tile server (Leaflet {s} subdomains become a wildcard)', () => {
    expect(tileSource('https://{s}.tiles.example.test/{z}/{x}/{y}.png')).toBe('https://*.tiles.example.test');
    expect(tileSource('http://127.0.0.1:8080/tiles/{z}/{x}/{y}.png')).toBe('http://127.0.0.1:8080');
    expect(tileSource('')).toBeUndefined();
    expect(tileSource("https://x.example.test'; script-src *")).toBeUndefined();
    const policy = pagePolicy({ ...o, tileUrls: ['https://{s}.tiles.example.test/{z}/{x}/{y}.png', ''] });
    expect(policy).toContain("img-src 'self' data: blob: https://*.tiles.example.test");
    expect(policy).toContain("connect-src 'self' https://*.tiles.example.test");
  });
  it('spots paths whose percent-encoding does not decode', () => {
    expect(pathDecodes('/api/cases/0b6f')).toBe(true);
    expect(pathDecodes('/r/%E2%9C%93')).toBe(true);
    for (const bad of ['/api/cases/%FF', '/r/%ED%A0%BD', '/x/%E0%A4%A', '/%C0%AF']) expect(pathDecodes(bad), bad).toBe(false);
  });
});

describe('settings for an https deployment', () => {
  it('mark cookies Secure and read TRUSTED_ORIGINS once', async () => {
    vi.resetModules();
    vi.stubEnv('APP_URL', 'https://quietfix.example.test');
    vi.stubEnv('TRUSTED_ORIGINS', 'https://club.example.test, https://other.example.test:8443/ignored-path');
    try {
      const { allowedOrigins, appIsHttps } = await import('@/lib/env');
      expect(appIsHttps).toBe(true);
      expect([...allowedOrigins]).toEqual(['https://quietfix.example.test', 'https://club.example.test', 'https://other.example.test:8443']);
      const { authOptions } = await import('@/lib/auth/options');
      expect(authOptions.useSecureCookies).toBe(true);
    } finally {
      vi.unstubAllEnvs();
      vi.resetModules();
    }
  });
});

/** Every file under a folder, recursively. */
function files(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = path.join(dir, f);
    return statSync(p).isDirectory() ? files(p) : [p];
  });
}
const ROOT = path.resolve(import.meta.dirname, '../..');

describe('source rules of the boundary', () => {
  const routes = files(path.join(ROOT, 'app/api')).filter((f) => f.endsWith('route.ts'));
  it.each(routes.map((f) => [path.relative(ROOT, f)]))('%s wraps every state-changing handler in route()', (file) => {
    const src = readFileSync(path.join(ROOT, file), 'utf8');
    for (const m of src.matchAll(/export (?:const|async function|function) (POST|PUT|PATCH|DELETE)\b(.{0,40})/g)) {
      expect(m[2], `${file} ${m[1]}`).toMatch(/^\s*=\s*route[<(]/);
    }
  });
  it('no schema takes a bare z.string(): free text goes through safeText()', () => {
    const scanned = [...files(path.join(ROOT, 'lib/validation')), ...routes, path.join(ROOT, 'lib/notices/request.ts')].filter((f) => !f.endsWith('text.ts'));
    const bare = scanned.filter((f) => /z\s*\.\s*string\s*\(/.test(readFileSync(f, 'utf8'))).map((f) => path.relative(ROOT, f));
    expect(bare).toEqual([]);
  });
});
