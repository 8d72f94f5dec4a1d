'use client';

import useSWR from 'swr';
import { useState } from 'react';
import { fetchJson } from '@/lib/api/client';
import { NoticeBox } from '@/components/ui/notice-box';
import type { NoticeItem } from '@/lib/notices/views';
import { ComposeForm } from './compose-form';
import { NoticeCard } from './notice-card';

export type NoticeList = {
  items: NoticeItem[];
  can: { read: boolean; contact: boolean; draft: boolean; decide: boolean };
  caseStatus: string;
};

export function NoticesScreen({ caseId }: { caseId: string }) {
  const list = useSWR<NoticeList>(`/api/cases/${caseId}/notices`, fetchJson, { refreshInterval: (d) => (d?.items.some((n) => n.status === 'queued') ? 2000 : 0) });
  const [openId, setOpenId] = useState<string | null>(null);
  if (list.error) return <NoticeBox tone="error">{list.error.message}</NoticeBox>;
  if (!list.data) return <p role="status">Loading the notices…</p>;
  const { items, can, caseStatus } = list.data;
  const refresh = () => list.mutate();
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <section aria-labelledby="compose-heading" className="card space-y-3">
        <h2 id="compose-heading" className="text-xl font-bold">New notice</h2>
        {caseStatus === 'open' ? (
          <p className="text-ink-soft">Notices are written once the source is located.</p>
        ) : can.draft ? (
          <ComposeForm
            caseId={caseId}
            onCreated={(id) => {
              setOpenId(id);
              refresh();
            }}
          />
        ) : (
          <p className="text-ink-soft">Coordinators write and send the notices; the household’s details stay with them. Tell them what you found in a comment.</p>
        )}
        <p className="text-sm text-ink-soft">
          Keep it friendly: the letter explains and offers help. The club has no authority; the national regulator decides. The reporter’s name
          appears only if they agreed.
        </p>
      </section>
      <section aria-labelledby="list-heading" className="space-y-3">
        <h2 id="list-heading" className="text-xl font-bold">This case’s notices</h2>
        {items.length === 0 && <p className="card text-ink-soft">No notices yet.</p>}
        <ul className="space-y-3" aria-label="Notices">
          {items.map((n) => (
            <li key={n.id}>
              <NoticeCard caseId={caseId} n={n} can={can} open={openId === n.id} onToggle={() => setOpenId(openId === n.id ? null : n.id)} onChanged={refresh} />
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
