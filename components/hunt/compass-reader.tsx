'use client';

import { NoticeBox } from '@/components/ui/notice-box';
import { useCompass } from './use-compass';

/**
 * "Read compass": shows the phone's live magnetic heading and hands it over on request.
 * @param onReading called with the heading in degrees clockwise from MAGNETIC north (0.5° steps)
 */
export function CompassReader({ onReading }: { onReading: (magneticDeg: number) => void }) {
  const { state, headingDeg, start, stop } = useCompass();
  if (state === 'live') {
    const rounded = headingDeg === null ? null : Math.round(headingDeg * 2) / 2;
    return (
      <div className="space-y-2 rounded-lg border-2 border-hush-700 p-3">
        <p className="text-sm text-ink-soft">Hold the phone flat, its top edge along the null, away from the loop’s metal and the radio.</p>
        <p className="text-center text-4xl font-extrabold tabular-nums" aria-live="polite" aria-atomic="true">
          {rounded === null ? 'waiting…' : `${rounded.toFixed(1)}° magnetic`}
        </p>
        <div className="grid grid-cols-2 gap-2">
          <button
            type="button"
            className="btn-primary"
            disabled={rounded === null}
            onClick={() => {
              if (rounded === null) return;
              onReading(rounded === 360 ? 0 : rounded);
              stop();
            }}
          >
            Use this reading
          </button>
          <button type="button" className="btn-quiet" onClick={stop}>
            Cancel
          </button>
        </div>
      </div>
    );
  }
  return (
    <div className="space-y-2">
      <button type="button" className="btn-quiet w-full" onClick={() => void start()} disabled={state === 'asking'}>
        {state === 'asking' ? 'Asking for the compass…' : 'Read compass'}
      </button>
      {state === 'unsupported' && <NoticeBox tone="warn">This device gives no compass heading here. Type the azimuth instead.</NoticeBox>}
      {state === 'denied' && <NoticeBox tone="warn">Compass access was not allowed. Type the azimuth, or allow motion and orientation in the browser settings.</NoticeBox>}
    </div>
  );
}
