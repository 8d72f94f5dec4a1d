/**
 * What the map must credit when it draws places that came from OpenStreetMap: the data is under
 * the Open Database Licence, whose produced works keep the notice "© OpenStreetMap contributors"
 * (OSM Foundation, "Copyright and License", https://www.openstreetmap.org/copyright).
 * HTML, as Leaflet's attribution control shows it.
 */
export const OSM_PLACES_ATTRIBUTION = 'Streets and houses &copy; <a href="https://www.openstreetmap.org/copyright">OpenStreetMap</a> contributors (ODbL)';

/** The attributions an answer of the places layer carries. */
export const placesAttribution = (p: { fromOsm: boolean }): string[] => (p.fromOsm ? [OSM_PLACES_ATTRIBUTION] : []);
