/** Test client for the running app: real next-auth sign-in, cookies kept per session. */
export const BASE_URL = process.env.TEST_BASE_URL ?? 'http://127.0.0.1:3100';
export const CATCHER_URL = process.env.MAIL_CATCHER_URL ?? 'http://127.0.0.1:8125';
export const DEMO_PASSWORD = 'quietfix-demo';

/**
 * State-changing requests must say they come from the app's own pages (lib/api/request-guard.ts):
 * the test client sends `Origin: <the app>` like a browser does. A test may override it.
 */
export const APP_ORIGIN = new URL(BASE_URL).origin;

export type Session = { cookie: string; email: string };

function mergeCookies(prev: string, res: Response): string {
  const jar = new Map(prev ? prev.split('; ').map((c) => c.split('=', 2) as [string, string]).map(([k, v]) => [k, v]) : []);
  for (const sc of res.headers.getSetCookie()) {
    const [pair] = sc.split(';');
    const i = pair.indexOf('=');
    jar.set(pair.slice(0, i), pair.slice(i + 1));
  }
  return [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
}

/** Posts the credentials form the way a browser does; returns the raw response and the cookies. */
export async function postCredentials(email: string, password: string, extraHeaders: Record<string, string> = {}) {
  const csrfRes = await fetch(`${BASE_URL}/api/auth/csrf`, { headers: extraHeaders });
  let cookie = mergeCookies('', csrfRes);
  const { csrfToken } = await csrfRes.json();
  const res = await fetch(`${BASE_URL}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', origin: APP_ORIGIN, cookie, ...extraHeaders },
    body: new URLSearchParams({ csrfToken, email, password, json: 'true' }),
  });
  cookie = mergeCookies(cookie, res);
  return { res, cookie };
}

export async function signIn(email: string, password = DEMO_PASSWORD): Promise<Session> {
  const { res, cookie } = await postCredentials(email, password);
  if (!cookie.includes('next-auth.session-token')) throw new Error(`sign-in failed for ${email}: ${res.status}`);
  return { cookie, email };
}

export async function api(path: string, opts: { method?: string; body?: unknown; session?: Session; headers?: Record<string, string> } = {}) {
  const res = await fetch(`${BASE_URL}${path}`, {
    method: opts.method ?? (opts.body === undefined ? 'GET' : 'POST'),
    redirect: 'manual',
    headers: {
      origin: APP_ORIGIN,
      ...(opts.body === undefined ? {} : { 'content-type': 'application/json' }),
      ...(opts.session ? { cookie: opts.session.cookie } : {}),
      ...opts.headers,
    },
    body: opts.body === undefined ? undefined : typeof opts.body === 'string' ? opts.body : JSON.stringify(opts.body),
  });
  const text = await res.text();
  let json: any = undefined;
  try {
    json = text ? JSON.parse(text) : undefined;
  } catch {
    /* not JSON: leave undefined so the assertion says so */
  }
  return { status: res.status, json, text, headers: res.headers };
}

/** Mail captured by the local catcher (newest first), filtered by recipient. */
export async function mailTo(address: string): Promise<any[]> {
  const res = await fetch(`${CATCHER_URL}/api/v2/search?kind=to&query=${encodeURIComponent(address)}`);
  return (await res.json()).items;
}

export async function waitFor<T>(fn: () => Promise<T | undefined>, timeoutMs = 10_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await fn();
    if (v !== undefined) return v;
    if (Date.now() > until) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 200));
  }
}

export const uniqueEmail = (prefix: string) => `${prefix}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@example.test`;
