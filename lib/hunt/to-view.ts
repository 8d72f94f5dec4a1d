import type { BearingWithAuthor } from '@/db/bearings';
import type { CaseEvent } from '@/db/types';
import type { BearingView, EventView, SweepRecord } from './views';

const iso = (d: Date | string) => new Date(d).toISOString();

export function toBearingView(b: BearingWithAuthor): BearingView {
  return {
    id: b.id,
    caseId: b.caseId,
    author: b.authorId ? { id: b.authorId, name: b.authorName ?? '', callSign: b.authorCallSign } : null,
    lat: b.lat,
    lon: b.lon,
    positionSource: b.positionSource,
    positionAccuracyM: b.positionAccuracyM,
    azimuthEnteredDeg: b.azimuthEnteredDeg,
    reference: b.reference,
    declinationDeg: b.declinationDeg,
    azimuthTrueDeg: b.azimuthTrueDeg,
    sigmaDeg: b.sigmaDeg,
    nullWidthDeg: b.nullWidthDeg,
    frequencyKhz: b.frequencyKhz,
    oneWay: b.oneWay,
    note: b.note,
    sweep: (b.sweep as SweepRecord | null) ?? null,
    excluded: b.excluded,
    version: b.version,
    clientId: b.clientId,
    revisions: Number(b.revisions),
    takenAt: iso(b.takenAt),
    createdAt: iso(b.createdAt),
    updatedAt: iso(b.updatedAt),
  };
}

export function toEventView(e: CaseEvent & { actorName: string | null }): EventView {
  return {
    id: String(e.id),
    kind: e.kind,
    data: e.data,
    visibility: e.visibility,
    actor: e.actorId ? { id: e.actorId, name: e.actorName ?? '' } : null,
    createdAt: iso(e.createdAt),
  };
}
