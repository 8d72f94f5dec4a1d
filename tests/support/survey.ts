/** A fictional walk as GPX 1.1 (Topografix GPX 1.1 schema layout), for the survey import tests. */
export const T0 = Date.parse('2026-11-30T14:00:00Z');
export const iso = (s: number) => new Date(T0 + s * 1000).toISOString();
export function gpxOf(points: { lat: number; lon: number; s: number; level?: string }[]) {
  const pts = points
    .map((p) => `      <trkpt lat="${p.lat}" lon="${p.lon}"><time>${iso(p.s)}</time>${p.level ? `<extensions><qf:level unit="S">${p.level}</qf:level></extensions>` : ''}</trkpt>`)
    .join('\n');
  return `<?xml version="1.0" encoding="UTF-8"?>\n<gpx version="1.1" creator="test" xmlns="http://www.topografix.com/GPX/1/1" xmlns:qf="urn:example:quietfix">\n  <trk><trkseg>\n${pts}\n  </trkseg></trk>\n</gpx>\n`;
}
/** Ten points 10 s apart walking north on open land. */
export const walk = Array.from({ length: 10 }, (_, i) => ({ lat: -31.05 + i * 0.0001, lon: 129.75, s: i * 10 }));
