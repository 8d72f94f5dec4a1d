import type { Knex } from 'knex';
import type { z } from 'zod';
import { findBearingByClientId, insertBearing, reviseBearing, type BearingFields, type BearingWithAuthor } from '@/db/bearings';
import { appendEvent } from '@/db/cases';
import { getProfile } from '@/db/users';
import type { CaseRow, ClubSettings, User } from '@/db/types';
import { fitNullSweep, normalizeDeg360, sUnitsToDbm } from '@/lib/df';
import { resolveSigmaDeg, round, trueAzimuth } from './bearing-math';
import { AppError, conflict, forbidden } from '@/lib/errors';
import type { bearingInputSchema, bearingPatchSchema, sweepInputSchema } from '@/lib/validation/bearings';
import { caseAccess } from './access';
import { recomputeFix } from './fix';
import { sameItemOrConflict } from './readings';
import type { SweepRecord } from './views';

type BearingInput = z.output<typeof bearingInputSchema>;
type BearingPatch = z.output<typeof bearingPatchSchema>;
type SweepInput = z.output<typeof sweepInputSchema>;

const pickStored = (a: ReturnType<typeof trueAzimuth>) => ({ declinationDeg: a.declinationDeg, azimuthTrueDeg: a.azimuthTrueDeg });

function assertAccuracy(accuracyM: number | undefined | null, confirmed: boolean, settings: Pick<ClubSettings, 'maxPositionAccuracyM'>) {
  if (accuracyM != null && accuracyM > settings.maxPositionAccuracyM && !confirmed) {
    throw new AppError(
      422,
      `Your position is only known to about ${Math.round(accuracyM)} m, worse than the club's ${settings.maxPositionAccuracyM} m. ` +
        'Wait for a better fix from your phone, tap your spot on the map, or confirm to use it anyway.',
      { code: 'accuracy-unconfirmed' },
    );
  }
}

function assertMayHunt(user: User, row: CaseRow) {
  if (!caseAccess(user, row).hunt) throw forbidden('Only the assigned hunter or a coordinator can add bearings to this case, while it is being hunted.');
}

type Position = Pick<BearingInput, 'clientId' | 'lat' | 'lon' | 'positionSource' | 'positionAccuracyM' | 'accuracyConfirmed' | 'takenAt' | 'frequencyKhz' | 'note'>;

async function saveNewBearing(
  trx: Knex.Transaction,
  user: User,
  row: CaseRow,
  settings: ClubSettings,
  p: Position,
  line: { enteredDeg: number; reference: 'true' | 'magnetic'; sigmaDeg: number; nullWidthDeg?: number; oneWay: boolean; sweep?: SweepRecord },
  kind: 'bearing-added' | 'sweep-added',
): Promise<{ id: string; repeat: boolean }> {
  assertMayHunt(user, row);
  assertAccuracy(p.positionAccuracyM, p.accuracyConfirmed, settings);
  const takenAt = p.takenAt ? new Date(p.takenAt) : new Date();
  const az = trueAzimuth(line.enteredDeg, line.reference, p.lat, p.lon, takenAt);
  const fields: BearingFields = {
    lat: p.lat,
    lon: p.lon,
    positionSource: p.positionSource,
    positionAccuracyM: p.positionAccuracyM ?? null,
    azimuthEnteredDeg: normalizeDeg360(line.enteredDeg),
    reference: line.reference,
    declinationDeg: az.declinationDeg,
    azimuthTrueDeg: az.azimuthTrueDeg,
    sigmaDeg: line.sigmaDeg,
    nullWidthDeg: line.nullWidthDeg ?? null,
    frequencyKhz: p.frequencyKhz ?? null,
    oneWay: line.oneWay,
    note: p.note,
    takenAt,
    sweep: line.sweep ?? null,
    clientId: p.clientId ?? null,
  };
  const id = await insertBearing(trx, row.id, user.id, fields);
  await appendEvent(trx, {
    caseId: row.id,
    actorId: user.id,
    kind,
    data: { bearingId: id, azimuthTrueDeg: az.azimuthTrueDeg, sigmaDeg: line.sigmaDeg, reference: line.reference, oneWay: line.oneWay },
  });
  await recomputeFix(trx, row.id, `${kind} ${id}`);
  return { id, repeat: false };
}

/** The bearing this caller already stored under the input's client id in this case (a retried send), or null. */
async function earlierSend(trx: Knex.Transaction, user: User, row: CaseRow, clientId: string | undefined) {
  return clientId ? sameItemOrConflict(await findBearingByClientId(clientId, trx), user, row.id) : null;
}

/**
 * Adds a typed bearing. A repeat of one already stored (same clientId) stores nothing and
 * answers the stored bearing (`repeat: true`). Call with the case row locked.
 */
export async function addBearing(trx: Knex.Transaction, user: User, row: CaseRow, settings: ClubSettings, input: BearingInput) {
  const before = await earlierSend(trx, user, row, input.clientId);
  if (before) return { id: before.id, repeat: true };
  return saveNewBearing(
    trx,
    user,
    row,
    settings,
    input,
    { enteredDeg: input.azimuthDeg, reference: input.reference, sigmaDeg: resolveSigmaDeg(input), nullWidthDeg: input.nullWidthDeg, oneWay: input.oneWay },
    'bearing-added',
  );
}

/**
 * A rotation sweep becomes a two-way bearing: levels (dBm, or S-units at the frequency) are
 * corrected by the hunter's S-meter offset, fitted with the small-loop model, and the null axis
 * converted to true like any typed bearing.
 */
export async function addSweep(trx: Knex.Transaction, user: User, row: CaseRow, settings: ClubSettings, input: SweepInput) {
  const before = await earlierSend(trx, user, row, input.clientId);
  if (before) {
    // The same fit again from the stored levels (deterministic), so the repeat answers the same body.
    const stored = before.sweep as SweepRecord;
    const fit = fitNullSweep(stored.samples.map((s) => ({ azimuthDeg: s.azimuthDeg, levelDbm: s.levelDbm })));
    return { id: before.id, repeat: true, sweepFit: fit };
  }
  assertMayHunt(user, row);
  const offset = (await getProfile(user.id, trx))?.sMeterOffsetDb ?? 0;
  const hz = (input.frequencyKhz ?? 7000) * 1000;
  const samples = input.samples.map((s) => {
    // S-units at 6 dB each (IARU Region 1); readings past S9 continue the same scale (S9+12 dB = 11).
    const reading = input.levelUnit === 'S' ? sUnitsToDbm(s.level, 0, hz) : s.level;
    return { azimuthDeg: s.azimuthDeg, level: s.level, levelDbm: round(reading - offset, 3) };
  });
  const fit = fitNullSweep(samples.map((s) => ({ azimuthDeg: s.azimuthDeg, levelDbm: s.levelDbm })));
  if (!fit.ok) throw new AppError(422, fit.message, { code: 'sweep-fit-failed', reason: fit.reason });
  const sweep: SweepRecord = { levelUnit: input.levelUnit, samples, fit: { nullAzimuthDeg: fit.nullAzimuthDeg, sigmaDeg: fit.sigmaDeg, nullDepthDb: fit.nullDepthDb, rmsResidualDb: fit.rmsResidualDb } };
  const saved = await saveNewBearing(
    trx,
    user,
    row,
    settings,
    input,
    { enteredDeg: fit.nullAzimuthDeg, reference: input.reference, sigmaDeg: Math.max(fit.sigmaDeg, 0.5), oneWay: false, sweep },
    'sweep-added',
  );
  return { ...saved, sweepFit: fit };
}

/** Edits or excludes/includes a bearing; the earlier state is kept as a revision. */
export async function editBearing(
  trx: Knex.Transaction,
  user: User,
  row: CaseRow,
  settings: ClubSettings,
  before: BearingWithAuthor,
  patch: BearingPatch,
) {
  const a = caseAccess(user, row);
  if (!a.hunt || !(a.committee || before.authorId === user.id)) throw forbidden('Only the bearing’s author or a coordinator can change it.');
  if (patch.version !== before.version) {
    throw conflict(`This bearing was changed by someone else after you loaded it (now version ${before.version}). Reload and try again.`, {
      currentVersion: before.version,
    });
  }
  const { version: _v, accuracyConfirmed, excluded, azimuthDeg, quality, sigmaDeg, nullWidthDeg, ...rest } = patch;
  if (rest.positionAccuracyM !== undefined) assertAccuracy(rest.positionAccuracyM, accuracyConfirmed ?? false, settings);
  const lat = rest.lat ?? before.lat;
  const lon = rest.lon ?? before.lon;
  const reference = rest.reference ?? before.reference;
  const entered = azimuthDeg ?? before.azimuthEnteredDeg;
  const takenAt = rest.takenAt ? new Date(rest.takenAt) : before.takenAt;
  const geometryChanged = [azimuthDeg, rest.reference, rest.lat, rest.lon, rest.takenAt].some((v) => v !== undefined);
  const sigmaChanged = [quality, sigmaDeg, nullWidthDeg].some((v) => v !== undefined);
  const fields: BearingFields = {
    ...rest,
    takenAt,
    excluded,
    ...(geometryChanged ? { azimuthEnteredDeg: normalizeDeg360(entered), ...pickStored(trueAzimuth(entered, reference, lat, lon, new Date(takenAt))) } : {}),
    ...(sigmaChanged ? { sigmaDeg: resolveSigmaDeg({ quality, sigmaDeg, nullWidthDeg }), nullWidthDeg: nullWidthDeg ?? null } : {}),
  };
  await reviseBearing(trx, before, user.id, fields);
  const kind = excluded === true && !before.excluded ? 'bearing-excluded' : excluded === false && before.excluded ? 'bearing-included' : 'bearing-edited';
  await appendEvent(trx, { caseId: row.id, actorId: user.id, kind, data: { bearingId: before.id, fromVersion: before.version } });
  return recomputeFix(trx, row.id, `${kind} ${before.id}`);
}
