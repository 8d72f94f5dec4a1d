import FFT from 'fft.js';

/**
 * The audio signature of a noise recording: spectrum, spectrogram, and three detections —
 * a mains family (lines on the harmonics of 50 or 60 Hz above the local floor), a pulse train
 * (impulsive audio whose envelope repeats) and broadband hiss (a flat spectrum). Pure: samples in,
 * figures out. Thresholds are common practice for such screening, no published source; the hint
 * is worded as common practice, never as a finding about a device.
 */
export type MainsLine = { hz: number; excessDb: number };
export type AudioSignature = {
  sampleRate: number;
  /** seconds analysed (at most the first 60 s) */
  seconds: number;
  mainsHz: 50 | 60 | null;
  /** mean excess of the family's five strongest harmonics over their local floor, dB */
  mainsFamilyDb: number | null;
  mainsLines: MainsLine[];
  pulseRateHz: number | null;
  /** normalised autocorrelation of the envelope at the pulse period (0..1) */
  pulseRegularity: number;
  /** excess kurtosis-free kurtosis of the waveform (3 for Gaussian noise, 1.5 for a sine) */
  kurtosis: number;
  broadband: boolean;
  /** spectral flatness in 200–3000 Hz (geometric / arithmetic mean of power, 0..1) */
  flatness: number;
  hint: string;
  spectrum: { hzPerPoint: number; db: number[] };
  spectrogram: { secondsPerColumn: number; hzPerRow: number; db: number[][] };
};

/** Detection thresholds (common practice for screening, no published source). */
export const THRESHOLDS = {
  /** a harmonic counts when its line stands this far above the local floor */
  lineDb: 10,
  /** a family needs at least this many such harmonics */
  minLines: 3,
  /** pulses: the waveform's kurtosis (Gaussian noise: 3) */
  pulseKurtosis: 6,
  /** pulses: the envelope's autocorrelation at the period */
  pulseRegularity: 0.3,
  /** broadband: spectral flatness in the SSB audio passband */
  flatness: 0.5,
} as const;

const log10 = (x: number) => Math.log10(Math.max(x, 1e-30));
const db = (p: number) => 10 * log10(p);
const round1 = (x: number) => Math.round(x * 10) / 10;
const nextPow2 = (n: number) => 2 ** Math.ceil(Math.log2(Math.max(2, n)));

function hann(n: number): Float64Array {
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) w[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / (n - 1));
  return w;
}

/** Welch power spectrum: Hann frames of `size`, 50 % overlap, power averaged; bins 0..size/2. */
export function welchSpectrum(x: Float32Array, size: number): Float64Array {
  const fft = new FFT(size);
  const w = hann(size);
  const out = fft.createComplexArray();
  const frame = new Float64Array(size);
  const p = new Float64Array(size / 2 + 1);
  let frames = 0;
  const step = size / 2;
  const last = Math.max(0, x.length - size);
  for (let start = 0; start <= last; start += step) {
    for (let i = 0; i < size; i++) frame[i] = (x[start + i] ?? 0) * w[i];
    fft.realTransform(out, frame);
    for (let k = 0; k <= size / 2; k++) p[k] += out[2 * k] ** 2 + out[2 * k + 1] ** 2;
    frames++;
  }
  for (let k = 0; k < p.length; k++) p[k] /= frames;
  return p;
}

function median(a: number[]): number {
  if (!a.length) return 0;
  const s = [...a].sort((x, y) => x - y);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * Each harmonic of f0 up to 2 kHz (or, with `offset` ½, each point half-way between two):
 * its strongest bin within ±2 Hz against the median of the bins 6–25 Hz away, in dB.
 */
export function harmonicExcess(p: Float64Array, hzPerBin: number, f0: number, sampleRate: number, offset = 0): MainsLine[] {
  const top = Math.min(2000, sampleRate / 2 - 30);
  const lines: MainsLine[] = [];
  const near = Math.max(2, 1.5 * hzPerBin);
  for (let k = 1; (k + offset) * f0 <= top; k++) {
    const f = (k + offset) * f0;
    let line = 0;
    for (let b = Math.floor((f - near) / hzPerBin); b <= Math.ceil((f + near) / hzPerBin); b++) line = Math.max(line, p[b] ?? 0);
    const floor: number[] = [];
    for (let b = Math.ceil((f - 25) / hzPerBin); b <= Math.floor((f + 25) / hzPerBin); b++) {
      const d = Math.abs(b * hzPerBin - f);
      if (d >= 6 && b > 0 && b < p.length) floor.push(p[b]);
    }
    lines.push({ hz: f, excessDb: round1(db(line) - db(median(floor))) });
  }
  return lines;
}

/**
 * The mains family: harmonics of 50 or 60 Hz standing out of the local floor, while the points
 * half-way between them do not (a pulse train at 25 Hz has lines there too: it is no mains family),
 * on at least a third of the harmonics up to the highest one found (chance coincidences of another
 * line spacing are sparse). Multiples of 300 Hz belong to both families and decide nothing.
 */
function mainsFamily(p: Float64Array, hzPerBin: number, sampleRate: number) {
  let best: { hz: 50 | 60; score: number; lines: MainsLine[] } | null = null;
  for (const hz of [50, 60] as const) {
    const lines = harmonicExcess(p, hzPerBin, hz, sampleRate);
    const between = harmonicExcess(p, hzPerBin, hz, sampleRate, 0.5);
    const own = lines.filter((l) => l.hz % 300 !== 0);
    const found = own.filter((l) => {
      const k = l.hz / hz;
      const gaps = [between[k - 2], between[k - 1]].filter(Boolean).map((g) => g.excessDb);
      return l.excessDb >= THRESHOLDS.lineDb && gaps.every((g) => g <= l.excessDb - THRESHOLDS.lineDb);
    });
    const highest = found.length ? found[found.length - 1].hz : 0;
    const upTo = own.filter((l) => l.hz <= highest).length;
    const score = found.reduce((s, l) => s + l.excessDb, 0);
    if (found.length >= THRESHOLDS.minLines && found.length * 3 >= upTo && (!best || score > best.score)) best = { hz, score, lines: found };
  }
  if (!best) return { mainsHz: null, mainsFamilyDb: null, mainsLines: [] as MainsLine[] };
  const strongest = [...best.lines].sort((a, b) => b.excessDb - a.excessDb).slice(0, 5);
  return { mainsHz: best.hz, mainsFamilyDb: round1(strongest.reduce((s, l) => s + l.excessDb, 0) / strongest.length), mainsLines: strongest };
}

function kurtosisOf(x: Float32Array): number {
  let m = 0;
  for (const v of x) m += v;
  m /= x.length || 1;
  let m2 = 0;
  let m4 = 0;
  for (const v of x) {
    const d = (v - m) ** 2;
    m2 += d;
    m4 += d * d;
  }
  m2 /= x.length || 1;
  m4 /= x.length || 1;
  return m2 > 0 ? m4 / (m2 * m2) : 0;
}

/**
 * The repetition rate of an impulsive envelope: |x| averaged in blocks (about 4 kHz), its
 * autocorrelation through the FFT, the strongest peak for rates 0.5–1000 Hz (an earlier peak at
 * the first peak with 80 % of its height is the period), refined by a parabola.
 */
export function pulseRate(x: Float32Array, sampleRate: number): { rateHz: number | null; regularity: number } {
  const block = Math.max(1, Math.round(sampleRate / 4000));
  const envRate = sampleRate / block;
  const n = Math.floor(x.length / block);
  if (n < 64) return { rateHz: null, regularity: 0 };
  const env = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < block; j++) s += Math.abs(x[i * block + j]);
    env[i] = s / block;
  }
  let mean = 0;
  for (const v of env) mean += v;
  mean /= n;
  const size = nextPow2(2 * n);
  const fft = new FFT(size);
  const input = new Float64Array(size);
  for (let i = 0; i < n; i++) input[i] = env[i] - mean;
  const spec = fft.createComplexArray();
  fft.realTransform(spec, input);
  fft.completeSpectrum(spec);
  for (let k = 0; k < size; k++) {
    spec[2 * k] = spec[2 * k] ** 2 + spec[2 * k + 1] ** 2;
    spec[2 * k + 1] = 0;
  }
  const ac = fft.createComplexArray();
  fft.inverseTransform(ac, spec);
  const r0 = ac[0];
  if (!(r0 > 0)) return { rateHz: null, regularity: 0 };
  // Unbiased: divide by the overlap length so long lags are not penalised.
  const r = (lag: number) => ac[2 * lag] / r0 / ((n - lag) / n);
  const minLag = Math.max(2, Math.floor(envRate / 1000));
  const maxLag = Math.min(Math.floor(n / 3), Math.ceil(envRate / 0.5));
  let bestLag = -1;
  let bestR = -Infinity;
  for (let lag = minLag; lag <= maxLag; lag++) {
    const v = r(lag);
    if (v > bestR && v >= r(lag - 1) && v >= r(lag + 1)) (bestR = v), (bestLag = lag);
  }
  if (bestLag < 0) return { rateHz: null, regularity: 0 };
  // The period is the first peak nearly as high as the best (the others are its multiples).
  for (let lag = minLag; lag < bestLag; lag++) {
    const v = r(lag);
    if (v >= 0.8 * bestR && v >= r(lag - 1) && v >= r(lag + 1)) {
      bestLag = lag;
      break;
    }
  }
  const y0 = r(bestLag - 1);
  const y1 = r(bestLag);
  const y2 = r(bestLag + 1);
  const den = y0 - 2 * y1 + y2;
  const shift = den !== 0 ? Math.max(-0.5, Math.min(0.5, (0.5 * (y0 - y2)) / den)) : 0;
  return { rateHz: envRate / (bestLag + shift), regularity: Math.max(0, Math.min(1, y1)) };
}

/** Geometric over arithmetic mean of the power in [lo, hi] Hz. */
export function spectralFlatness(p: Float64Array, hzPerBin: number, lo: number, hi: number): number {
  let logSum = 0;
  let sum = 0;
  let n = 0;
  for (let b = Math.ceil(lo / hzPerBin); b <= Math.min(p.length - 1, Math.floor(hi / hzPerBin)); b++) {
    logSum += Math.log(Math.max(p[b], 1e-30));
    sum += p[b];
    n++;
  }
  return n && sum > 0 ? Math.exp(logSum / n) / (sum / n) : 0;
}

function spectrogram(x: Float32Array, sampleRate: number, cols = 120, rows = 128) {
  const size = nextPow2(sampleRate / 40); // ~25 ms frames
  const fft = new FFT(size);
  const w = hann(size);
  const out = fft.createComplexArray();
  const frame = new Float64Array(size);
  const frames = Math.max(1, Math.floor((x.length - size) / (size / 2)) + 1);
  const c = Math.min(cols, frames);
  const perRow = Math.max(1, Math.floor(size / 2 / rows));
  const grid: number[][] = [];
  for (let col = 0; col < c; col++) {
    const acc = new Float64Array(rows);
    const f0 = Math.floor((col * frames) / c);
    const f1 = Math.max(f0 + 1, Math.floor(((col + 1) * frames) / c));
    for (let f = f0; f < f1; f++) {
      const start = f * (size / 2);
      for (let i = 0; i < size; i++) frame[i] = (x[start + i] ?? 0) * w[i];
      fft.realTransform(out, frame);
      for (let row = 0; row < rows; row++) {
        let m = 0;
        for (let b = row * perRow; b < (row + 1) * perRow; b++) m = Math.max(m, out[2 * b] ** 2 + out[2 * b + 1] ** 2);
        acc[row] += m / (f1 - f0);
      }
    }
    grid.push(Array.from(acc, (v) => Math.round(db(v))));
  }
  return { secondsPerColumn: (frames / c) * (size / 2 / sampleRate), hzPerRow: (perRow * sampleRate) / size, db: grid };
}

function pooled(p: Float64Array, hzPerBin: number, points = 512) {
  const per = Math.max(1, Math.floor(p.length / points));
  const out: number[] = [];
  for (let i = 0; i + per <= p.length && out.length < points; i += per) {
    let m = 0;
    for (let b = i; b < i + per; b++) m = Math.max(m, p[b]);
    out.push(round1(db(m)));
  }
  return { hzPerPoint: per * hzPerBin, db: out };
}

/** The plain-language hint: what is common practice to suspect, with the figures; never a verdict. */
export function signatureHint(s: Pick<AudioSignature, 'mainsHz' | 'mainsFamilyDb' | 'mainsLines' | 'pulseRateHz' | 'broadband' | 'flatness'>): string {
  const parts: string[] = [];
  if (s.mainsHz && s.mainsFamilyDb != null) {
    const top = s.mainsLines[0];
    const even = top && top.hz === 2 * s.mainsHz;
    parts.push(
      even
        ? `Strong ${2 * s.mainsHz}/${4 * s.mainsHz} Hz family (${s.mainsFamilyDb} dB above the local floor): mains-synchronous; in common practice often arcing or a rectifier.`
        : `Lines on the harmonics of ${s.mainsHz} Hz (${s.mainsFamilyDb} dB above the local floor, strongest at ${top?.hz} Hz): mains-related; in common practice often a transformer, motor or dimmer nearby.`,
    );
  }
  if (s.pulseRateHz != null) {
    const r = s.pulseRateHz;
    const rate = r >= 10 ? `${Math.round(r)} Hz` : `${r.toFixed(2)} Hz`;
    const mainsSync = s.mainsHz && [1, 2].some((k) => Math.abs(r - k * s.mainsHz!) / (k * s.mainsHz!) < 0.02);
    parts.push(
      mainsSync
        ? `Pulses at ${rate}, locked to the mains: in common practice often arcing hardware — the utility's job; never approach or touch it.`
        : r < 3
          ? `Pulses about every ${(1 / r).toFixed(1)} s (${rate}): in common practice often an electric fence energiser.`
          : `A pulse train repeating at ${rate}: in common practice often a switching supply, a charger or a controller.`,
    );
  }
  if (s.broadband) parts.push(`Broadband hiss (flatness ${s.flatness.toFixed(2)} in 200–3000 Hz): in common practice often switch-mode supplies, LED drivers or solar inverters; compare with the antenna disconnected.`);
  if (!parts.length) parts.push('No mains family, pulse train or broadband hiss stands out in this recording.');
  parts.push('A hint from the sound alone, not a finding about any device.');
  return parts.join(' ');
}

/** The whole signature of a mono recording (at most its first `maxSeconds`). */
export function audioSignature(samples: Float32Array, sampleRate: number, maxSeconds = 60): AudioSignature {
  const x = samples.length > maxSeconds * sampleRate ? samples.subarray(0, Math.floor(maxSeconds * sampleRate)) : samples;
  const size = nextPow2(sampleRate / 2); // bins of 1–2 Hz
  const p = welchSpectrum(x, size);
  const hzPerBin = sampleRate / size;
  const mains = mainsFamily(p, hzPerBin, sampleRate);
  const kurtosis = kurtosisOf(x);
  const pulse = pulseRate(x, sampleRate);
  const impulsive = kurtosis >= THRESHOLDS.pulseKurtosis && pulse.regularity >= THRESHOLDS.pulseRegularity;
  const flatness = spectralFlatness(p, hzPerBin, 200, Math.min(3000, sampleRate / 2 - 100));
  const base = {
    ...mains,
    pulseRateHz: impulsive && pulse.rateHz ? Math.round(pulse.rateHz * 100) / 100 : null,
    broadband: flatness >= THRESHOLDS.flatness,
    flatness: Math.round(flatness * 1000) / 1000,
  };
  return {
    sampleRate,
    seconds: round1(x.length / sampleRate),
    ...base,
    pulseRegularity: Math.round(pulse.regularity * 1000) / 1000,
    kurtosis: round1(kurtosis),
    hint: signatureHint(base),
    spectrum: pooled(p, hzPerBin),
    spectrogram: spectrogram(x, sampleRate),
  };
}
