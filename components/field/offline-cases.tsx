'use client';

import { useEffect, useState } from 'react';
import { FIELD_CACHES } from '@/lib/field/cache-names';
import { listQueued } from '@/lib/field/queue';

/** The field screens this phone keeps a copy of, and how many items wait to be sent. */
export function OfflineCases() {
  const [pages, setPages] = useState<string[] | null>(null);
  const [waiting, setWaiting] = useState(0);
  useEffect(() => {
    void (async () => {
      const keys = 'caches' in window ? await (await caches.open(FIELD_CACHES.pages)).keys() : [];
      setPages(keys.map((k) => new URL(k.url).pathname).filter((p) => /^\/cases\/[^/]+\/field$/.test(p)));
      setWaiting((await listQueued().catch(() => [])).length);
    })();
  }, []);
  if (pages === null) return null;
  return (
    <div className="card space-y-2">
      <p className="font-semibold">{waiting === 0 ? 'Nothing waits to be sent.' : `${waiting} waiting to send.`}</p>
      {pages.length > 0 ? (
        <ul className="space-y-1">
          {pages.map((p) => (
            <li key={p}>
              <a href={p} className="inline-flex min-h-12 items-center">
                Field screen {p.split('/')[2].slice(0, 8)}…
              </a>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-ink-soft">No field screen is kept on this phone yet.</p>
      )}
    </div>
  );
}
