import type { BearingView, FixView } from '@/lib/hunt/views';
import { degrees, metres } from '@/lib/hunt/words';
import { bearingName } from './bearing-list';
import { formatLatLon } from './format-position';
import { HuntWarnings } from './hunt-warnings';

/**
 * The current fix: the 95 % ellipse's semi-major in big type against the club's threshold, the
 * number of lines and whether the case is ready to be marked located, then the warnings. With
 * `bearings` (the case page) also where it is, the ellipse's axes and the outliers by name.
 */
export function FixSummary({ fix, bearings }: { fix?: FixView; bearings?: BearingView[] }) {
  const current = fix?.current;
  const f = current?.fix;
  const byId = new Map((bearings ?? []).map((b) => [b.id, b]));
  const lines = (n: number) => (n === 1 ? '1 line' : `${n} lines`);
  return (
    <section aria-label="Current fix" data-testid="fix-summary" className="space-y-2">
      {!fix ? (
        <p className="text-ink-soft">Loading the fix…</p>
      ) : !current || !f ? (
        <p className="text-lg font-semibold">No fix yet: take bearings from at least two spots, well apart.</p>
      ) : f.ok ? (
        <>
          <p className="text-4xl font-extrabold tabular-nums">±{Math.round(f.ellipse.semiMajorM)} m</p>
          <p className="text-base">
            {Math.round(f.ellipse.confidence * 100)} % error ellipse semi-major · the club marks a case located at {metres(fix.locateThresholdM)} or less ·{' '}
            {lines(current.lineCount)}
          </p>
          {fix.locatable ? (
            <p className="rounded-lg bg-hush-700 px-3 py-2 text-lg font-bold text-white" data-testid="locatable">
              Ready to mark located
            </p>
          ) : (
            <p className="text-base text-flare-700">Larger than the club’s limit: a bearing from another side shrinks it most.</p>
          )}
          {bearings && (
            <>
              <p>
                At {formatLatLon(f.lat, f.lon)}; semi-minor {metres(f.ellipse.semiMinorM)}, long axis along {degrees(f.ellipse.majorAxisAzimuthDeg, 0)}–
                {degrees((f.ellipse.majorAxisAzimuthDeg + 180) % 360, 0)} true.
              </p>
              {f.outlierIds.length > 0 && (
                <div>
                  <p className="font-semibold">Set aside (they disagree with the rest):</p>
                  <ul className="list-disc pl-5">
                    {f.outlierIds.map((id) => (
                      <li key={id}>{byId.has(id) ? bearingName(byId.get(id)!) : `line ${id}`}</li>
                    ))}
                  </ul>
                  {f.allLines && (
                    <p>
                      With every line: semi-major {metres(f.allLines.ellipse.semiMajorM)} at {formatLatLon(f.allLines.lat, f.allLines.lon)}.
                    </p>
                  )}
                </div>
              )}
            </>
          )}
        </>
      ) : (
        <>
          <p className="text-xl font-bold">No fix from {lines(current.lineCount)}</p>
          <p>{f.message}</p>
        </>
      )}
      <HuntWarnings fix={fix} />
    </section>
  );
}
