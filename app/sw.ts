/// <reference lib="webworker" />
/**
 * The field app's service worker, bundled by `serwist build` (serwist.config.js) into /sw.js.
 * Precaches Next's static output (the app shell) and the offline page; pages, their data and map
 * tiles a hunter opened are cached as they load (network first, so online answers are fresh);
 * an answer served from the cache carries `x-quietfix-stored-at` (when it was loaded), which the
 * screens show. Background Sync wakes it to send the offline queue.
 */
import type { PrecacheEntry, SerwistGlobalConfig, SerwistPlugin } from 'serwist';
import { CacheFirst, ExpirationPlugin, NetworkFirst, NetworkOnly, Serwist, StaleWhileRevalidate } from 'serwist';
import { flushQueue, QUEUE_SYNC_TAG } from '../lib/field/queue';
import { FIELD_CACHES, OFFLINE_PAGE, STORED_AT_HEADER } from '../lib/field/cache-names';
import { joinKeptPlaces, placesBox, type KeptPlacesAnswer } from '../lib/field/places-fallback';

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}
declare const self: ServiceWorkerGlobalScope;

/** Keeps only plain 200 answers (no redirects, no errors) and stamps when they were stored. */
const stampWhenStored: SerwistPlugin = {
  cacheWillUpdate: async ({ response }) => {
    if (!response || response.status !== 200 || response.redirected) return null;
    const headers = new Headers(response.headers);
    headers.set(STORED_AT_HEADER, new Date().toISOString());
    return new Response(await response.blob(), { status: response.status, statusText: response.statusText, headers });
  },
};

const sameOriginGet = (request: Request, url: URL) => request.method === 'GET' && url.origin === self.location.origin;
const FIELD_DATA = /^\/api\/(cases(\/|$)|profile$)/;

/**
 * Offline, a places box never kept as such (the map moved, or the area came from "Prepare for the
 * field") is answered from every kept places answer that overlaps it (lib/field/places-fallback.ts).
 */
const placesFromOverlappingAnswers: SerwistPlugin = {
  handlerDidError: async ({ request }) => {
    const wanted = placesBox(request.url);
    if (!wanted) return undefined;
    const cache = await caches.open(FIELD_CACHES.data);
    const kept: KeptPlacesAnswer[] = [];
    for (const key of await cache.keys()) {
      const box = new URL(key.url).pathname === '/api/places' ? placesBox(key.url) : null;
      const res = box && (await cache.match(key));
      if (!box || !res) continue;
      const body = await res.json().catch(() => null);
      if (body && Array.isArray(body.features)) kept.push({ box, storedAt: res.headers.get(STORED_AT_HEADER), body });
    }
    const joined = joinKeptPlaces(wanted, kept);
    if (!joined) return undefined;
    const headers = new Headers({ 'content-type': 'application/json' });
    if (joined.storedAt) headers.set(STORED_AT_HEADER, joined.storedAt);
    return new Response(JSON.stringify(joined.body), { status: 200, headers });
  },
};
/** One expiry for the data cache, whichever route filled it. */
const dataExpiry = new ExpirationPlugin({ maxEntries: 400, maxAgeSeconds: 30 * 24 * 3600 });

const serwist = new Serwist({
  precacheEntries: [...(self.__SW_MANIFEST ?? []), { url: OFFLINE_PAGE, revision: String(self.__SW_MANIFEST?.length ?? 0) + '-offline-1' }],
  skipWaiting: true,
  clientsClaim: true,
  navigationPreload: false,
  runtimeCaching: [
    { matcher: ({ url }) => url.pathname.startsWith('/api/auth/'), handler: new NetworkOnly() },
    {
      matcher: ({ request, url }) => sameOriginGet(request, url) && url.pathname === '/api/places',
      handler: new NetworkFirst({ cacheName: FIELD_CACHES.data, networkTimeoutSeconds: 8, plugins: [stampWhenStored, dataExpiry, placesFromOverlappingAnswers] }),
    },
    {
      matcher: ({ request, url }) => sameOriginGet(request, url) && FIELD_DATA.test(url.pathname),
      handler: new NetworkFirst({ cacheName: FIELD_CACHES.data, networkTimeoutSeconds: 8, plugins: [stampWhenStored, dataExpiry] }),
    },
    {
      matcher: ({ request, url }) => sameOriginGet(request, url) && request.mode === 'navigate' && !url.pathname.startsWith('/api/'),
      handler: new NetworkFirst({
        cacheName: FIELD_CACHES.pages,
        networkTimeoutSeconds: 8,
        plugins: [stampWhenStored, new ExpirationPlugin({ maxEntries: 60, maxAgeSeconds: 30 * 24 * 3600 })],
      }),
    },
    {
      matcher: ({ request, url }) => sameOriginGet(request, url) && request.headers.get('RSC') === '1',
      handler: new NetworkFirst({ cacheName: FIELD_CACHES.rsc, networkTimeoutSeconds: 8, plugins: [stampWhenStored, new ExpirationPlugin({ maxEntries: 60 })] }),
    },
    // Map tiles from the configured tile server: those viewed stay (cross-origin, opaque answers allowed).
    {
      matcher: ({ request, url }) => request.method === 'GET' && url.origin !== self.location.origin && request.destination === 'image',
      handler: new CacheFirst({ cacheName: FIELD_CACHES.tiles, plugins: [new ExpirationPlugin({ maxEntries: 3000, maxAgeSeconds: 30 * 24 * 3600 })] }),
    },
    { matcher: ({ request, url }) => sameOriginGet(request, url) && !url.pathname.startsWith('/api/'), handler: new StaleWhileRevalidate({ cacheName: FIELD_CACHES.assets }) },
  ],
  fallbacks: { entries: [{ url: OFFLINE_PAGE, matcher: ({ request }) => request.destination === 'document' }] },
});

self.addEventListener('sync', (event) => {
  const e = event as ExtendableEvent & { tag?: string };
  if (e.tag === QUEUE_SYNC_TAG) e.waitUntil(flushQueue());
});

serwist.addEventListeners();
