/** Reading numbers as typed on a phone (pure helpers, no DOM). */

/**
 * A decimal number as typed, with a comma or a point as the decimal mark ("212,5" or "212.5").
 * @returns the number; undefined for an empty field; NaN for text that is not a number
 */
export function parseDecimal(text: unknown): number | undefined {
  if (typeof text === 'number') return text;
  if (typeof text !== 'string') return undefined;
  const t = text.trim().replace(',', '.');
  if (t === '') return undefined;
  return /^[-+]?(\d+\.?\d*|\.\d+)$/.test(t) ? Number(t) : NaN;
}

/**
 * A receiver level as typed: dBm ("-97.5"), or S-units ("7", "7.5", or "9+20" for S9 + 20 dB).
 * "9+20" becomes 9 + 20/6 S-units so that the IARU Region 1 scale (6 dB per S-unit, continued
 * past S9) gives the same level in dBm as "S9 + 20 dB".
 * @param unit 'dBm' or 'S'; the "S9+N" form is accepted for S-units only
 * @returns the level in `unit`; undefined when empty; NaN when not a level
 */
export function parseLevel(text: unknown, unit: 'dBm' | 'S'): number | undefined {
  if (typeof text === 'string' && unit === 'S') {
    const m = /^\s*[sS]?\s*(\d+(?:[.,]\d+)?)\s*\+\s*(\d+(?:[.,]\d+)?)\s*(?:dB)?\s*$/i.exec(text);
    if (m) return Number(m[1].replace(',', '.')) + Number(m[2].replace(',', '.')) / 6;
    return parseDecimal(text.replace(/^\s*[sS]/, ''));
  }
  return parseDecimal(text);
}

/** Degrees folded into [0, 360). */
export function normalizeDeg(deg: number): number {
  return ((deg % 360) + 360) % 360;
}
