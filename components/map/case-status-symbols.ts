import type { CaseStatus } from '@/db/types';
import { PALETTE } from './map-styles';

/** Our status symbols: open a triangle, located a diamond, notified a square, resolved a small disc. */
const SHAPES: Record<CaseStatus, (fill: string) => string> = {
  open: (f) => `<polygon points="9,2 16,16 2,16" fill="${f}" stroke="#fff" stroke-width="1.5"/>`,
  located: (f) => `<polygon points="9,1 17,9 9,17 1,9" fill="${f}" stroke="#fff" stroke-width="1.5"/>`,
  notified: (f) => `<rect x="3" y="3" width="12" height="12" fill="#fff" stroke="${f}" stroke-width="3"/>`,
  resolved: (f) => `<circle cx="9" cy="9" r="5" fill="${f}" stroke="#fff" stroke-width="1.5"/>`,
};
export const STATUS_COLOURS: Record<CaseStatus, string> = { open: PALETTE.flare500, located: PALETTE.hush700, notified: PALETTE.ink, resolved: PALETTE.inkFaint };

export function statusSymbolSvg(status: CaseStatus, size = 18) {
  return `<svg width="${size}" height="${size}" viewBox="0 0 18 18" aria-hidden="true">${SHAPES[status](STATUS_COLOURS[status])}</svg>`;
}

