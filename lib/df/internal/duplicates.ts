/**
 * The same bearing entered twice is one measurement, not two: lines from within SAME_SPOT_M of
 * each other whose directions differ by less than SAME_DIRECTION_SIGMAS of the smaller sigma
 * are grouped and counted once (estimateFix keeps the group's sharpest line, ties broken by
 * position, so the input order never matters). Common practice, no source: the thresholds are
 * this project's choice.
 */
import { DEG, bearingResidualDeg } from './angles';
import type { Plane } from './plane';
import type { PreparedLine } from './prepare-lines';

const SAME_SPOT_M = 5;
const SAME_DIRECTION_SIGMAS = 0.25;

/** Groups of duplicate lines (indices), only groups of two or more. */
export function duplicateGroups(lines: PreparedLine[], p: Plane): number[][] {
  const n = lines.length;
  const parent = Array.from({ length: n }, (_, i) => i);
  const root = (i: number): number => (parent[i] === i ? i : (parent[i] = root(parent[i])));
  const cells = new Map<string, number[]>();
  const key = (a: number, b: number) => `${a},${b}`;
  for (let i = 0; i < n; i++) {
    const cx = Math.floor(p.e[i] / SAME_SPOT_M), cy = Math.floor(p.n[i] / SAME_SPOT_M);
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        for (const j of cells.get(key(cx + dx, cy + dy)) ?? []) {
          const a = lines[i], b = lines[j];
          if (a.oneWay !== b.oneWay) continue;
          if (Math.hypot(p.e[i] - p.e[j], p.n[i] - p.n[j]) > SAME_SPOT_M) continue;
          const d = Math.abs(bearingResidualDeg(a.azimuthDeg, b.azimuthDeg, a.oneWay)) * DEG;
          if (d < SAME_DIRECTION_SIGMAS * Math.min(a.sigmaDeg, b.sigmaDeg) * DEG) parent[root(i)] = root(j);
        }
      }
    }
    const k = key(cx, cy);
    cells.set(k, [...(cells.get(k) ?? []), i]);
  }
  const groups = new Map<number, number[]>();
  for (let i = 0; i < n; i++) groups.set(root(i), [...(groups.get(root(i)) ?? []), i]);
  return [...groups.values()].filter((g) => g.length > 1).map((g) => g.sort((x, y) => x - y));
}
