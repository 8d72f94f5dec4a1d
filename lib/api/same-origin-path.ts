/**
 * A `next` / callback target reduced to a path on our own site, or `fallback`.
 * Checked with the URL parser, so `//host`, `/\host`, `/%09/host`, `https://elsewhere` and
 * anything whose origin differs from `origin` after parsing fall back. Pure: safe in the browser.
 */
export function sameOriginPath(target: string | null | undefined, origin: string, fallback: string): string;
export function sameOriginPath(target: string | null | undefined, origin: string, fallback?: undefined): string | undefined;
export function sameOriginPath(target: string | null | undefined, origin: string, fallback?: string): string | undefined {
  if (!target) return fallback;
  let base: URL;
  let url: URL;
  try {
    base = new URL(origin);
    url = new URL(target, base);
  } catch {
    return fallback;
  }
  if (url.origin !== base.origin) return fallback;
  const path = url.pathname + url.search + url.hash;
  // After parsing, a path must not start with two slashes (the browser would read it as a host).
  return path.startsWith('/') && !path.startsWith('//') && !path.startsWith('/\\') ? path : fallback;
}
