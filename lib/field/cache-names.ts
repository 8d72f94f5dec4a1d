/** Names the service worker and the pages share (browser only, no imports). */
export const FIELD_CACHES = {
  data: 'quietfix-data',
  pages: 'quietfix-pages',
  rsc: 'quietfix-rsc',
  tiles: 'quietfix-tiles',
  assets: 'quietfix-assets',
} as const;

/** Header the worker adds to an answer it keeps: when it was loaded (ISO time). Present only on answers served from the cache. */
export const STORED_AT_HEADER = 'x-quietfix-stored-at';

/** The page a navigation falls back to when neither the network nor the cache has it. */
export const OFFLINE_PAGE = '/offline';
