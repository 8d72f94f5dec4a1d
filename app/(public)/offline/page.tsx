import type { Metadata } from 'next';
import { OfflineCases } from '@/components/field/offline-cases';

export const metadata: Metadata = { title: 'No connection' };

/** Precached by the service worker: what a navigation shows when neither the network nor the cache has the page. */
export default function OfflinePage() {
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-extrabold">No connection</h1>
      <p>This page was not opened on this phone before, so there is no copy of it here. Cases you opened before still open from their last copy.</p>
      <OfflineCases />
      <p className="text-sm text-ink-soft">Anything you type in the field screen waits on this phone and is sent when the connection returns.</p>
    </div>
  );
}
