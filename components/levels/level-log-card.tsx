'use client';

import { z } from 'zod';
import type { UseFormRegisterReturn } from 'react-hook-form';
import useSWR from 'swr';
import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { fetchJson } from '@/lib/api/client';
import { useApiForm } from '@/lib/api/use-api-form';
import { bandOf } from '@/lib/hunt/bands';
import type { BeforeAfter, LevelView } from '@/lib/levels/level-log';
import { FormProblemBox } from '@/components/ui/form-problem';
import { TextField } from '@/components/ui/text-field';

type Log = { items: LevelView[]; environment: string; beforeAfter: BeforeAfter | null };

/** The form's own fields (flat); sent as the API's reading with the time of sending. */
const formSchema = z.object({
  frequencyKhz: z.coerce.number<string>().positive('The frequency in kHz.'),
  unit: z.enum(['S', 'dBm']),
  value: z.coerce.number<string>(),
  bandwidthHz: z.coerce.number<string>().positive('The receiver bandwidth in Hz.'),
  phase: z.enum(['before', 'after']),
});

/** A labelled select of fixed choices. */
function Choice({ id, label, registration, options }: { id: string; label: string; registration: UseFormRegisterReturn; options: [string, string][] }) {
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <select id={id} className="field" {...registration}>
        {options.map(([v, words]) => (
          <option key={v} value={v}>
            {words}
          </option>
        ))}
      </select>
    </div>
  );
}

const signed = (x: number) => `${x > 0 ? '+' : ''}${x}`;

function BandChart({ band, items }: { band: string; items: LevelView[] }) {
  const data = items.map((l) => ({ t: new Date(l.takenAt).getTime(), level: l.levelDbm, expected: l.expectedDbm }));
  const expected = items[items.length - 1].expectedDbm;
  return (
    <figure className="space-y-1" data-testid="level-chart">
      <figcaption className="text-sm font-semibold">
        {band}: level against the expected floor ({expected} dBm in {items[items.length - 1].bandwidthHz} Hz)
      </figcaption>
      <div className="h-48 w-full">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: -12 }}>
            <CartesianGrid strokeDasharray="3 3" />
            <XAxis dataKey="t" type="number" scale="time" domain={['dataMin', 'dataMax']} tickFormatter={(t) => new Date(t).toLocaleDateString()} fontSize={11} />
            <YAxis unit=" dBm" fontSize={11} domain={['auto', 'auto']} />
            <Tooltip labelFormatter={(t) => new Date(Number(t)).toLocaleString()} />
            <ReferenceLine y={expected} stroke="#5b6f82" strokeDasharray="6 3" label={{ value: 'expected floor', fontSize: 11, position: 'insideBottomRight' }} />
            <Line type="monotone" dataKey="level" stroke="#1d4e89" dot isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}

/** The level log: readings before/after a fix, each against the expected man-made noise (ITU-R P.372). */
export function LevelLogCard({ caseId }: { caseId: string }) {
  const log = useSWR<Log>(`/api/cases/${caseId}/levels`, fetchJson);
  const { form, submit, problem, pending } = useApiForm(formSchema, {
    defaultValues: { frequencyKhz: '', unit: 'S', value: '', bandwidthHz: '2400', phase: 'before' },
    request: (v) => ({
      url: `/api/cases/${caseId}/levels`,
      body: { clientId: crypto.randomUUID(), frequencyKhz: v.frequencyKhz, level: { unit: v.unit, value: v.value }, bandwidthHz: v.bandwidthHz, takenAt: new Date().toISOString(), phase: v.phase },
    }),
    onSuccess: () => {
      form.resetField('value');
      void log.mutate();
    },
    fieldFor: (path) => (path === 'level.value' ? 'value' : ['frequencyKhz', 'bandwidthHz', 'phase'].includes(path) ? path : null),
  });
  const errors = form.formState.errors;
  const bands = new Map<string, LevelView[]>();
  for (const l of log.data?.items ?? []) bands.set(bandOf(l.frequencyKhz), [...(bands.get(bandOf(l.frequencyKhz)) ?? []), l]);
  const ba = log.data?.beforeAfter;
  return (
    <section className="card min-w-0 space-y-3" aria-labelledby="levels-heading" data-testid="level-log">
      <h2 id="levels-heading" className="text-lg font-bold">
        Level log
      </h2>
      <p className="text-xs text-ink-faint">Expected floor: median man-made noise for a {log.data?.environment ?? 'residential'} area (ITU-R P.372) in the receiver bandwidth.</p>
      <form onSubmit={submit} className="grid grid-cols-2 gap-2" noValidate>
        <TextField id="lv-freq" label="Frequency (kHz)" inputMode="decimal" registration={form.register('frequencyKhz')} error={errors.frequencyKhz} />
        <TextField id="lv-bw" label="Bandwidth (Hz)" inputMode="numeric" registration={form.register('bandwidthHz')} error={errors.bandwidthHz} />
        <Choice id="lv-unit" label="Unit" registration={form.register('unit')} options={[['S', 'S-units'], ['dBm', 'dBm']]} />
        <TextField id="lv-value" label="Level" inputMode="decimal" registration={form.register('value')} error={errors.value} />
        <Choice id="lv-phase" label="When" registration={form.register('phase')} options={[['before', 'before the fix'], ['after', 'after the fix']]} />
        <div className="flex items-end">
          <button type="submit" className="btn-primary w-full" disabled={pending}>
            Log the level
          </button>
        </div>
        <div className="col-span-2">
          <FormProblemBox problem={problem} />
        </div>
      </form>
      {ba && (
        <p className="text-sm" data-testid="before-after">
          At {ba.frequencyKhz} kHz: before {ba.beforeDbm} dBm, after {ba.afterDbm} dBm ({signed(ba.differenceDb)} dB).
        </p>
      )}
      {[...bands].map(([band, items]) => (
        <BandChart key={band} band={band} items={items} />
      ))}
      {log.data && log.data.items.length > 0 && (
        <ul className="space-y-1 text-sm">
          {log.data.items.slice(-5).map((l) => (
            <li key={l.id}>
              {new Date(l.takenAt).toLocaleString()} · {l.frequencyKhz} kHz · {l.levelDbm} dBm ({signed(l.excessDb)} dB over the floor) · {l.phase}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
