import { loopCheck } from './loop-check';
import { nearFieldRadiusM } from './near-field-radius-m';

/**
 * Plain-language warnings about a measurement setup.
 * @param input frequencyHz in hertz; loopCircumferenceM in metres; distanceM: observer-to-fix
 *   distance in metres. Any may be missing; missing or invalid values give no warning.
 * @returns warnings, empty when nothing looks wrong
 */
export function sanityWarnings(input: { frequencyHz?: number; loopCircumferenceM?: number; distanceM?: number }): string[] {
  const warnings: string[] = [];
  const f = input?.frequencyHz;
  if (!(typeof f === 'number' && Number.isFinite(f) && f > 0)) return warnings;
  const c = input.loopCircumferenceM;
  if (typeof c === 'number' && Number.isFinite(c) && c > 0) {
    const check = loopCheck(c, f);
    if (!check.isSmall) {
      warnings.push(
        `The loop is ${check.circumferenceWavelengths.toFixed(2)} wavelengths around, too large for ${(f / 1e6).toFixed(3)} MHz: ` +
          `its nulls fill in and may shift. It behaves as a small loop up to ${(check.maxSmallFrequencyHz / 1e6).toFixed(1)} MHz.`,
      );
    }
  }
  const d = input.distanceM;
  const r = nearFieldRadiusM(f);
  if (typeof d === 'number' && Number.isFinite(d) && d >= 0 && d < r) {
    warnings.push(
      `This spot is about ${Math.round(d)} m from the fix, inside the source's reactive near field (about ${Math.round(r)} m at this frequency): ` +
        'nulls there need not point at the source. Prefer bearings from farther away.',
    );
  }
  return warnings;
}
