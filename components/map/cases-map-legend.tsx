import { CASE_STATUSES } from '@/db/types';
import { PALETTE } from './map-styles';
import { statusSymbolSvg } from './case-status-symbols';

/** What the symbols of the map of all cases mean. */
export function CasesMapLegend({ heat }: { heat: boolean }) {
  return (
    <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-sm text-ink-soft" aria-label="Map legend">
      {heat ? (
        <li className="flex items-center gap-1.5">
          <span className="inline-block h-3 w-6" style={{ background: PALETTE.alarm600, opacity: 0.6 }} aria-hidden="true" /> more open cases (darker = more)
        </li>
      ) : (
        <>
          {CASE_STATUSES.map((s) => (
            // Our own static SVG strings, no user text.
            <li key={s} className="flex items-center gap-1.5">
              <span aria-hidden="true" dangerouslySetInnerHTML={{ __html: statusSymbolSvg(s, 14) }} /> {s}
            </li>
          ))}
          <li className="flex items-center gap-1.5">
            <span className="inline-block h-4 w-4 rounded-full border-4 bg-white" style={{ borderColor: PALETTE.flare500 }} aria-hidden="true" /> several cases (ring: the most common status; click to zoom in)
          </li>
        </>
      )}
    </ul>
  );
}
