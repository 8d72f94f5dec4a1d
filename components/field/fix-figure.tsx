import type { FixView } from '@/lib/hunt/views';

/** The fix's key figure in the action bar (never hidden under it): "±151 m", and how many items wait on the phone. */
export function FixFigure({ fix, waiting }: { fix?: FixView; waiting: number }) {
  const f = fix?.current?.fix;
  return (
    <p className="min-w-[5.5rem] shrink-0 leading-tight text-ink" data-testid="bar-fix">
      <span className="block text-2xl font-extrabold tabular-nums">{f && f.ok ? `±${Math.round(f.ellipse.semiMajorM)} m` : '—'}</span>
      <span className="block text-sm font-semibold">{waiting ? `${waiting} waiting` : f && f.ok ? '95 % fix' : 'no fix yet'}</span>
    </p>
  );
}
