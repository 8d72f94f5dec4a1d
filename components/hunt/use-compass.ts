'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { normalizeDeg } from './number-text';

export type CompassState = 'idle' | 'asking' | 'live' | 'unsupported' | 'denied';

/** Without an absolute heading within this time the device has no usable compass, milliseconds. */
const NO_HEADING_AFTER_MS = 3000;
/** Weight of each new reading in the running (vector) average; smooths a shaky hand. */
const SMOOTHING = 0.25;

type OrientationWithCompass = DeviceOrientationEvent & { webkitCompassHeading?: number };
type OrientationCtor = typeof DeviceOrientationEvent & { requestPermission?: () => Promise<'granted' | 'denied'> };

/**
 * The phone's compass: MAGNETIC heading of the top edge of the screen, degrees clockwise from
 * magnetic north. iOS gives webkitCompassHeading (after asking permission); other browsers give
 * alpha of an absolute orientation ('deviceorientationabsolute' where available), counter-clockwise,
 * so heading = 360 - alpha, plus the screen's rotation.
 */
export function useCompass() {
  const [state, setState] = useState<CompassState>('idle');
  const [headingDeg, setHeadingDeg] = useState<number | null>(null);
  const cleanup = useRef<(() => void) | null>(null);
  const vector = useRef<[number, number] | null>(null);

  const stop = useCallback(() => {
    cleanup.current?.();
    cleanup.current = null;
    vector.current = null;
    setState((s) => (s === 'live' || s === 'asking' ? 'idle' : s));
  }, []);

  useEffect(() => () => cleanup.current?.(), []);

  const start = useCallback(async () => {
    if (typeof window === 'undefined' || typeof DeviceOrientationEvent === 'undefined') {
      setState('unsupported');
      return;
    }
    const ctor = DeviceOrientationEvent as OrientationCtor;
    if (typeof ctor.requestPermission === 'function') {
      setState('asking');
      try {
        if ((await ctor.requestPermission()) !== 'granted') {
          setState('denied');
          return;
        }
      } catch {
        setState('denied');
        return;
      }
    }
    const eventName = 'ondeviceorientationabsolute' in window ? 'deviceorientationabsolute' : 'deviceorientation';
    setHeadingDeg(null);
    let got = false;
    const onEvent = (raw: Event) => {
      const e = raw as OrientationWithCompass;
      let h: number | null = null;
      if (typeof e.webkitCompassHeading === 'number' && Number.isFinite(e.webkitCompassHeading)) h = e.webkitCompassHeading;
      else if ((e.absolute || eventName === 'deviceorientationabsolute') && typeof e.alpha === 'number') {
        h = 360 - e.alpha + (window.screen.orientation?.angle ?? 0);
      }
      if (h === null) return;
      got = true;
      const r = (normalizeDeg(h) * Math.PI) / 180;
      const v = vector.current;
      vector.current = v ? [v[0] + SMOOTHING * (Math.sin(r) - v[0]), v[1] + SMOOTHING * (Math.cos(r) - v[1])] : [Math.sin(r), Math.cos(r)];
      setHeadingDeg(normalizeDeg((Math.atan2(vector.current[0], vector.current[1]) * 180) / Math.PI));
    };
    window.addEventListener(eventName, onEvent);
    const timer = window.setTimeout(() => {
      if (!got) {
        window.removeEventListener(eventName, onEvent);
        cleanup.current = null;
        setState('unsupported');
      }
    }, NO_HEADING_AFTER_MS);
    cleanup.current?.();
    cleanup.current = () => {
      window.clearTimeout(timer);
      window.removeEventListener(eventName, onEvent);
    };
    setState('live');
  }, []);

  return { state, headingDeg, start, stop };
}
