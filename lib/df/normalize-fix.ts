import type { Fix, FixEstimate, FixNotice } from './types';

/** Shape of an ok fix stored by earlier versions: main = all lines, `withoutOutliers` the alternative, string warnings. */
type OldOkFix = Omit<Extract<Fix, { ok: true }>, 'notices' | 'varianceFactor' | 'allLines'> & {
  withoutOutliers?: FixEstimate;
  notices?: FixNotice[];
  varianceFactor?: number;
  allLines?: FixEstimate;
};

/**
 * Brings a stored Fix (JSON written by any version of estimateFix) to the current shape, so old
 * snapshots still render: an old fix with `withoutOutliers` becomes a fix whose main estimate is
 * that robust one and whose `allLines` is the old main; string-only warnings become notices with
 * code 'note'; a missing varianceFactor is 1. A current fix is returned unchanged.
 * @param fix a Fix as parsed from JSON
 * @returns the fix in the current shape
 */
export function normalizeFix(fix: Fix): Fix {
  if (!fix || typeof fix !== 'object' || !fix.ok) return fix;
  const old = fix as unknown as OldOkFix;
  if (Array.isArray(old.notices) && typeof old.varianceFactor === 'number') return fix;
  const { withoutOutliers, ...rest } = old;
  const warnings = Array.isArray(rest.warnings) ? rest.warnings.filter((w): w is string => typeof w === 'string') : [];
  const upgraded = {
    ...rest,
    ...(withoutOutliers ? { lat: withoutOutliers.lat, lon: withoutOutliers.lon, ellipse: withoutOutliers.ellipse, allLines: { lat: old.lat, lon: old.lon, ellipse: old.ellipse } } : {}),
    varianceFactor: old.varianceFactor ?? 1,
    warnings,
    notices: old.notices ?? warnings.map((message) => ({ code: 'note' as const, message })),
  };
  return upgraded as Fix;
}
