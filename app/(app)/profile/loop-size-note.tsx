import { loopCheck, loopCircumferenceM, type LoopShape } from '@/lib/df';
import { BANDS } from '@/lib/hunt/bands';
import type { LOOP_SHAPES } from '@/lib/validation/profile';

type Shape = (typeof LOOP_SHAPES)[number];

/** Circumference in metres from the profile's shape and size (diameter, side, or circumference for "other"). */
export function circumferenceOf(shape: Shape | null | undefined, sizeM: number | null | undefined): number {
  if (!shape || typeof sizeM !== 'number' || !Number.isFinite(sizeM) || sizeM <= 0) return NaN;
  const loops: Record<Exclude<Shape, 'other'>, LoopShape> = {
    circle: { shape: 'circle', diameterM: sizeM },
    square: { shape: 'square', sideM: sizeM },
    octagon: { shape: 'regular-polygon', sides: 8, sideM: sizeM },
  };
  return shape === 'other' ? sizeM : loopCircumferenceM(loops[shape]);
}

const mhz = (hz: number) => `${(hz / 1e6).toFixed(hz < 10e6 ? 2 : 1)} MHz`;

/** The loop's circumference and the highest frequency at which it is still a small loop (circumference ≤ 0.1 λ). */
export function LoopSizeNote({ shape, sizeM }: { shape: Shape | null | undefined; sizeM: number | null | undefined }) {
  const c = circumferenceOf(shape, sizeM);
  if (!Number.isFinite(c)) return <p className="text-sm text-ink-soft">Give the shape and size to see how high in frequency the loop still works as a small loop.</p>;
  const maxHz = loopCheck(c, 1e6).maxSmallFrequencyHz;
  const bands = BANDS.filter((b) => b.toKhz * 1000 <= maxHz).map((b) => b.name);
  return (
    <div className="rounded-lg bg-hush-50 p-3 text-sm text-hush-900" aria-live="polite" data-testid="loop-note">
      <p>
        Circumference <strong>{c.toFixed(2)} m</strong>. It stays a small loop (circumference ≤ 0.1 λ) up to <strong>{mhz(maxHz)}</strong>.
      </p>
      <p>
        {bands.length
          ? `Good for ${bands.length === 1 ? bands[0] : `${bands[0]} to ${bands[bands.length - 1]}`}; above ${mhz(maxHz)} its nulls fill in and bearings get vague.`
          : 'Too large for a small loop on any amateur band from 160m up; a smaller loop gives sharper nulls.'}
      </p>
    </div>
  );
}
