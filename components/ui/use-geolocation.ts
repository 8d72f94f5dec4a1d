'use client';

import { useEffect, useState } from 'react';

/** A position the device reported: WGS84 degrees, its accuracy in metres (95 %-ish, as the browser gives it) and when. */
export type DevicePosition = { lat: number; lon: number; accuracyM: number; at: string };

/** How long to wait for a device position, milliseconds. */
const GEO_TIMEOUT_MS = 20_000;

const NO_GEOLOCATION = 'This browser cannot share its location; tap your spot on the map.';
const UNREADABLE = 'Your position could not be read; tap your spot on the map.';

export const GEO_ERRORS: Record<number, string> = {
  1: 'Location permission is off for this site. Allow it in the browser settings, or tap your spot on the map.',
  2: 'Your device could not find its position. Try again in the open, or tap your spot on the map.',
  3: 'No position within 20 seconds. Try again, or tap your spot on the map.',
};

/**
 * The browser's position, asked for once per tap: `locate(onPosition)` starts a fresh
 * high-accuracy reading; `locating` and a plain `problem` describe how it is going.
 */
export function useGeolocation() {
  const [locating, setLocating] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  const locate = (onPosition: (p: DevicePosition) => void) => {
    setProblem(null);
    if (typeof navigator === 'undefined' || !navigator.geolocation) {
      setProblem(NO_GEOLOCATION);
      return;
    }
    setLocating(true);
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        setLocating(false);
        onPosition({ lat: pos.coords.latitude, lon: pos.coords.longitude, accuracyM: pos.coords.accuracy, at: new Date(pos.timestamp).toISOString() });
      },
      (err) => {
        setLocating(false);
        setProblem(GEO_ERRORS[err.code] ?? UNREADABLE);
      },
      { enableHighAccuracy: true, timeout: GEO_TIMEOUT_MS, maximumAge: 0 },
    );
  };

  return { locating, problem, locate };
}

/** A position kept up to date while watched (`at`: the reading's time in ms since the epoch). */
export type WatchedPosition = { lat: number; lon: number; accuracyM: number; at: number };

/**
 * The same device position, watched while `active` (the walk, the next-spot list): high accuracy,
 * readings up to 5 s old; `error` says plainly why there is none. The one-tap form is useGeolocation.
 */
export function useWatchedPosition(active: boolean): { position: WatchedPosition | null; error: string | null } {
  const [position, setPosition] = useState<WatchedPosition | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    if (!active) return;
    if (typeof navigator === 'undefined' || !navigator.geolocation) {
      setError(NO_GEOLOCATION);
      return;
    }
    const id = navigator.geolocation.watchPosition(
      (p) => {
        setError(null);
        setPosition({ lat: p.coords.latitude, lon: p.coords.longitude, accuracyM: p.coords.accuracy, at: p.timestamp });
      },
      (e) => setError(GEO_ERRORS[e.code] ?? UNREADABLE),
      { enableHighAccuracy: true, maximumAge: 5000, timeout: GEO_TIMEOUT_MS },
    );
    return () => navigator.geolocation.clearWatch(id);
  }, [active]);
  return { position, error };
}
