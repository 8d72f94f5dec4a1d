'use client';

import { useMemo } from 'react';
import useSWR from 'swr';
import { fetchJson } from '@/lib/api/client';
import { HUNT_REFRESH_MS } from '@/components/hunt/use-hunt-data';
import type { LevelTrailProps, TrailPoint } from '@/components/map/level-trail-layer';
import { sUnitsToDbm, trailPeak } from '@/lib/df';
import type { QueuedItem } from '@/lib/field/queue';
import type { LevelReadingView } from '@/lib/hunt/readings';
import { levelLabel } from './level-words';

type ReadingsPage = { items: LevelReadingView[]; total: number };
type Raw = { key: string; lat: number; lon: number; levelDbm: number; takenAt: string; pending: boolean; label: string };

/**
 * The walked trail as the map draws it: readings stored on the server (as last loaded) and those
 * still waiting on the phone, in the order taken, each with its smoothed level, and the smoothed
 * peak (lib/df trailPeak). Waiting readings are converted on the phone without the S-meter offset.
 */
export function useLevelTrail(caseId: string, queued: QueuedItem[], enabled: boolean) {
  const q = useSWR<ReadingsPage>(enabled ? `/api/cases/${caseId}/readings` : null, fetchJson, { refreshInterval: HUNT_REFRESH_MS, revalidateOnFocus: true });
  const trail = useMemo<LevelTrailProps & { stored: number; waiting: number }>(() => {
    const stored: Raw[] = (q.data?.items ?? []).map((r) => ({
      key: r.id,
      lat: r.lat,
      lon: r.lon,
      levelDbm: r.levelDbm,
      takenAt: r.takenAt,
      pending: false,
      label: `${levelLabel(r.level)} · ${new Date(r.takenAt).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })}`,
    }));
    const storedIds = new Set((q.data?.items ?? []).map((r) => r.clientId));
    const waiting: Raw[] = queued
      .filter((i) => i.kind === 'reading' && !storedIds.has(i.clientId))
      .map((i) => {
        const b = i.body as { lat: number; lon: number; level: { unit: 'S' | 'dBm'; value: number }; frequencyKhz?: number | null; takenAt: string };
        const dbm = b.level.unit === 'S' ? sUnitsToDbm(b.level.value, 0, (b.frequencyKhz ?? 7000) * 1000) : b.level.value;
        return { key: i.clientId, lat: b.lat, lon: b.lon, levelDbm: dbm, takenAt: b.takenAt, pending: true, label: `${levelLabel(b.level)} · not yet sent` };
      });
    const all = [...stored, ...waiting].sort((a, b) => a.takenAt.localeCompare(b.takenAt));
    const peak = trailPeak(all);
    const points: TrailPoint[] = all.map((r, i) => ({ ...r, smoothedDbm: peak?.smoothedDbm[i] ?? r.levelDbm }));
    return { points, peak: peak && { lat: peak.lat, lon: peak.lon, levelDbm: peak.levelDbm }, stored: stored.length, waiting: waiting.length };
  }, [q.data, queued]);
  return { trail, refresh: q.mutate, loaded: q.data !== undefined };
}
