/**
 * Requests to the test app from a chosen loopback address (all of 127.0.0.0/8 is this machine),
 * so a test can be "another client" by its socket address, the one thing a client cannot fake.
 * scripts/test.sh runs the app with TRUSTED_PROXY=127.0.0.9: requests from PROXY_ADDRESS act
 * as our reverse proxy, whose right-most X-Forwarded-For entry the app believes.
 */
import { request } from 'node:http';
import { BASE_URL } from './http';

export const PROXY_ADDRESS = '127.0.0.9';

export type Reply = { status: number; headers: Record<string, string | string[] | undefined>; text: string; json: any; cookies: string[] };

export function fromAddress(localAddress: string, path: string, opts: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<Reply> {
  const url = new URL(path, BASE_URL);
  return new Promise((resolve, reject) => {
    const req = request(
      url,
      { method: opts.method ?? (opts.body === undefined ? 'GET' : 'POST'), localAddress, headers: { origin: new URL(BASE_URL).origin, ...opts.headers } },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => {
          const text = Buffer.concat(chunks).toString('utf8');
          let json: any;
          try {
            json = text ? JSON.parse(text) : undefined;
          } catch {
            json = undefined;
          }
          const sc = res.headers['set-cookie'] ?? [];
          resolve({ status: res.statusCode ?? 0, headers: res.headers, text, json, cookies: sc.map((c) => c.split(';')[0]) });
        });
      },
    );
    req.on('error', reject);
    if (opts.body !== undefined) req.write(opts.body);
    req.end();
  });
}

/** The browser's credentials form, posted from `localAddress`; `cookie` holds the session when it worked. */
export async function signInFrom(localAddress: string, email: string, password: string, headers: Record<string, string> = {}) {
  const csrf = await fromAddress(localAddress, '/api/auth/csrf', { headers });
  const jar = csrf.cookies.join('; ');
  const t0 = performance.now();
  const res = await fromAddress(localAddress, '/api/auth/callback/credentials', {
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: jar, ...headers },
    body: new URLSearchParams({ csrfToken: csrf.json.csrfToken, email, password, json: 'true' }).toString(),
  });
  const ms = performance.now() - t0;
  const session = res.cookies.find((c) => c.startsWith('next-auth.session-token='));
  return { status: res.status, json: res.json, ms, retryAfter: res.headers['retry-after'], cookie: session ? `${jar}; ${session}` : undefined };
}

/** A JSON POST from `localAddress`. */
export const postJsonFrom = (localAddress: string, path: string, body: unknown, headers: Record<string, string> = {}) =>
  fromAddress(localAddress, path, { headers: { 'content-type': 'application/json', ...headers }, body: JSON.stringify(body) });

/**
 * A loopback address no other test of this run uses (random second and third octets), so a
 * re-run against the same database within a limit's window starts with fresh counters.
 */
export function freshAddress(): string {
  const b = () => 10 + Math.floor(Math.random() * 240);
  return `127.${b()}.${b()}.${b()}`;
}
