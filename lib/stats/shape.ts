import type { StatsRows } from '@/db/stats';
import { OUTCOME_KEYS } from '@/db/stats';

export type Stats = {
  /** at the end of each week: how many cases stood in each status (from the milestone counts) */
  overTime: { week: string; open: number; located: number; notified: number; resolved: number }[];
  totals: { cases: number; open: number; located: number; notified: number; resolved: number };
  medianDays: { reportToLocated: number | null; locatedToNotified: number | null; notifiedToResolved: number | null; reportToResolved: number | null };
  outcomes: { outcome: string; count: number }[];
  noiseReduction: { measured: number; medianDb: number | null; meanDb: number | null };
  load: StatsRows['load'];
};

const num = (v: unknown) => (v === null || v === undefined ? null : Math.round(Number(v) * 100) / 100);

/** Shapes the aggregate rows (a few hundred at most) into the answer; weeks with no change carry the last value. */
export function shapeStats(rows: StatsRows, weeks = 52, today = new Date()): Stats {
  const byWeek = new Map<string, Record<string, number>>();
  for (const r of rows.weekly) {
    const m = byWeek.get(r.week) ?? {};
    m[r.milestone] = r.n;
    byWeek.set(r.week, m);
  }
  const monday = new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth(), today.getUTCDate()));
  monday.setUTCDate(monday.getUTCDate() - ((monday.getUTCDay() + 6) % 7));
  const first = new Date(monday.getTime() - (weeks - 1) * 7 * 86_400_000).toISOString().slice(0, 10);
  const cum = { reported: 0, located: 0, notified: 0, resolved: 0 };
  const add = (m: Record<string, number>) => {
    for (const k of Object.keys(cum) as (keyof typeof cum)[]) cum[k] += m[k] ?? 0;
  };
  // Everything before the window counts towards its first week's standing.
  for (const [w, m] of [...byWeek].sort(([a], [b]) => a.localeCompare(b))) if (w < first) add(m);
  const overTime: Stats['overTime'] = [];
  for (let i = 0; i < weeks; i++) {
    const w = new Date(monday.getTime() - (weeks - 1 - i) * 7 * 86_400_000).toISOString().slice(0, 10);
    add(byWeek.get(w) ?? {});
    overTime.push({ week: w, open: cum.reported - cum.located, located: cum.located - cum.notified, notified: cum.notified - cum.resolved, resolved: cum.resolved });
  }
  const s = rows.summary;
  return {
    overTime,
    totals: { cases: Number(s.cases), open: Number(s.open), located: Number(s.located), notified: Number(s.notified), resolved: Number(s.resolved) },
    medianDays: {
      reportToLocated: num(s.reportToLocated),
      locatedToNotified: num(s.locatedToNotified),
      notifiedToResolved: num(s.notifiedToResolved),
      reportToResolved: num(s.reportToResolved),
    },
    outcomes: OUTCOME_KEYS.map((k) => ({ outcome: k, count: Number(s[`outcome:${k}`] ?? 0) })),
    noiseReduction: { measured: Number(s.measured), medianDb: num(s.reductionMedianDb), meanDb: num(s.reductionMeanDb) },
    load: rows.load,
  };
}
