'use client';

import { useEffect } from 'react';

/**
 * Registers the field app's service worker (/sw.js, built by `serwist build`) in production
 * builds; the development server has none. Renders nothing.
 */
export function ServiceWorkerRegistrar() {
  useEffect(() => {
    if (process.env.NODE_ENV !== 'production' || !('serviceWorker' in navigator)) return;
    navigator.serviceWorker.register('/sw.js', { scope: '/' }).catch(() => {
      // no worker (e.g. a private window that refuses it): the app still works online
    });
  }, []);
  return null;
}
