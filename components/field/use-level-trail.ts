'use client';

import { useMemo } from 'react';
import useSWR from 'swr';
import { fetchJson } from '@/lib/api/client';
import { HUNT_REFRESH_MS } from '@/components/hunt/use-hunt-data';
import type { LevelTrailProps, TrailPoint, TrailSource } from '@/components/map/level-trail-layer';
import { sUnitsToDbm, trailPeak } from '@/lib/df';
import type { QueuedItem } from '@/lib/field/queue';
import type { LevelReadingView } from '@/lib/hunt/readings';
import { strongestPoint } from '@/lib/survey/strongest-point';
import { levelLabel } from './level-words';

type ReadingsPage = { items: LevelReadingView[]; total: number };
type Raw = { key: string; source: TrailSource; lat: number; lon: number; level: LevelReadingView['level']; levelDbm: number; takenAt: string; pending: boolean; label: string };

const SOURCES: TrailSource[] = ['walk', 'gpx'];
const timeWords = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

/** Readings of one source, in the order taken, as one trail: smoothed levels, smoothed peak, strongest raw reading. */
function trailOf(source: TrailSource, raw: Raw[]): LevelTrailProps {
  const all = raw.filter((r) => r.source === source).sort((a, b) => a.takenAt.localeCompare(b.takenAt));
  const peak = trailPeak(all);
  const points: TrailPoint[] = all.map((r, i) => ({ key: r.key, lat: r.lat, lon: r.lon, levelDbm: r.levelDbm, pending: r.pending, label: r.label, smoothedDbm: peak?.smoothedDbm[i] ?? r.levelDbm }));
  const top = strongestPoint(all, (r) => r.levelDbm);
  return {
    source,
    points,
    peak: peak && { lat: peak.lat, lon: peak.lon, levelDbm: peak.levelDbm },
    strongest: top && { lat: top.lat, lon: top.lon, levelDbm: top.levelDbm, level: top.level, takenAt: top.takenAt },
  };
}

/** The walk's address (shared with "Prepare for the field"). */
export const readingsUrl = (caseId: string) => `/api/cases/${caseId}/readings`;

/**
 * The level trails as the map draws them, one per source (the walk, imported surveys): readings
 * stored on the server (as last loaded) and those still waiting on the phone (always the walk),
 * each trail in the order taken with its smoothed levels and peak (lib/df trailPeak) and its
 * strongest single reading. Waiting readings are converted on the phone without the S-meter offset.
 */
export function useLevelTrails(caseId: string, queued: QueuedItem[], enabled: boolean) {
  const q = useSWR<ReadingsPage>(enabled ? readingsUrl(caseId) : null, fetchJson, { refreshInterval: HUNT_REFRESH_MS, revalidateOnFocus: true });
  const trails = useMemo(() => {
    const stored: Raw[] = (q.data?.items ?? []).map((r) => ({
      key: r.id,
      source: r.source,
      lat: r.lat,
      lon: r.lon,
      level: r.level,
      levelDbm: r.levelDbm,
      takenAt: r.takenAt,
      pending: false,
      label: `${levelLabel(r.level)} · ${timeWords(r.takenAt)}`,
    }));
    const storedIds = new Set((q.data?.items ?? []).map((r) => r.clientId));
    const waiting: Raw[] = queued
      .filter((i) => i.kind === 'reading' && !storedIds.has(i.clientId))
      .map((i) => {
        const b = i.body as { lat: number; lon: number; level: { unit: 'S' | 'dBm'; value: number }; frequencyKhz?: number | null; takenAt: string };
        const dbm = b.level.unit === 'S' ? sUnitsToDbm(b.level.value, 0, (b.frequencyKhz ?? 7000) * 1000) : b.level.value;
        return { key: i.clientId, source: 'walk' as const, lat: b.lat, lon: b.lon, level: b.level, levelDbm: dbm, takenAt: b.takenAt, pending: true, label: `${levelLabel(b.level)} · not yet sent` };
      });
    return SOURCES.map((s) => trailOf(s, [...stored, ...waiting])).filter((t) => t.points.length > 0);
  }, [q.data, queued]);
  const walk = trails.find((t) => t.source === 'walk') ?? null;
  return { trails, walk, refresh: q.mutate, loaded: q.data !== undefined };
}
