/** Request bodies tests share. Fiction: invented places on open land. */

/** A valid noise report (POST /api/cases); `over` replaces top-level fields. */
export function noiseReport(over: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    title: 'Hash on 40 m',
    sound: 'hash',
    description: 'Evenings only.',
    frequencies: [{ value: 7.1, unit: 'MHz' }],
    schedule: { days: ['mon'], pattern: 'continuous', note: '' },
    position: { lat: -31.41, lon: 129.31, source: 'map' },
    consentShareName: false,
    ...over,
  };
}
