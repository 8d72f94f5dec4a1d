'use client';

import { useEffect, useState } from 'react';
import { ANSWER_EVENT, type AnswerDetail } from '@/lib/api/client';

const when = (iso: string) =>
  new Date(iso).toLocaleString([], { hour: '2-digit', minute: '2-digit', day: 'numeric', month: 'short' });

/**
 * Says plainly when the screen shows the phone's copy instead of fresh data: "Offline — showing
 * what was last loaded at 05:41, 2 Dec". Listens to every answer for URLs under `prefix`; the
 * oldest copy in use is the time shown.
 */
export function OfflineCopyNotice({ prefix }: { prefix: string }) {
  const [copies, setCopies] = useState<Record<string, string>>({});
  const [offline, setOffline] = useState(false);
  useEffect(() => {
    setOffline(!navigator.onLine);
    const onAnswer = (e: Event) => {
      const { url, storedAt } = (e as CustomEvent<AnswerDetail>).detail;
      if (!url.startsWith(prefix)) return;
      setCopies((c) => {
        if (storedAt) return c[url] === storedAt ? c : { ...c, [url]: storedAt };
        if (!(url in c)) return c;
        const { [url]: _gone, ...rest } = c;
        return rest;
      });
    };
    const on = () => setOffline(false);
    const off = () => setOffline(true);
    window.addEventListener(ANSWER_EVENT, onAnswer);
    window.addEventListener('online', on);
    window.addEventListener('offline', off);
    return () => {
      window.removeEventListener(ANSWER_EVENT, onAnswer);
      window.removeEventListener('online', on);
      window.removeEventListener('offline', off);
    };
  }, [prefix]);
  const times = Object.values(copies).sort();
  if (!times.length && !offline) return null;
  return (
    <div role="status" className="rounded-lg border-2 border-flare-700 bg-flare-100 px-3 py-2 text-ink" data-testid="offline-copy">
      <p className="font-bold">{offline ? 'No connection' : 'Connection unsteady'}</p>
      <p>
        {times.length
          ? `Showing what was last loaded at ${when(times[0])}. New lines from others appear when the connection returns.`
          : 'Nothing here has been loaded on this phone yet.'}
      </p>
    </div>
  );
}
