'use client';

import { useEffect, useState } from 'react';
import { GEO_ERRORS } from '@/components/ui/use-geolocation';

export type PhonePosition = { lat: number; lon: number; accuracyM: number; at: number };

/**
 * The phone's position while the walk or the next-spot list is on screen (watchPosition, high
 * accuracy), with its stated accuracy in metres; `error` says plainly why there is none.
 */
export function usePhonePosition(active: boolean): { position: PhonePosition | null; error: string | null } {
  const [position, setPosition] = useState<PhonePosition | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    if (!active) return;
    if (typeof navigator === 'undefined' || !navigator.geolocation) {
      setError('This browser cannot share its position: tap your spot on the map.');
      return;
    }
    const id = navigator.geolocation.watchPosition(
      (p) => {
        setError(null);
        setPosition({ lat: p.coords.latitude, lon: p.coords.longitude, accuracyM: p.coords.accuracy, at: p.timestamp });
      },
      (e) => setError(GEO_ERRORS[e.code] ?? 'Your position could not be read; tap your spot on the map.'),
      { enableHighAccuracy: true, maximumAge: 5000, timeout: 20000 },
    );
    return () => navigator.geolocation.clearWatch(id);
  }, [active]);
  return { position, error };
}
