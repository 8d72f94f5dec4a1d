import { forbidden, unsupportedMediaType } from '@/lib/errors';

/**
 * What a route reads from the request body. `json` (the default of `route()`): a body, if any,
 * must be `application/json`. `form`: urlencoded or multipart (next-auth's own endpoints).
 * `raw`: any content type (a route that streams a file must say so).
 */
export type BodyKind = 'json' | 'form' | 'raw';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The origin of a URL-ish header value, or undefined when it is missing or not a URL (e.g. "null"). */
function originOf(value: string | null): string | undefined {
  if (!value) return undefined;
  try {
    const u = new URL(value);
    return u.protocol === 'http:' || u.protocol === 'https:' ? u.origin : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Refuses cross-site state-changing requests: for every method but GET/HEAD/OPTIONS the `Origin`
 * header (or, when a client sends none, the `Referer`) must be one of `allowed`. A request with
 * neither is refused too (browsers send `Origin` on every POST/PUT/PATCH/DELETE, so only scripts
 * omit it, and they can send `Origin: <APP_URL>` like tests/support/http.ts does) unless
 * `ownToken`: the route checks a CSRF token of its own (next-auth's endpoints), so a script that
 * sends that token but no Origin (curl) goes on to that check. A foreign Origin is always refused.
 */
export function assertSameOrigin(req: Request, allowed: ReadonlySet<string>, { ownToken = false }: { ownToken?: boolean } = {}): void {
  if (SAFE_METHODS.has(req.method)) return;
  const origin = req.headers.get('origin');
  const referer = req.headers.get('referer');
  if (origin === null && !referer && ownToken) return;
  const from = origin !== null ? originOf(origin) : originOf(referer);
  if (from && allowed.has(from)) return;
  throw forbidden(
    origin === null && !referer
      ? 'This request did not say which site sent it (no Origin header), so it was refused.'
      : 'This request came from another site, so it was refused.',
  );
}

const hasBody = (req: Request) => {
  const length = req.headers.get('content-length');
  return (length !== null && length !== '0') || req.headers.has('transfer-encoding');
};

const mediaType = (req: Request) => (req.headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase();

/** 415 when the body's content type is not the kind the route reads (JSON unless it said otherwise). */
export function assertBodyKind(req: Request, kind: BodyKind): void {
  if (SAFE_METHODS.has(req.method) || kind === 'raw') return;
  const type = mediaType(req);
  if (!type && !hasBody(req)) return;
  if (kind === 'json' && type !== 'application/json') {
    throw unsupportedMediaType('Send the request body as JSON (Content-Type: application/json).');
  }
  if (kind === 'form' && type !== 'application/x-www-form-urlencoded' && type !== 'multipart/form-data') {
    throw unsupportedMediaType('Send the request body as a form (application/x-www-form-urlencoded).');
  }
}
