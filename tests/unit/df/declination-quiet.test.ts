import { afterEach, describe, expect, it, vi } from 'vitest';
import { declinationInfo } from '@/lib/df';

// Pure math prints nothing: magvar's own once-per-process notice for dates outside the World
// Magnetic Model 2025 validity (NOAA NCEI / BGS: 2025.0-2030.0) is returned as a warning instead.
// Alone in its file so magvar's notice has not been used up by another test in this process.
describe('declinationInfo is quiet', () => {
  afterEach(() => vi.restoreAllMocks());

  it('outside the validity window: a warning in the result, nothing on the console', () => {
    const spies = (['warn', 'log', 'info', 'error'] as const).map((m) => vi.spyOn(console, m).mockImplementation(() => {}));
    const info = declinationInfo(45, 10, new Date('2032-06-01T00:00:00Z'));
    expect(info.warning).toMatch(/2025/);
    expect(Number.isFinite(info.declinationDeg)).toBe(true);
    for (const s of spies) expect(s).not.toHaveBeenCalled();
    // console.warn is restored afterwards (it was only silenced for the call)
    console.warn('still works');
    expect(spies[0]).toHaveBeenCalledTimes(1);
  });
});
