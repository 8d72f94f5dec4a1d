import type { FixView } from '@/lib/hunt/views';

/**
 * The current fix in big type: the 95 % ellipse's semi-major in metres against the club's
 * threshold, the number of lines, and whether the case is ready to be marked located.
 */
export function FixSummary({ fix }: { fix?: FixView }) {
  const current = fix?.current;
  const f = current?.fix;
  return (
    <section aria-label="Current fix" data-testid="fix-summary" className="card space-y-1">
      {!fix ? (
        <p className="text-ink-soft">Loading the fix…</p>
      ) : !current || !f ? (
        <p className="text-lg font-semibold">No fix yet: take bearings from at least two spots, well apart.</p>
      ) : f.ok ? (
        <>
          <p className="text-4xl font-extrabold tabular-nums">
            ±{Math.round(f.ellipse.semiMajorM)} m
          </p>
          <p className="text-base">
            95 % error ellipse semi-major · the club marks a case located at {fix.locateThresholdM} m or less · {current.lineCount}{' '}
            {current.lineCount === 1 ? 'line' : 'lines'}
          </p>
          {fix.locatable ? (
            <p className="rounded-lg bg-hush-700 px-3 py-2 text-lg font-bold text-white" data-testid="locatable">
              Ready to mark located
            </p>
          ) : (
            <p className="text-base text-ink-soft">More bearings from new angles will shrink the ellipse.</p>
          )}
        </>
      ) : (
        <>
          <p className="text-xl font-bold">No fix from {current.lineCount} {current.lineCount === 1 ? 'line' : 'lines'}</p>
          <p>{f.message}</p>
        </>
      )}
    </section>
  );
}
