/**
 * Synthetic test recordings, made in the tests (no recorded files): tones, harmonic families,
 * pulse trains and noise, and a 16-bit PCM WAV writer (RIFF layout as in the Microsoft/IBM
 * Multimedia Programming Interface and Data Specifications 1.0, 1991).
 */
import { mulberry32 } from './random';

/** The same seeded generator (mulberry32) as the df tests, so every run makes the same noise. */
export const rng = (seed = 1) => mulberry32(seed);

/** Gaussian white noise of standard deviation `sigma` (Box–Muller). */
export function whiteNoise(n: number, sigma: number, seed = 7): Float32Array {
  const r = rng(seed);
  const x = new Float32Array(n);
  for (let i = 0; i < n; i++) x[i] = sigma * Math.sqrt(-2 * Math.log(r() || 1e-12)) * Math.cos(2 * Math.PI * r());
  return x;
}

export function tone(n: number, rate: number, hz: number, amp = 0.5, phase = 0): Float32Array {
  const x = new Float32Array(n);
  for (let i = 0; i < n; i++) x[i] = amp * Math.sin((2 * Math.PI * hz * i) / rate + phase);
  return x;
}

/** Harmonics 1..count of f0 with amplitude amp/k and seeded random phases. */
export function harmonicFamily(n: number, rate: number, f0: number, count = 10, amp = 0.3, seed = 3): Float32Array {
  const r = rng(seed);
  const x = new Float32Array(n);
  for (let k = 1; k <= count && k * f0 < rate / 2; k++) {
    const ph = 2 * Math.PI * r();
    for (let i = 0; i < n; i++) x[i] += (amp / k) * Math.sin((2 * Math.PI * k * f0 * i) / rate + ph);
  }
  return x;
}

/** Short rectangular pulses (`widthS` long) repeating at `hz`. */
export function pulseTrain(n: number, rate: number, hz: number, widthS = 0.0003, amp = 0.8): Float32Array {
  const x = new Float32Array(n);
  const w = Math.max(1, Math.round(widthS * rate));
  for (let t = 0; ; t++) {
    const start = Math.round((t * rate) / hz);
    if (start >= n) break;
    for (let i = start; i < Math.min(n, start + w); i++) x[i] = amp;
  }
  return x;
}

export const mix = (...xs: Float32Array[]): Float32Array => {
  const out = new Float32Array(xs[0].length);
  for (const x of xs) for (let i = 0; i < out.length; i++) out[i] += x[i];
  return out;
};

/** 16-bit PCM WAV bytes (mono, or stereo with the same samples on both channels). */
export function wavBytes(x: Float32Array, rate: number, channels = 1): Uint8Array {
  const data = x.length * 2 * channels;
  const b = new Uint8Array(44 + data);
  const v = new DataView(b.buffer);
  const put = (at: number, s: string) => [...s].forEach((c, i) => (b[at + i] = c.charCodeAt(0)));
  put(0, 'RIFF');
  v.setUint32(4, 36 + data, true);
  put(8, 'WAVE');
  put(12, 'fmt ');
  v.setUint32(16, 16, true);
  v.setUint16(20, 1, true);
  v.setUint16(22, channels, true);
  v.setUint32(24, rate, true);
  v.setUint32(28, rate * 2 * channels, true);
  v.setUint16(32, 2 * channels, true);
  v.setUint16(34, 16, true);
  put(36, 'data');
  v.setUint32(40, data, true);
  for (let i = 0; i < x.length; i++)
    for (let c = 0; c < channels; c++) v.setInt16(44 + (i * channels + c) * 2, Math.max(-32768, Math.min(32767, Math.round(x[i] * 32767))), true);
  return b;
}
