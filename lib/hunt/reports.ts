import type { Knex } from 'knex';
import type { z } from 'zod';
import { appendEvent, findNearbyOpenCase, insertCase } from '@/db/cases';
import type { CaseRow, User } from '@/db/types';
import { sUnitsToDbm } from '@/lib/df';
import type { reportSchema } from '@/lib/validation/cases';
import { bandOf, toKhz } from './bands';
import type { ReportData } from './views';

type Report = z.output<typeof reportSchema>;

/** A report within this distance of an open case sharing a band is flagged as a likely duplicate. */
export const DUPLICATE_RADIUS_M = 500;

/** The level as dBm: S-units use IARU Region 1 (S9 = −73 dBm below 30 MHz, −93 dBm above; 6 dB per unit). */
export function reportedLevelDbm(level: Report['level'], firstKhz: number): number | null {
  if (!level) return null;
  return level.unit === 'dBm' ? level.dbm : sUnitsToDbm(level.sUnits, level.overDb, firstKhz * 1000);
}

/** Files a noise report as a new open case; flags a likely duplicate for the coordinators. */
export async function fileReport(trx: Knex.Transaction, user: User, r: Report): Promise<{ row: CaseRow; duplicateOf?: { id: string; reference: string; title: string } }> {
  const frequenciesKhz = r.frequencies.map((f) => toKhz(f.value, f.unit));
  const bands = [...new Set(frequenciesKhz.map(bandOf))];
  const report: ReportData = {
    sound: r.sound,
    soundNote: r.soundNote,
    frequenciesKhz,
    levelDbm: reportedLevelDbm(r.level, frequenciesKhz[0]),
    schedule: r.schedule,
  };
  const duplicateOf = await findNearbyOpenCase(trx, { lat: r.position.lat, lon: r.position.lon, bands, radiusM: DUPLICATE_RADIUS_M });
  const row = await insertCase(trx, {
    title: r.title,
    description: r.description,
    reporterId: user.id,
    reportedLat: r.position.lat,
    reportedLon: r.position.lon,
    bands,
    report: { ...report, positionSource: r.position.source, positionAccuracyM: r.position.accuracyM ?? null },
    consentShareName: r.consentShareName,
    possibleDuplicateOf: duplicateOf?.id ?? null,
  });
  await appendEvent(trx, { caseId: row.id, actorId: user.id, kind: 'reported', data: { title: r.title, bands }, visibility: 'all' });
  if (duplicateOf) {
    const data = { otherCaseId: duplicateOf.id, otherReference: duplicateOf.reference, newCaseId: row.id, newReference: row.reference, radiusM: DUPLICATE_RADIUS_M };
    // `reference` names the other case, as each timeline reads it.
    await appendEvent(trx, { caseId: row.id, actorId: null, kind: 'duplicate-flagged', data: { ...data, reference: duplicateOf.reference } });
    await appendEvent(trx, { caseId: duplicateOf.id, actorId: null, kind: 'duplicate-flagged', data: { ...data, reference: row.reference } });
  }
  return { row, duplicateOf };
}
