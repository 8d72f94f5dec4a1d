/**
 * Amateur HF/VHF band edges in kHz (the widest allocation among the ITU regions; IARU band plans).
 * A frequency outside them is named by its whole megahertz, e.g. "9 MHz".
 */
export const BANDS: { name: string; fromKhz: number; toKhz: number }[] = [
  { name: '160m', fromKhz: 1800, toKhz: 2000 },
  { name: '80m', fromKhz: 3500, toKhz: 4000 },
  { name: '60m', fromKhz: 5250, toKhz: 5450 },
  { name: '40m', fromKhz: 7000, toKhz: 7300 },
  { name: '30m', fromKhz: 10100, toKhz: 10150 },
  { name: '20m', fromKhz: 14000, toKhz: 14350 },
  { name: '17m', fromKhz: 18068, toKhz: 18168 },
  { name: '15m', fromKhz: 21000, toKhz: 21450 },
  { name: '12m', fromKhz: 24890, toKhz: 24990 },
  { name: '10m', fromKhz: 28000, toKhz: 29700 },
  { name: '6m', fromKhz: 50000, toKhz: 54000 },
  { name: '2m', fromKhz: 144000, toKhz: 148000 },
];

/** The band a frequency (kHz) falls in. */
export function bandOf(khz: number): string {
  const b = BANDS.find((x) => khz >= x.fromKhz && khz <= x.toKhz);
  if (b) return b.name;
  return khz < 1000 ? `${Math.round(khz)} kHz` : `${Math.floor(khz / 1000)} MHz`;
}

/** kHz from a typed value and unit. */
export const toKhz = (value: number, unit: 'kHz' | 'MHz') => (unit === 'MHz' ? value * 1000 : value);
