/**
 * The places layer without a connection: the map asks /api/places for the box it shows, which is
 * rarely the very box an earlier answer was kept for ("Prepare for the field" keeps the area around
 * the fix; the map kept the views it showed). The service worker then answers from every kept
 * answer whose box overlaps the one asked for, features joined once each. Pure, no imports: the
 * worker bundles it.
 */

export type Box = { west: number; south: number; east: number; north: number };

/** The `bbox=west,south,east,north` of a /api/places URL, or null when it has none that reads. */
export function placesBox(url: string): Box | null {
  let raw: string | null;
  try {
    raw = new URL(url, 'http://x.invalid').searchParams.get('bbox');
  } catch {
    return null;
  }
  if (!raw) return null;
  const parts = raw.split(',').map((p) => Number(p.trim()));
  if (parts.length !== 4 || !parts.every(Number.isFinite)) return null;
  const [west, south, east, north] = parts;
  return west < east && south < north ? { west, south, east, north } : null;
}

/** True when two boxes share some ground (touching edges do not count). */
export function boxesOverlap(a: Box, b: Box): boolean {
  return a.west < b.east && b.west < a.east && a.south < b.north && b.south < a.north;
}

type Feature = { id?: string | number };
export type KeptPlacesAnswer = { box: Box; storedAt: string | null; body: { features?: Feature[]; truncated?: boolean; cap?: number; attribution?: string[] } };

/**
 * One answer for `wanted` from the kept answers that overlap it: each feature once (by id), in the
 * order kept, at most `cap` (the API's own cap when the answers say it); every credit the answers
 * carry (an OpenStreetMap licence notice must stay with its data offline too); `storedAt` the oldest
 * of the answers used. Null when none overlaps.
 */
export function joinKeptPlaces(wanted: Box, kept: KeptPlacesAnswer[]): { body: { type: 'FeatureCollection'; features: Feature[]; truncated: boolean; cap?: number; attribution: string[] }; storedAt: string | null; used: number } | null {
  const used = kept.filter((k) => boxesOverlap(k.box, wanted));
  if (!used.length) return null;
  const cap = used.map((k) => k.body.cap).find((c): c is number => typeof c === 'number' && c > 0);
  const seen = new Set<string | number>();
  const features: Feature[] = [];
  let truncated = used.some((k) => k.body.truncated === true);
  for (const k of used) {
    for (const f of k.body.features ?? []) {
      if (f.id !== undefined && seen.has(f.id)) continue;
      if (cap !== undefined && features.length >= cap) {
        truncated = true;
        break;
      }
      if (f.id !== undefined) seen.add(f.id);
      features.push(f);
    }
  }
  const times = used.map((k) => k.storedAt).filter((t): t is string => !!t).sort();
  const attribution = [...new Set(used.flatMap((k) => k.body.attribution ?? []))];
  return { body: { type: 'FeatureCollection', features, truncated, ...(cap !== undefined ? { cap } : {}), attribution }, storedAt: times[0] ?? null, used: used.length };
}
