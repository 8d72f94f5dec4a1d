'use client';

import useSWR from 'swr';
import { useState } from 'react';
import { callApi, fetchJson } from '@/lib/api/client';
import type { Page } from '@/lib/api/paging';
import { ROLES, type User } from '@/db/types';
import { NoticeBox } from '@/components/ui/notice-box';

export function PeopleTable({ myId }: { myId: string }) {
  const { data, error, mutate } = useSWR<Page<User>>('/api/users?pageSize=100', fetchJson);
  const [problem, setProblem] = useState<string | null>(null);

  async function change(id: string, patch: Partial<Pick<User, 'role' | 'active'>>) {
    setProblem(null);
    const r = await callApi(`/api/users/${id}`, { method: 'PATCH', body: patch });
    if (!r.ok) setProblem(r.error);
    await mutate();
  }

  if (error) return <NoticeBox tone="error">{error.message}</NoticeBox>;
  if (!data) return <p aria-busy="true">Loading…</p>;
  return (
    <div className="space-y-3">
      {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
      <div className="overflow-x-auto">
        <table className="w-full min-w-[34rem] border-collapse text-left text-sm">
          <caption className="sr-only">People with an account</caption>
          <thead>
            <tr className="border-b border-ink/20">
              <th className="p-2">Name</th>
              <th className="p-2">E-mail</th>
              <th className="p-2">Call sign</th>
              <th className="p-2">Role</th>
              <th className="p-2">Account</th>
            </tr>
          </thead>
          <tbody>
            {data.items.map((u) => (
              <tr key={u.id} className={`border-b border-ink/10 ${u.active ? '' : 'text-ink-faint'}`}>
                <td className="p-2 font-semibold">{u.name}</td>
                <td className="p-2">{u.email}</td>
                <td className="p-2 font-mono">{u.callSign ?? '—'}</td>
                <td className="p-2">
                  <label className="sr-only" htmlFor={`role-${u.id}`}>
                    Role of {u.name}
                  </label>
                  <select id={`role-${u.id}`} className="field min-h-10 py-1" value={u.role} onChange={(e) => change(u.id, { role: e.target.value as User['role'] })}>
                    {ROLES.map((r) => (
                      <option key={r}>{r}</option>
                    ))}
                  </select>
                </td>
                <td className="p-2">
                  <button
                    type="button"
                    className={u.active ? 'btn-quiet min-h-10 py-1' : 'btn-primary min-h-10 py-1'}
                    disabled={u.id === myId}
                    onClick={() => change(u.id, { active: !u.active })}
                  >
                    {u.active ? 'Deactivate' : 'Reactivate'}
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
