import type { Knex } from 'knex';
import { db } from './index';

export type PremisesHow = 'level-peak' | 'switch-off-test' | 'other';
export type Premises = {
  placeId: string | null;
  address: string;
  lat: number;
  lon: number;
  confirmedBy: { id: string; name: string } | null;
  how: PremisesHow;
  note: string;
  confirmedAt: string;
};

/** The premises a hunter confirmed for a case, or null. */
export async function getPremises(caseId: string, q: Knex = db): Promise<Premises | null> {
  const r = await q('case_premises as p')
    .leftJoin('users as u', 'u.id', 'p.confirmed_by')
    .select('p.place_id', 'p.address', 'p.lat', 'p.lon', 'p.how', 'p.note', 'p.confirmed_at', 'u.id as user_id', 'u.name as user_name')
    .where('p.case_id', caseId)
    .first();
  if (!r) return null;
  return {
    placeId: r.place_id,
    address: r.address,
    lat: r.lat,
    lon: r.lon,
    confirmedBy: r.user_id ? { id: r.user_id, name: r.user_name } : null,
    how: r.how,
    note: r.note,
    confirmedAt: new Date(r.confirmed_at).toISOString(),
  };
}

/** Writes (or replaces) the case's confirmed premises in the caller's transaction. */
export async function savePremises(
  trx: Knex.Transaction,
  caseId: string,
  p: { placeId: string | null; address: string; lat: number; lon: number; confirmedBy: string; how: PremisesHow; note: string },
): Promise<void> {
  const row = { place_id: p.placeId, address: p.address, lat: p.lat, lon: p.lon, confirmed_by: p.confirmedBy, how: p.how, note: p.note, confirmed_at: trx.fn.now() };
  await trx('case_premises').insert({ case_id: caseId, ...row }).onConflict('case_id').merge(row);
}

/** Same household, other cases: premises within this many metres count as one when no place is known. */
export const SAME_PREMISES_M = 8;

/**
 * Other unresolved cases with a notice to the same household as this case's confirmed
 * premises: the same building from the places layer when known, else premises within
 * SAME_PREMISES_M metres.
 */
export async function noticesAtPremisesElsewhere(caseId: string, q: Knex = db): Promise<{ caseId: string; reference: string; title: string; status: string }[]> {
  const { rows } = await q.raw(
    `select distinct on (c.id) c.id as "caseId", c.reference, c.title, n.status
       from case_premises mine
       join case_premises other on other.case_id <> mine.case_id
            and (case when mine.place_id is not null and other.place_id is not null then other.place_id = mine.place_id
                      else ST_DWithin(other.geog, mine.geog, ?) end)
       join cases c on c.id = other.case_id and c.status <> 'resolved'
       join notices n on n.case_id = c.id
      where mine.case_id = ?
      order by c.id, n.created_at desc`,
    [SAME_PREMISES_M, caseId],
  );
  return rows;
}
