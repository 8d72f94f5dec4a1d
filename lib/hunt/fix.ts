import type { Knex } from 'knex';
import { distance } from '@turf/turf';
import { db } from '@/db';
import { getBearing, listBearings, type BearingWithAuthor } from '@/db/bearings';
import { fixTrail, insertFixSnapshot, latestFixSnapshot } from '@/db/fixes';
import { loopCircumferences } from '@/db/users';
import { getClubSettings } from '@/db/settings';
import { declinationInfo, estimateFix, sanityWarnings, suggestNextSpots, type Fix } from '@/lib/df';
import { notFound } from '@/lib/errors';
import { toBearingView } from './to-view';
import { nextSpotOptions, toLines } from './bearing-math';
import type { BearingView, FixView } from './views';

/** Recomputes the case's fix from its active bearings and keeps a snapshot (the history of the estimate). */
export async function recomputeFix(trx: Knex.Transaction, caseId: string, cause: string): Promise<Fix> {
  const lines = toLines(await listBearings(caseId, trx));
  const fix = estimateFix(lines);
  await insertFixSnapshot(trx, caseId, cause, lines.length, fix);
  return fix;
}

/** Plain-language warnings about each active line's setup: the magnetic model's validity, loop size for its frequency, near field. */
async function setupWarnings(q: Knex, bearings: BearingWithAuthor[], fix: Fix | undefined): Promise<string[]> {
  const loops = await loopCircumferences([...new Set(bearings.map((b) => b.authorId).filter((x): x is string => !!x))], q);
  const out = new Set<string>();
  for (const b of bearings) {
    if (b.excluded) continue;
    // The magnetic model's own caution (outside its validity window), for each magnetic line it converted.
    const model = b.reference === 'magnetic' ? declinationInfo(b.lat, b.lon, new Date(b.takenAt)).warning : undefined;
    if (model) out.add(`${b.authorName ?? 'A hunter'}'s line at ${b.azimuthTrueDeg.toFixed(1)}°: ${model}`);
    if (!b.frequencyKhz) continue;
    const distanceM = fix?.ok ? distance([b.lon, b.lat], [fix.lon, fix.lat], { units: 'meters' }) : undefined;
    for (const w of sanityWarnings({ frequencyHz: b.frequencyKhz * 1000, loopCircumferenceM: b.authorId ? loops.get(b.authorId) : undefined, distanceM })) {
      out.add(`${b.authorName ?? 'A hunter'}'s line at ${b.azimuthTrueDeg.toFixed(1)}°: ${w}`);
    }
  }
  return [...out];
}

/** The current fix, its convergence trail, where to stand next and what to watch out for. */
export async function fixView(caseId: string, q: Knex = db): Promise<FixView> {
  const [latest, trail, bearings, settings] = await Promise.all([latestFixSnapshot(caseId, q), fixTrail(caseId, q), listBearings(caseId, q), getClubSettings(q)]);
  const fix = latest?.result;
  const lines = toLines(bearings);
  const nextSpots = lines.length > 0 ? suggestNextSpots(lines, nextSpotOptions(bearings)) : [];
  const warnings = [...(fix?.ok ? fix.warnings : []), ...(await setupWarnings(q, bearings, fix))];
  return {
    current: latest ? { id: String(latest.id), createdAt: new Date(latest.createdAt).toISOString(), cause: latest.cause, lineCount: latest.lineCount, fix: latest.result } : null,
    trail: trail.map((t) => ({
      id: String(t.id),
      createdAt: new Date(t.createdAt).toISOString(),
      ok: t.ok,
      lat: t.lat,
      lon: t.lon,
      semiMajorM: t.semiMajorM,
      lineCount: t.lineCount,
    })),
    nextSpots,
    warnings,
    locateThresholdM: settings.locateThresholdM,
    locatable: isLocatable(fix, settings.locateThresholdM),
  };
}

/** A fix is good enough to call the case located when its 95 % ellipse semi-major is under the club's threshold. */
export function isLocatable(fix: Fix | undefined, thresholdM: number): boolean {
  return !!fix?.ok && fix.ellipse.confidence >= 0.95 && fix.ellipse.semiMajorM < thresholdM;
}

/** What every bearing write answers with: the bearing as saved and the case's fix after it. */
export async function bearingWithFix(caseId: string, bearingId: string): Promise<{ bearing: BearingView; fix: FixView }> {
  const [b, fix] = await Promise.all([getBearing(caseId, bearingId), fixView(caseId)]);
  if (!b) throw notFound('No such bearing on this case.');
  return { bearing: toBearingView(b), fix };
}
