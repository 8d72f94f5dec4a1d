'use client';

import useSWR from 'swr';
import { fetchJson } from '@/lib/api/client';
import type { Page } from '@/lib/api/paging';
import type { BearingView, CaseDetail, EventView, FixView } from '@/lib/hunt/views';

/** How often open screens look for lines another hunter added (milliseconds). */
export const HUNT_REFRESH_MS = 5000;

/** The addresses the hunt screens read (the same ones "Prepare for the field" loads, so the service worker's copies match). */
export const huntDataUrls = (caseId: string) => ({ case: `/api/cases/${caseId}`, bearings: `/api/cases/${caseId}/bearings`, fix: `/api/cases/${caseId}/fix` });

/** The case, its bearings and its current fix, refreshed while the screen is open and when it regains focus. */
export function useHuntData(caseId: string, opts: { seeHunt?: boolean } = {}) {
  const seeHunt = opts.seeHunt ?? true;
  const urls = huntDataUrls(caseId);
  const caseQ = useSWR<CaseDetail>(urls.case, fetchJson, { refreshInterval: HUNT_REFRESH_MS, revalidateOnFocus: true });
  const bearingsQ = useSWR<Page<BearingView>>(seeHunt ? urls.bearings : null, fetchJson, {
    refreshInterval: HUNT_REFRESH_MS,
    revalidateOnFocus: true,
  });
  const fixQ = useSWR<FixView>(seeHunt ? urls.fix : null, fetchJson, { refreshInterval: HUNT_REFRESH_MS, revalidateOnFocus: true });
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
