'use client';

import useSWR from 'swr';
import { useState } from 'react';
import { fetchJson } from '@/lib/api/client';
import type { CaseDetail, PersonRef } from '@/lib/hunt/views';
import { ActionMessageBox } from '@/components/ui/action-message';
import { useCaseAction } from '@/components/hunt/use-case-action';
import { CardSection } from './card-section';

const personWords = (p: PersonRef) => (p.callSign ? `${p.name} (${p.callSign})` : p.name);

/** Who hunts this case; a coordinator picks a hunter (or nobody). */
export function AssignmentCard({ c, refresh }: { c: CaseDetail; refresh: () => Promise<unknown> }) {
  const hunters = useSWR<{ items: PersonRef[] }>(c.can.assign ? '/api/people/hunters' : null, fetchJson);
  const [choice, setChoice] = useState<string | null>(null);
  const action = useCaseAction(refresh);
  const current = c.assignee?.id ?? '';
  const selected = choice ?? current;
  const options = [...(hunters.data?.items ?? [])];
  if (c.assignee && !options.some((h) => h.id === c.assignee!.id)) options.unshift(c.assignee);

  async function save() {
    const assigneeId = selected === '' ? null : selected;
    const name = options.find((h) => h.id === assigneeId);
    const r = await action.run(`/api/cases/${c.id}`, { method: 'PATCH', body: { version: c.version, assigneeId } }, name ? `Assigned to ${personWords(name)}.` : 'Nobody is assigned now.');
    if (r.ok || r.status === 409) setChoice(null);
  }

  return (
    <CardSection id="assignment" title="Hunter" testId="assignment">
      <p data-testid="assignee">{c.assignee ? personWords(c.assignee) : 'Nobody is assigned yet.'}</p>
      <ActionMessageBox message={action.message} />
      {c.can.assign && (
        <div className="flex flex-wrap items-end gap-2">
          <div className="min-w-0 flex-1">
            <label htmlFor="assignee-select" className="label">
              Assign to
            </label>
            <select id="assignee-select" className="field" value={selected} onChange={(e) => setChoice(e.target.value)} disabled={hunters.isLoading}>
              <option value="">Nobody (unassigned)</option>
              {options.map((h) => (
                <option key={h.id} value={h.id}>
                  {personWords(h)}
                </option>
              ))}
            </select>
            {hunters.error && <p className="mt-1 text-sm font-semibold text-alarm-600">The list of hunters could not be loaded: {hunters.error.message}</p>}
          </div>
          <button type="button" className="btn-primary" onClick={save} disabled={action.busy || selected === current}>
            {action.busy ? 'Saving…' : 'Save'}
          </button>
        </div>
      )}
    </CardSection>
  );
}
