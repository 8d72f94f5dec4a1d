// @ts-check
// The service worker is built after `next build` by `serwist build` (@serwist/cli): the Turbopack
// route (no webpack plugin). It precaches Next's static output and public/, and bundles app/sw.ts.
import { serwist } from '@serwist/next/config';

export default serwist({
  swSrc: 'app/sw.ts',
  swDest: 'public/sw.js',
  // Pages render per request (nonce CSP): none is prerendered; the offline page is added by the worker.
  precachePrerendered: false,
  globIgnores: ['public/sw.js', 'public/sw.js.map'],
  maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
});
