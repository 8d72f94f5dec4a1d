'use client';

import { useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { callApi } from '@/lib/api/client';

/** The person's saved views of the queue: open one, save the current one under a name, remove one. */
export function SavedViews({ saved, current }: { saved: { id: string; name: string; query: string }[]; current: string }) {
  const router = useRouter();
  const [name, setName] = useState('');
  const [error, setError] = useState<string | null>(null);
  async function save() {
    const r = await callApi('/api/saved-filters', { body: { name, query: current } });
    if (!r.ok) return setError(r.issues?.[0]?.message ?? r.error);
    setError(null);
    setName('');
    router.refresh();
  }
  async function remove(id: string) {
    const r = await callApi(`/api/saved-filters/${id}`, { method: 'DELETE' });
    if (!r.ok) return setError(r.error);
    router.refresh();
  }
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm" aria-label="Saved views">
      <span className="font-semibold">Saved views:</span>
      {saved.length === 0 && <span className="text-ink-faint">none yet</span>}
      {saved.map((s) => (
        <span key={s.id} className="inline-flex items-center gap-1 rounded-full border border-ink/20 bg-white px-2 py-0.5">
          <Link href={`/cases${s.query ? `?${s.query}` : ''}`}>{s.name}</Link>
          <button type="button" aria-label={`Remove the view ${s.name}`} onClick={() => remove(s.id)} className="text-ink-faint">
            ×
          </button>
        </span>
      ))}
      <label htmlFor="view-name" className="sr-only">Name for this view</label>
      <input id="view-name" className="field w-40" placeholder="name this view" value={name} onChange={(e) => setName(e.target.value)} />
      <button type="button" className="btn-quiet" disabled={!name.trim()} onClick={save}>
        Save view
      </button>
      {error && <span role="alert" className="text-alarm-600">{error}</span>}
    </div>
  );
}
