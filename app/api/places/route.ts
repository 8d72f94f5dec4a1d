import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { placesInBox } from '@/db/places';
import { PLACES_CAP, placesQuerySchema } from '@/lib/validation/places';
import { PLACES_ROLES } from '@/lib/places/places-roles';
import { placesAttribution } from '@/lib/places/attribution';

/**
 * Streets and buildings in a box, as a GeoJSON FeatureCollection (streets first, at most
 * PLACES_CAP features; `truncated` says when more were there; `attribution` what the map must
 * credit, e.g. OpenStreetMap for imported OSM data). Public map data, but served to signed-in
 * hunters and the committee only.
 */
export const GET = route(async (req) => {
  await requireUser(...PLACES_ROLES);
  const { bbox } = placesQuerySchema.parse(Object.fromEntries(req.nextUrl.searchParams));
  const { features, truncated, fromOsm } = await placesInBox(bbox, PLACES_CAP);
  return json({ type: 'FeatureCollection', features, truncated, cap: PLACES_CAP, attribution: placesAttribution({ fromOsm }) });
});
