/**
 * The security headers of every page and API answer (pages: set by proxy.ts; API answers: by
 * route(), and by proxy.ts for the API paths it still sees). Pure: unit-testable.
 * Pages get a nonce-based Content-Security-Policy (Next puts the nonce on its own scripts when
 * the request carries the policy); API answers a policy that loads nothing.
 */

/** A CSP source for a tile URL template ("https://{s}.tiles.example.test/{z}/{x}/{y}.png" -> "https://*.tiles.example.test"). */
export function tileSource(template: string): string | undefined {
  const m = /^(https?):\/\/([^/?#]+)/i.exec(template.trim());
  if (!m) return undefined;
  const host = m[2].replace(/\{[a-z]+\}/gi, '*');
  if (!/^[a-z0-9*.:[\]-]+$/i.test(host)) return undefined;
  return `${m[1].toLowerCase()}://${host.toLowerCase()}`;
}

export type HeaderOptions = {
  nonce: string;
  /** https deployment: HSTS and upgrade-insecure-requests */
  https: boolean;
  /** development server: React needs eval for its debugging aids */
  dev: boolean;
  /** tile URL templates whose origins images and fetches may come from */
  tileUrls: string[];
  /** object storage origins the browser PUTs evidence to and loads photos and recordings from (presigned URLs) */
  storageOrigins?: string[];
};

/** The page policy: scripts only with the nonce (and what they load), no framing, no plugins. */
export function pagePolicy(o: HeaderOptions): string {
  const tiles = o.tileUrls.map(tileSource).filter((s): s is string => !!s);
  const storage = (o.storageOrigins ?? []).map((u) => new URL(u).origin);
  const directives = [
    `default-src 'self'`,
    `script-src 'self' 'nonce-${o.nonce}' 'strict-dynamic'${o.dev ? ` 'unsafe-eval'` : ''}`,
    // Leaflet positions its panes and icons with inline style attributes.
    `style-src 'self' 'unsafe-inline'`,
    ['img-src', `'self'`, 'data:', 'blob:', ...tiles, ...storage].join(' '),
    ['media-src', `'self'`, 'blob:', ...storage].join(' '),
    ['connect-src', `'self'`, ...tiles, ...storage].join(' '),
    `font-src 'self'`,
    `worker-src 'self'`,
    `manifest-src 'self'`,
    `object-src 'none'`,
    `base-uri 'self'`,
    `form-action 'self'`,
    `frame-ancestors 'none'`,
    ...(o.https ? ['upgrade-insecure-requests'] : []),
  ];
  return directives.join('; ');
}

/** API answers load nothing (the printable letter may show in the browser's PDF viewer) and are never framed. */
export const API_POLICY = "default-src 'none'; object-src 'self'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/** Pages and answers whose URL carries a secret token: no Referer leaves them. */
const TOKEN_PATHS = [/^\/r\//, /^\/api\/r\//, /^\/set-password(\/|$)/];

const isApi = (pathname: string) => pathname === '/api' || pathname.startsWith('/api/');

function headersWith(policy: string, pathname: string, https: boolean): Record<string, string> {
  return {
    'Content-Security-Policy': policy,
    'X-Content-Type-Options': 'nosniff',
    'X-Frame-Options': 'DENY',
    'Referrer-Policy': TOKEN_PATHS.some((re) => re.test(pathname)) ? 'no-referrer' : 'strict-origin-when-cross-origin',
    ...(https ? { 'Strict-Transport-Security': 'max-age=31536000' } : {}),
  };
}

/** Response headers for a path (CSP included). */
export function securityHeaders(pathname: string, o: HeaderOptions): Record<string, string> {
  return headersWith(isApi(pathname) ? API_POLICY : pagePolicy(o), pathname, o.https);
}

/** The same headers for an API answer, which needs no nonce (route() sets them on every answer). */
export function apiSecurityHeaders(pathname: string, https: boolean): Record<string, string> {
  return headersWith(API_POLICY, pathname, https);
}

/** True when every segment of a raw (still percent-encoded) path decodes to valid UTF-8. */
export function pathDecodes(rawPathname: string): boolean {
  try {
    for (const segment of rawPathname.split('/')) decodeURIComponent(segment);
    return true;
  } catch {
    return false;
  }
}
