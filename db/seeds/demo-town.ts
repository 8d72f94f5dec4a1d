import type { Knex } from 'knex';
import type { Position } from 'geojson';
import { offsetEastNorth } from '@/lib/df/internal/geodesy';
import { upsertPlaces, type PlaceInput } from '../places';

/**
 * Quillon, the demo club's fictional town: our own street names and house numbers, laid out on
 * the open plain the demo already uses, so the demo cases' fixes fall among houses. No real
 * place, street or address. Positions are metres east/north of an anchor (the demo sources).
 */
export const DEMO_TOWN = { city: 'Quillon', postcode: 'QH7 0DM' } as const;

type Street = { name: string; from: [number, number]; to: [number, number] };
/** A row of houses on one side of an east-west street at `streetNorthM`, lot centres every 20 m from `firstEastM`. */
type HouseRow = { street: string; streetNorthM: number; north: boolean; firstEastM: number; lots: number; firstNumber: number };

const HOUSE_W = 12; // along the street, metres
const HOUSE_D = 10; // away from the street, metres
const SETBACK = 5; // street centre line to the front wall, metres

function ll(anchor: { lat: number; lon: number }, [e, n]: [number, number]): Position {
  const p = offsetEastNorth(anchor.lat, anchor.lon, e, n);
  return [Math.round(p.lon * 1e7) / 1e7, Math.round(p.lat * 1e7) / 1e7];
}

/** Both sides of a street: odd numbers on the north side, even on the south side, counting from the west end. */
function bothSides(street: string, streetNorthM: number, firstEastM: number, lots: number): HouseRow[] {
  return [
    { street, streetNorthM, north: true, firstEastM, lots, firstNumber: 1 },
    { street, streetNorthM, north: false, firstEastM, lots, firstNumber: 2 },
  ];
}

function buildTown(anchor: { lat: number; lon: number }, prefix: string, streets: Street[], rows: HouseRow[]): PlaceInput[] {
  const out: PlaceInput[] = streets.map((s) => ({
    source: 'demo',
    sourceId: `${prefix}-street-${s.name}`,
    kind: 'street',
    name: s.name,
    geometry: { type: 'LineString', coordinates: [ll(anchor, s.from), ll(anchor, s.to)] },
  }));
  for (const r of rows) {
    const north = r.north;
    const front = r.streetNorthM + (north ? SETBACK : -SETBACK);
    const back = front + (north ? HOUSE_D : -HOUSE_D);
    for (let k = 0; k < r.lots; k++) {
      const e = r.firstEastM + 20 * k;
      const ring: [number, number][] = [
        [e - HOUSE_W / 2, front],
        [e + HOUSE_W / 2, front],
        [e + HOUSE_W / 2, back],
        [e - HOUSE_W / 2, back],
      ];
      if (!north) ring.reverse();
      const coords = [...ring, ring[0]].map((p) => ll(anchor, p));
      const housenumber = String(r.firstNumber + 2 * k);
      out.push({
        source: 'demo',
        sourceId: `${prefix}-${r.street}-${housenumber}`,
        kind: 'building',
        housenumber,
        street: r.street,
        postcode: DEMO_TOWN.postcode,
        city: DEMO_TOWN.city,
        geometry: { type: 'Polygon', coordinates: [coords] },
      });
    }
  }
  return out;
}

/**
 * The town's streets and 100 houses: two streets of 21 lots a side around the open case's source
 * and a close of 8 lots a side around the located case's source.
 */
export function demoTownPlaces(openSource: { lat: number; lon: number }, locatedSource: { lat: number; lon: number }): PlaceInput[] {
  // The open source sits inside the south row of Quill Row (street 14 m north of it).
  const main = buildTown(
    openSource,
    'main',
    [
      { name: 'Quill Row', from: [-215, 14], to: [215, 14] },
      { name: 'Hushbeck Lane', from: [-215, -70], to: [215, -70] },
      { name: 'Ostmere Way', from: [-215, 120], to: [-215, -160] },
    ],
    [...bothSides('Quill Row', 14, -200, 21), ...bothSides('Hushbeck Lane', -70, -200, 21)],
  );
  const close = buildTown(
    locatedSource,
    'close',
    [
      { name: 'Nullbrook Close', from: [-95, 14], to: [75, 14] },
      { name: 'Sallowmere Road', from: [-95, 14], to: [-95, 220] },
    ],
    bothSides('Nullbrook Close', 14, -80, 8),
  );
  return [...main, ...close];
}

export async function seedDemoTown(trx: Knex.Transaction, openSource: { lat: number; lon: number }, locatedSource: { lat: number; lon: number }): Promise<void> {
  await upsertPlaces(trx, demoTownPlaces(openSource, locatedSource));
}
