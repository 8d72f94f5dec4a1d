import type { BearingView, FixView } from '@/lib/hunt/views';
import { degrees, formatTime, metres } from '@/lib/hunt/words';
import { formatLatLon } from '@/components/hunt/format-position';

/** "Cleo Marchetti, 14:05, 212.0° true" — how a bearing is named in warnings and outlier lists. */
export const bearingName = (b: BearingView) => `${b.author?.name ?? 'unknown hunter'}, ${formatTime(b.takenAt)}, ${degrees(b.azimuthTrueDeg)} true`;

/** The current fix in words: ellipse, line count, outliers, the figure without them, warnings. */
export function FixSummary({ fix, bearings }: { fix?: FixView; bearings: BearingView[] }) {
  const cur = fix?.current;
  const f = cur?.fix;
  const warnings = [...new Set([...(fix?.warnings ?? []), ...(f?.ok ? f.warnings : [])])];
  const byId = new Map(bearings.map((b) => [b.id, b]));
  return (
    <section className="space-y-2" aria-labelledby="fix-heading" data-testid="fix-summary">
      <h3 id="fix-heading" className="font-bold">
        Fix
      </h3>
      {!fix && <p className="text-ink-soft">Loading the fix…</p>}
      {fix && !f && <p>No fix yet. It needs at least two bearings taken from different spots.</p>}
      {f && !f.ok && <p>No usable fix: {f.message}</p>}
      {f?.ok && cur && (
        <>
          <p>
            From {cur.lineCount === 1 ? '1 line' : `${cur.lineCount} lines`}: {formatLatLon(f.lat, f.lon)}.
          </p>
          <p>
            {Math.round(f.ellipse.confidence * 100)}% error ellipse: semi-major <strong>{metres(f.ellipse.semiMajorM)}</strong>, semi-minor {metres(f.ellipse.semiMinorM)}
            , long axis along {degrees(f.ellipse.majorAxisAzimuthDeg, 0)}–{degrees((f.ellipse.majorAxisAzimuthDeg + 180) % 360, 0)} true.
          </p>
          <p className={fix.locatable ? 'font-semibold text-hush-700' : 'text-flare-700'} data-testid="fix-locatable">
            {fix.locatable
              ? `Small enough to mark the case located (club limit ${metres(fix.locateThresholdM)}).`
              : `Larger than the club’s limit of ${metres(fix.locateThresholdM)}: a bearing from another side shrinks it most.`}
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
      {warnings.length > 0 && (
        <ul className="space-y-1" aria-label="Warnings" data-testid="fix-warnings">
          {warnings.map((w) => (
            <li key={w} className="rounded-lg border-l-4 border-flare-500 bg-flare-100 p-2 text-sm text-flare-700">
              {w}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
