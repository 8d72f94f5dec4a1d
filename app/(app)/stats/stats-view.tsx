'use client';

import { useSearchParams } from 'next/navigation';
import useSWR from 'swr';
import { Area, AreaChart, Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { fetchJson } from '@/lib/api/client';
import type { Stats } from '@/lib/stats/shape';
import { OUTCOMES } from '@/lib/validation/cases';
import { STATUS_COLOURS } from '@/components/map/case-status-symbols';
import { FILTER_KEYS, pick } from '../cases/_components/queue-params';

const days = (x: number | null) => (x === null ? '—' : `${x.toFixed(1)} days`);

/** Charts of the committee's statistics (every figure an SQL aggregate on the server). */
export function StatsView() {
  const filters = pick(useSearchParams(), FILTER_KEYS).toString();
  const { data, error } = useSWR<Stats>(`/api/stats${filters ? `?${filters}` : ''}`, fetchJson);
  if (error) return <p role="alert">{(error as Error).message}</p>;
  if (!data) return <p aria-busy="true">Counting…</p>;
  const medians = [
    { step: 'report → located', days: data.medianDays.reportToLocated },
    { step: 'located → notified', days: data.medianDays.locatedToNotified },
    { step: 'notified → resolved', days: data.medianDays.notifiedToResolved },
  ];
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <section className="card lg:col-span-2" aria-labelledby="over-time">
        <h2 id="over-time" className="font-bold">Cases by status, week by week</h2>
        <p className="text-sm text-ink-soft" data-testid="stats-totals">
          {data.totals.cases.toLocaleString('en')} cases: {data.totals.open} open, {data.totals.located} located, {data.totals.notified} notified, {data.totals.resolved} resolved.
        </p>
        <div className="h-72">
          <ResponsiveContainer>
            <AreaChart data={data.overTime}>
              <CartesianGrid strokeDasharray="3 3" />
              <XAxis dataKey="week" fontSize={11} />
              <YAxis fontSize={11} />
              <Tooltip />
              <Legend />
              {(['resolved', 'notified', 'located', 'open'] as const).map((s) => (
                <Area key={s} type="stepAfter" dataKey={s} stackId="1" stroke={STATUS_COLOURS[s]} fill={STATUS_COLOURS[s]} fillOpacity={0.5} />
              ))}
            </AreaChart>
          </ResponsiveContainer>
        </div>
      </section>
      <ChartCard id="medians" title="Median time per step" note={`Report to resolved: ${days(data.medianDays.reportToResolved)}.`}>
        <BarChart data={medians}>
          <XAxis dataKey="step" fontSize={11} />
          <YAxis fontSize={11} unit=" d" />
          <Tooltip />
          <Bar dataKey="days" fill="#0b5e55" />
        </BarChart>
      </ChartCard>
      <ChartCard id="outcomes" title="Outcomes of resolved cases">
        <BarChart data={data.outcomes.map((o) => ({ ...o, label: OUTCOMES[o.outcome as keyof typeof OUTCOMES] ?? o.outcome }))} layout="vertical" margin={{ left: 40 }}>
          <XAxis type="number" fontSize={11} />
          <YAxis type="category" dataKey="label" width={150} fontSize={11} />
          <Tooltip />
          <Bar dataKey="count" fill="#c8780a" />
        </BarChart>
      </ChartCard>
      <section className="card" aria-labelledby="reduction">
        <h2 id="reduction" className="font-bold">Noise reduction achieved</h2>
        <p data-testid="stats-reduction">
          {data.noiseReduction.measured === 0
            ? 'No case has a level measured before and after yet.'
            : `Median ${data.noiseReduction.medianDb?.toFixed(1)} dB (mean ${data.noiseReduction.meanDb?.toFixed(1)} dB) over ${data.noiseReduction.measured} cases with the level measured before and after.`}
        </p>
      </section>
      <section className="card" aria-labelledby="load">
        <h2 id="load" className="font-bold">Load per hunter (cases not resolved)</h2>
        <table className="w-full text-sm">
          <thead>
            <tr className="text-left">
              <th>Hunter</th>
              <th>open</th>
              <th>located</th>
              <th>notified</th>
              <th>total</th>
            </tr>
          </thead>
          <tbody>
            {data.load.slice(0, 20).map((l) => (
              <tr key={l.hunterId} className="border-t border-ink/10">
                <td>{l.name}</td>
                <td>{l.open}</td>
                <td>{l.located}</td>
                <td>{l.notified}</td>
                <td className="font-semibold">{l.total}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  );
}

/** One chart with its heading, sized for recharts' ResponsiveContainer. */
function ChartCard({ id, title, note, children }: { id: string; title: string; note?: string; children: React.ReactElement }) {
  return (
    <section className="card" aria-labelledby={id}>
      <h2 id={id} className="font-bold">
        {title}
      </h2>
      {note && <p className="text-sm text-ink-soft">{note}</p>}
      <div className="h-56">
        <ResponsiveContainer>{children}</ResponsiveContainer>
      </div>
    </section>
  );
}
