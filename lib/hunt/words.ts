/** Plain-language formatting of case data (dates, frequencies, levels, distances, angles). */
import { dbmToSUnits } from '@/lib/df';
import { bandOf } from '@/lib/hunt/bands';
import { WEEKDAYS } from '@/lib/validation/cases';
import type { ReportData } from '@/lib/hunt/views';

const MINUS = '\u2212';

/** A signed number with a real minus sign, e.g. "−95". */
export const signed = (n: number, digits = 0) => (n < 0 ? MINUS : '') + Math.abs(n).toFixed(digits);

export const formatWhen = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });

export const formatTime = (iso: string) => new Date(iso).toLocaleTimeString(undefined, { hour: '2-digit', minute: '2-digit' });

/** "3.573 MHz" or "475 kHz", with the band it falls in. */
export function frequencyWords(khz: number): string {
  const f = khz < 1000 ? `${+khz.toFixed(3)} kHz` : `${+(khz / 1000).toFixed(4)} MHz`;
  return `${f} (${bandOf(khz)})`;
}

/** "−91 dBm (S6)"; the S-unit uses the frequency's IARU Region 1 reference (HF below 30 MHz). */
export function levelWords(dbm: number, khz?: number): string {
  const s = dbmToSUnits(dbm, (khz ?? 10_000) * 1000);
  return `${signed(dbm)} dBm (${s.label})`;
}

export const metres = (m: number) => (m < 1000 ? `${Math.round(m)} m` : `${(m / 1000).toFixed(m < 10_000 ? 2 : 1)} km`);

export const degrees = (d: number, digits = 1) => `${d.toFixed(digits)}°`;

const DAY_NAMES: Record<(typeof WEEKDAYS)[number], string> = {
  mon: 'Mon',
  tue: 'Tue',
  wed: 'Wed',
  thu: 'Thu',
  fri: 'Fri',
  sat: 'Sat',
  sun: 'Sun',
};
export const dayName = (d: string) => DAY_NAMES[d as keyof typeof DAY_NAMES] ?? d;

const hour = (h: number) => `${String(h).padStart(2, '0')}:00`;

/** "Intermittent, Mon, Tue, 18:00–23:00 — mostly evenings". */
export function scheduleWords(s: NonNullable<ReportData['schedule']>): string {
  const parts: string[] = [s.pattern === 'continuous' ? 'Continuous' : 'Intermittent'];
  parts.push(s.days.length === 0 || s.days.length === 7 ? 'any day' : s.days.map(dayName).join(', '));
  if (s.fromHour !== undefined || s.toHour !== undefined) parts.push(`${s.fromHour !== undefined ? hour(s.fromHour) : '…'}–${s.toHour !== undefined ? hour(s.toHour) : '…'}`);
  return parts.join(', ') + (s.note ? ` — ${s.note}` : '');
}
