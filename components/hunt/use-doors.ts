'use client';

import { useMemo, useState } from 'react';
import useSWR from 'swr';
import { fetchJson } from '@/lib/api/client';
import type { PlaceFeature } from '@/db/places';
import type { Premises } from '@/db/premises';
import type { Candidate, CandidatesView } from '@/lib/hunt/candidates';
import type { FixView } from '@/lib/hunt/views';
import type { MapFocus } from '@/components/map/fly-to';
import type { PlacesHighlight } from '@/components/map/places-layer';

/** A building (or a point) the hunter is about to confirm as the premises. */
export type PremisesTarget = { placeId: string | null; address: string; lat: number | null; lon: number | null };

/** Zoom at which a single house and its number are easy to see. */
const HOUSE_ZOOM = 18;

/** The addresses the doors read for a fix (its snapshot id, or none): shared with "Prepare for the field". */
export const doorsUrls = (caseId: string, fixId: string | null | undefined) => ({
  candidates: `/api/cases/${caseId}/candidates?fix=${fixId ?? 'none'}`,
  premises: `/api/cases/${caseId}/premises`,
});

/**
 * From a fix to a door: the case's candidate houses and confirmed premises, and what the map needs
 * to show them (highlight, picking a building, moving to a house). One hook for the case page and
 * the field screen.
 */
export function useDoors(caseId: string, fix: FixView | undefined, canConfirm: boolean) {
  const urls = doorsUrls(caseId, fix?.current?.id);
  const candidates = useSWR<CandidatesView>(fix ? urls.candidates : null, fetchJson, { revalidateOnFocus: false });
  const premises = useSWR<{ premises: Premises | null }>(urls.premises, fetchJson);
  const [target, setTarget] = useState<PremisesTarget | null>(null);
  const [focus, setFocus] = useState<MapFocus | null>(null);

  const candidateIds = useMemo(() => new Set((candidates.data?.items ?? []).filter((c) => c.insideRegion).map((c) => c.placeId)), [candidates.data]);
  const show = (c: { lat: number; lon: number; placeId?: string | null }) => {
    setFocus({ lat: c.lat, lon: c.lon, zoom: HOUSE_ZOOM, key: `${c.placeId ?? ''}${Date.now()}` });
    // On a phone the list is below the map: bring the map back into view.
    document.querySelector('[data-testid="case-map"]')?.scrollIntoView({ block: 'center' });
  };
  const pick = (c: Candidate) => {
    setTarget({ placeId: c.placeId, address: c.address ?? '', lat: c.lat, lon: c.lon });
    show(c);
  };

  const highlight: PlacesHighlight = {
    candidateIds,
    premisesPlaceId: premises.data?.premises?.placeId ?? null,
    pickedPlaceId: target?.placeId ?? null,
    onPick: canConfirm
      ? (f: PlaceFeature) => {
          if (f.properties.kind !== 'building') return;
          setTarget({ placeId: f.id, address: f.properties.address ?? '', lat: null, lon: null });
        }
      : undefined,
  };

  return {
    caseId,
    candidates: candidates.data,
    candidatesError: candidates.error as Error | undefined,
    premises: premises.data?.premises ?? null,
    target,
    setTarget,
    focus,
    show,
    pick,
    highlight,
    refreshPremises: () => premises.mutate(),
  };
}
export type Doors = ReturnType<typeof useDoors>;
