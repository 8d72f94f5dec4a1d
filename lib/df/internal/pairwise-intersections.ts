import { featureCollection, lineIntersect, lineString } from '@turf/turf';
import { wrapDeg180 } from './angles';
import { geodesicPoints } from './geodesy';
import type { PreparedLine } from './prepare-lines';

/** Only the first this many lines are intersected (190 pairs), so a thousand lines stay fast. */
export const MAX_INTERSECTION_LINES = 20;

/** Crossings closer than this to a line (relative to its drawn length) lie on it. */
const SAME_POINT = 1e-7;

type Segment = [[number, number], [number, number]]; // [lon, lat] ends

function drawnSegment(line: PreparedLine, lengthM: number, refLon: number): Segment {
  // start the observer's longitude near refLon so the drawn lines do not jump at +-180
  const lon0 = refLon + wrapDeg180(line.lon - refLon);
  const ends = geodesicPoints(line.lat, lon0, line.azimuthDeg, line.oneWay ? [0, lengthM] : [-lengthM, lengthM]);
  return [[ends[0][1], ends[0][0]], [ends[1][1], ends[1][0]]];
}

/** Distance of point p from the segment's supporting line, relative to the segment length. */
function offLine(seg: Segment, p: number[]): number {
  const [[x1, y1], [x2, y2]] = seg;
  const dx = x2 - x1, dy = y2 - y1;
  const len2 = dx * dx + dy * dy;
  const t = ((p[0] - x1) * dx + (p[1] - y1) * dy) / len2;
  if (t < -1e-9 || t > 1 + 1e-9) return Infinity;
  return Math.abs((p[0] - x1) * dy - (p[1] - y1) * dx) / len2;
}

/**
 * Where pairs of lines cross (for display). Each line is drawn lengthM metres along its geodesic
 * (both ways unless one-way) as a straight segment in longitude/latitude between the ends (over
 * tens of km a few metres off the geodesic, enough for display); all crossings are found in one
 * sweep with Turf's lineIntersect, then each crossing is matched to the two lines through it.
 * Only the first MAX_INTERSECTION_LINES lines (in input order) take part.
 */
export function pairwiseIntersections(lines: PreparedLine[], lengthM: number, refLon: number) {
  const used = lines.slice(0, MAX_INTERSECTION_LINES);
  const segments = used.map((l) => drawnSegment(l, lengthM, refLon));
  if (segments.length < 2 || segments.some((s) => !s.flat().every(Number.isFinite))) return [];
  const crossings = lineIntersect(featureCollection(segments.map((s) => lineString(s))), featureCollection<ReturnType<typeof lineString>['geometry']>([]));
  const out: { lat: number; lon: number; ids: [string | undefined, string | undefined]; order: number }[] = [];
  for (const c of crossings.features) {
    const p = c.geometry.coordinates;
    const ranked = segments.map((s, i) => ({ i, d: offLine(s, p) })).sort((a, b) => a.d - b.d);
    // Turf merges coincident crossings: every line through the point makes a pair with every other.
    const through = ranked.filter((r, k) => k < 2 || r.d < SAME_POINT).map((r) => r.i).sort((x, y) => x - y);
    for (let m = 0; m < through.length; m++) {
      for (let n = m + 1; n < through.length; n++) {
        out.push({ lat: p[1], lon: wrapDeg180(p[0]), ids: [used[through[m]].id, used[through[n]].id], order: through[m] * 1e4 + through[n] });
      }
    }
  }
  out.sort((a, b) => a.order - b.order);
  return out.map(({ order: _order, ...rest }) => rest);
}
