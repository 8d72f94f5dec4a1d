'use client';

import { useEffect, useRef } from 'react';
import useSWR from 'swr';
import { fetchJson } from '@/lib/api/client';

type Signature = {
  sampleRate: number;
  seconds: number;
  mainsLines: { hz: number; excessDb: number }[];
  kurtosis: number;
  flatness: number;
  pulseRegularity: number;
  spectrum: { hzPerPoint: number; db: number[] };
  spectrogram: { secondsPerColumn: number; hzPerRow: number; db: number[][] };
};

/** A quiet-to-loud colour ramp (dark blue -> teal -> yellow) for the spectrogram. */
function ramp(t: number): string {
  const x = Math.max(0, Math.min(1, t));
  const r = Math.round(20 + 235 * Math.max(0, x * 1.6 - 0.6));
  const g = Math.round(30 + 200 * x);
  const b = Math.round(90 + 80 * (1 - x));
  return `rgb(${r},${g},${b})`;
}

function drawSpectrogram(c: HTMLCanvasElement, s: Signature['spectrogram']) {
  const ctx = c.getContext('2d');
  if (!ctx || !s.db.length) return;
  const cols = s.db.length;
  const rows = s.db[0].length;
  const all = s.db.flat();
  const hi = Math.max(...all);
  const lo = hi - 60; // a 60 dB window below the loudest cell
  const w = c.width / cols;
  const h = c.height / rows;
  for (let x = 0; x < cols; x++)
    for (let y = 0; y < rows; y++) {
      ctx.fillStyle = ramp((s.db[x][y] - lo) / (hi - lo));
      ctx.fillRect(x * w, c.height - (y + 1) * h, Math.ceil(w), Math.ceil(h));
    }
}

function drawSpectrum(c: HTMLCanvasElement, s: Signature['spectrum'], maxHz: number) {
  const ctx = c.getContext('2d');
  if (!ctx) return;
  const n = Math.min(s.db.length, Math.ceil(maxHz / s.hzPerPoint));
  const pts = s.db.slice(0, n);
  const hi = Math.max(...pts);
  const lo = hi - 70;
  ctx.clearRect(0, 0, c.width, c.height);
  ctx.strokeStyle = '#1d4e89';
  ctx.lineWidth = 1.5;
  ctx.beginPath();
  pts.forEach((v, i) => {
    const x = (i / Math.max(1, n - 1)) * c.width;
    const y = c.height - ((Math.max(lo, v) - lo) / (hi - lo)) * c.height;
    if (i) ctx.lineTo(x, y);
    else ctx.moveTo(x, y);
  });
  ctx.stroke();
}

/** The recording's spectrum (0–4 kHz) and spectrogram, drawn from the matrices the worker computed. */
export function SignatureView({ url }: { url: string }) {
  const { data } = useSWR<{ signature: Signature | null }>(url, fetchJson);
  const spec = useRef<HTMLCanvasElement>(null);
  const gram = useRef<HTMLCanvasElement>(null);
  const s = data?.signature;
  const maxHz = s ? Math.min(4000, s.sampleRate / 2) : 4000;
  useEffect(() => {
    if (!s) return;
    if (spec.current) drawSpectrum(spec.current, s.spectrum, maxHz);
    if (gram.current) drawSpectrogram(gram.current, s.spectrogram);
  }, [s, maxHz]);
  if (!s) return null;
  return (
    <div className="space-y-2" data-testid="signature-view">
      <figure>
        <canvas ref={spec} width={640} height={140} className="h-28 w-full rounded border border-ink/10 bg-white" aria-label={`Spectrum from 0 to ${maxHz} Hz`} />
        <figcaption className="text-xs text-ink-faint">Spectrum, 0–{maxHz} Hz (70 dB range)</figcaption>
      </figure>
      <figure>
        <canvas ref={gram} width={s.spectrogram.db.length * 4} height={256} className="h-32 w-full rounded" aria-label={`Spectrogram over ${s.seconds} s, 0 to ${s.sampleRate / 2} Hz`} />
        <figcaption className="text-xs text-ink-faint">
          Spectrogram: time across ({s.seconds} s), frequency up (0–{s.sampleRate / 2} Hz)
        </figcaption>
      </figure>
      <p className="text-xs text-ink-faint">
        Figures: {s.mainsLines.length ? `strongest lines ${s.mainsLines.map((l) => `${l.hz} Hz +${l.excessDb} dB`).join(', ')}; ` : ''}
        kurtosis {s.kurtosis}, pulse regularity {s.pulseRegularity}, flatness {s.flatness}.
      </p>
    </div>
  );
}
