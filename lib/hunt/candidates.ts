import type { Knex } from 'knex';
import type { Polygon } from 'geojson';
import { db } from '@/db';
import { latestFixSnapshot } from '@/db/fixes';
import { buildingsNearRegion } from '@/db/places';
import { ellipsePolygon, whiteningAffine, type Fix } from '@/lib/df';

/** Buildings this close to the region (metres) are listed too, marked outside it. */
export const CANDIDATE_MARGIN_M = 10;
export const CANDIDATE_LIMIT = 60;

export type Candidate = { placeId: string; address: string | null; lat: number; lon: number; insideRegion: boolean; likelihood: number };
export type CandidatesView = {
  items: Candidate[];
  /** How many buildings meet the region in all, also when more than the list holds. */
  insideCount: number;
  /** True when the list stopped at CANDIDATE_LIMIT with more buildings in or near the region. */
  truncated: boolean;
  /** The region the list was cut from, as GeoJSON (for the map); null without a usable fix. */
  region: Polygon | null;
  confidence: number | null;
};

type OkFix = Extract<Fix, { ok: true }>;

/**
 * The fix's 95 % region as a GeoJSON polygon: lib/df's likelihood-ratio region when the fix
 * carries one, otherwise the error ellipse (72 points).
 */
export function fixRegion(fix: OkFix): Polygon {
  const ring = fix.region && fix.region.length >= 4 ? fix.region : ellipsePolygon(fix, fix.ellipse, 72).map(([lat, lon]) => [lon, lat]);
  return { type: 'Polygon', coordinates: [ring] };
}

/**
 * Candidate buildings for a case: those meeting its current 95 % region (and a few just
 * outside), most likely first. `likelihood` is the fix's relative probability density at the
 * footprint's nearest point, exp(-d²/2) for the Mahalanobis distance d: 1 when the footprint holds
 * the fix's centre. Where to listen more closely from public ground; never an accusation.
 */
export async function caseCandidates(caseId: string, q: Knex = db, limit = CANDIDATE_LIMIT): Promise<CandidatesView> {
  const fix = (await latestFixSnapshot(caseId, q))?.result;
  const whitening = fix?.ok ? whiteningAffine(fix, fix.ellipse) : null;
  if (!fix?.ok || !whitening) return { items: [], insideCount: 0, truncated: false, region: null, confidence: null };
  const region = fixRegion(fix);
  // One more than the list holds tells whether the list is cut short.
  const { rows, insideTotal } = await buildingsNearRegion(region, whitening, { marginM: CANDIDATE_MARGIN_M, limit: limit + 1 }, q);
  const items = rows.slice(0, limit).map(({ mahalanobis, ...r }) => ({ ...r, likelihood: Math.round(Math.exp(-(mahalanobis ** 2) / 2) * 1000) / 1000 }));
  return { items, insideCount: insideTotal, truncated: rows.length > limit, region, confidence: fix.ellipse.confidence };
}
