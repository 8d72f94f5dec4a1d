import { estimateFix, fitNullSweep, sUnitsToDbm, type Fix, type LineOfBearing } from '@/lib/df';
import { resolveSigmaDeg, toLines, trueAzimuth } from '@/lib/hunt/bearing-math';
import type { QueuedItem } from '@/lib/field/queue';
import type { BearingView } from '@/lib/hunt/views';

type QueuedBearing = {
  lat: number;
  lon: number;
  azimuthDeg: number;
  reference: 'true' | 'magnetic';
  sigmaDeg?: number;
  nullWidthDeg?: number;
  quality?: 'sharp' | 'fair' | 'broad';
  oneWay?: boolean;
  takenAt?: string;
};
type QueuedSweep = QueuedBearing & { levelUnit?: 'S' | 'dBm'; frequencyKhz?: number; samples: { azimuthDeg: number; level: number }[] };

/**
 * The line a queued bearing or sweep will become, computed on the phone the way the server will
 * (WMM declination for magnetic readings, the sigma rule, the sweep fit); null when it cannot be.
 * The S-meter offset is left out: a constant offset does not move a sweep's null.
 */
export function queuedLine(item: QueuedItem): LineOfBearing | null {
  const when = new Date(String(item.body.takenAt ?? item.createdAt));
  if (item.kind === 'bearing') {
    const b = item.body as unknown as QueuedBearing;
    const { azimuthTrueDeg } = trueAzimuth(b.azimuthDeg, b.reference, b.lat, b.lon, when);
    return { id: item.clientId, lat: b.lat, lon: b.lon, azimuthDeg: azimuthTrueDeg, sigmaDeg: resolveSigmaDeg(b), oneWay: b.oneWay ?? false };
  }
  if (item.kind === 'sweep') {
    const s = item.body as unknown as QueuedSweep;
    const hz = (s.frequencyKhz ?? 7000) * 1000;
    const fit = fitNullSweep(s.samples.map((x) => ({ azimuthDeg: x.azimuthDeg, levelDbm: s.levelUnit === 'S' ? sUnitsToDbm(x.level, 0, hz) : x.level })));
    if (!fit.ok) return null;
    const { azimuthTrueDeg } = trueAzimuth(fit.nullAzimuthDeg, s.reference, s.lat, s.lon, when);
    return { id: item.clientId, lat: s.lat, lon: s.lon, azimuthDeg: azimuthTrueDeg, sigmaDeg: Math.max(fit.sigmaDeg, 0.5), oneWay: false };
  }
  return null;
}

/**
 * The fix from the lines already stored (as last loaded) plus the lines still waiting on the phone
 * (lib/df estimateFix, in the browser). Null when nothing waits: the server's fix is the one to show.
 */
export function offlineFix(stored: BearingView[], queued: QueuedItem[]): { fix: Fix; pending: number; lines: number } | null {
  const pendingLines = queued.filter((q) => q.state === 'waiting').map(queuedLine).filter((l): l is LineOfBearing => l !== null);
  if (!pendingLines.length) return null;
  const lines = [...toLines(stored), ...pendingLines];
  return { fix: estimateFix(lines), pending: pendingLines.length, lines: lines.length };
}
