/** Loop shape and size in metres. */
export type LoopShape =
  | { shape: 'circle'; diameterM: number }
  | { shape: 'square'; sideM: number }
  | { shape: 'rectangle'; widthM: number; heightM: number }
  | { shape: 'regular-polygon'; sides: number; sideM: number };

/**
 * Circumference (perimeter) of a loop from its shape and size.
 * @returns metres; NaN for sizes that are not positive and finite
 */
export function loopCircumferenceM(loop: LoopShape): number {
  const pos = (...v: number[]) => v.every((x) => Number.isFinite(x) && x > 0);
  switch (loop?.shape) {
    case 'circle':
      return pos(loop.diameterM) ? Math.PI * loop.diameterM : NaN;
    case 'square':
      return pos(loop.sideM) ? 4 * loop.sideM : NaN;
    case 'rectangle':
      return pos(loop.widthM, loop.heightM) ? 2 * (loop.widthM + loop.heightM) : NaN;
    case 'regular-polygon':
      return pos(loop.sideM) && Number.isInteger(loop.sides) && loop.sides >= 3 ? loop.sides * loop.sideM : NaN;
    default:
      return NaN;
  }
}
