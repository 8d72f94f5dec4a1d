'use client';

import useSWR from 'swr';
import { fetchJson } from '@/lib/api/client';
import type { Page } from '@/lib/api/paging';
import type { BearingView, CaseDetail, EventView, FixView } from '@/lib/hunt/views';

/** How often open screens look for lines another hunter added (milliseconds). */
export const HUNT_REFRESH_MS = 5000;

/** The case, its bearings and its current fix, refreshed while the screen is open and when it regains focus. */
export function useHuntData(caseId: string, opts: { seeHunt?: boolean } = {}) {
  const seeHunt = opts.seeHunt ?? true;
  const caseQ = useSWR<CaseDetail>(`/api/cases/${caseId}`, fetchJson, { refreshInterval: HUNT_REFRESH_MS, revalidateOnFocus: true });
  const bearingsQ = useSWR<Page<BearingView>>(seeHunt ? `/api/cases/${caseId}/bearings` : null, fetchJson, {
    refreshInterval: HUNT_REFRESH_MS,
    revalidateOnFocus: true,
  });
  const fixQ = useSWR<FixView>(seeHunt ? `/api/cases/${caseId}/fix` : null, fetchJson, { refreshInterval: HUNT_REFRESH_MS, revalidateOnFocus: true });
  const refresh = async () => {
    await Promise.all([caseQ.mutate(), bearingsQ.mutate(), fixQ.mutate()]);
  };
  return {
    caseDetail: caseQ.data,
    bearings: bearingsQ.data?.items,
    fix: fixQ.data,
    error: caseQ.error ?? bearingsQ.error ?? fixQ.error,
    isLoading: caseQ.isLoading || bearingsQ.isLoading || fixQ.isLoading,
    refresh,
  };
}

export function useCaseEvents(caseId: string) {
  return useSWR<EventView[]>(`/api/cases/${caseId}/events`, async (url: string) => (await fetchJson<{ items: EventView[] }>(url)).items, {
    refreshInterval: HUNT_REFRESH_MS,
  });
}
