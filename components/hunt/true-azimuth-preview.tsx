'use client';

import { useMemo } from 'react';
import { declinationInfo } from '@/lib/df';
import { describeTrueAzimuth } from './azimuth-text';

/**
 * What will be saved: the azimuth as entered turned into a true azimuth with the declination the
 * server will use (World Magnetic Model for this place and today). The server does the real
 * conversion; this is the preview.
 */
export function TrueAzimuthPreview({
  azimuthDeg,
  reference,
  position,
  what = 'Saved as',
}: {
  /** Degrees clockwise from the chosen north, as entered. */
  azimuthDeg: number | undefined;
  reference: 'true' | 'magnetic';
  position: { lat: number; lon: number } | null;
  what?: string;
}) {
  const lat = position?.lat;
  const lon = position?.lon;
  const info = useMemo(() => (lat !== undefined && lon !== undefined ? declinationInfo(lat, lon, new Date()) : null), [lat, lon]);
  const text = describeTrueAzimuth(azimuthDeg, reference, info?.declinationDeg);
  let body: string;
  if (text) body = `${what}: ${text}`;
  else if (reference === 'magnetic' && !position) body = 'Choose a position to see the declination and the true azimuth.';
  else body = 'Enter the azimuth to see the true azimuth that will be saved.';
  return (
    <div className="rounded-lg bg-hush-50 p-3 text-hush-900" aria-live="polite" data-testid="true-azimuth">
      <p className="font-semibold">{body}</p>
      {reference === 'magnetic' && info && Number.isFinite(info.declinationDeg) && !text && (
        <p className="text-sm">
          Declination here today: {Math.abs(info.declinationDeg).toFixed(1)}° {info.declinationDeg >= 0 ? 'E' : 'W'}
        </p>
      )}
      {reference === 'magnetic' && info?.warning && <p className="text-sm">{info.warning}</p>}
    </div>
  );
}
