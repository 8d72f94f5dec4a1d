import { describe, expect, it } from 'vitest';
import {
  dbmToSUnits, excessOverNoiseDb, manMadeNoiseInfo, impedanceRatioFromTurns, loopCheck, loopCircumferenceM, manMadeNoiseFamDb,
  nearFieldRadiusM, noisePowerDbm, NULL_SIGMA_PRESETS_DEG, nullWidthToSigmaDeg, sanityWarnings, sUnitsToDbm, wavelengthM,
} from '@/lib/df';

describe('S-meter, IARU Region 1 Technical Recommendation R.1', () => {
  it('S9 is -73 dBm below 30 MHz and -93 dBm above; 6 dB per S-unit', () => {
    expect(sUnitsToDbm(9, 0, 7.1e6)).toBe(-73);
    expect(sUnitsToDbm(9, 0, 145e6)).toBe(-93);
    expect(sUnitsToDbm(1, 0, 3.6e6)).toBe(-121); // S1 on HF
    expect(sUnitsToDbm(9, 20, 14e6)).toBe(-53); // S9+20 dB
    expect(dbmToSUnits(-85, 7e6)).toMatchObject({ sUnits: 7, overS9Db: 0, label: 'S7' });
    expect(dbmToSUnits(-63, 7e6)).toMatchObject({ sUnits: 9, overS9Db: 10, label: 'S9+10 dB' });
    expect(dbmToSUnits(-93, 50e6).label).toBe('S9');
  });
  it('labels at exact boundaries: whole decibels first, then the S-unit reached and the dB above it', () => {
    // S9 = -73 dBm and 6 dB per unit (IARU R.1, recalled from memory); "S8+3 dB" between units is
    // the labelling asked for in issue 9 (this project's convention)
    expect(dbmToSUnits(-73, 7e6).label).toBe('S9');
    expect(dbmToSUnits(-73.4, 7e6).label).toBe('S9');
    expect(dbmToSUnits(-76, 7e6).label).toBe('S8+3 dB');
    expect(dbmToSUnits(-79, 7e6).label).toBe('S8');
    expect(dbmToSUnits(-78.6, 7e6).label).toBe('S8');
    expect(dbmToSUnits(-78.4, 7e6).label).toBe('S8+1 dB');
    expect(dbmToSUnits(-72.6, 7e6).label).toBe('S9');
    expect(dbmToSUnits(-72.4, 7e6).label).toBe('S9+1 dB');
    expect(dbmToSUnits(-127, 7e6).label).toBe('S0');
    expect(dbmToSUnits(-140, 7e6).label).toBe('S0');
    expect(dbmToSUnits(-76, 7e6).sUnits).toBeCloseTo(8.5, 10);
  });
});

describe('ITU-R P.372 validity range (0.3-250 MHz, recalled from memory of the Recommendation)', () => {
  it('warns outside the range, not inside', () => {
    expect(manMadeNoiseInfo('residential', 7e6).warning).toBeUndefined();
    expect(manMadeNoiseInfo('residential', 7e6).famDb).toBeCloseTo(49.09, 2);
    expect(manMadeNoiseInfo('residential', 137e3).warning).toMatch(/0.3 to 250 MHz/);
    expect(manMadeNoiseInfo('city', 400e6).warning).toMatch(/extrapolation/);
    expect(manMadeNoiseInfo('galactic', 3e6).warning).toMatch(/ionosphere/);
    expect(manMadeNoiseInfo('rural', -1).warning).toBeDefined();
  });
});

describe('ITU-R P.372 noise (Table 1 constants), values computed by hand', () => {
  it('Fam = c - d log10(f MHz)', () => {
    expect(manMadeNoiseFamDb('residential', 7e6)).toBeCloseTo(72.5 - 27.7 * Math.log10(7), 10);
    expect(manMadeNoiseFamDb('residential', 7e6)).toBeCloseTo(49.09, 2); // 72.5 - 27.7 * 0.8451
    expect(manMadeNoiseFamDb('city', 10e6)).toBeCloseTo(49.1, 10); // 76.8 - 27.7
    expect(manMadeNoiseFamDb('rural', 1e6)).toBeCloseTo(67.2, 10);
    expect(manMadeNoiseFamDb('quiet-rural', 10e6)).toBeCloseTo(25.0, 10); // 53.6 - 28.6
    expect(manMadeNoiseFamDb('galactic', 10e6)).toBeCloseTo(29.0, 10); // 52.0 - 23.0
  });
  it('noise power in a bandwidth and the excess of a reading over it', () => {
    // residential at 10 MHz: Fam 44.8 dB; 2.4 kHz: 44.8 - 174 + 33.80 = -95.40 dBm
    expect(noisePowerDbm(manMadeNoiseFamDb('residential', 10e6), 2400)).toBeCloseTo(-95.40, 2);
    expect(excessOverNoiseDb(-75.4, 'residential', 10e6, 2400)).toBeCloseTo(20.0, 2);
    expect(noisePowerDbm(NaN, 2400)).toBeNaN();
  });
});

describe('wavelength, near field, loop size', () => {
  it('wavelength and reactive near-field radius lambda / 2 pi', () => {
    expect(wavelengthM(299_792_458)).toBe(1); // c exact (SI)
    expect(wavelengthM(7e6)).toBeCloseTo(42.83, 2);
    expect(nearFieldRadiusM(7e6)).toBeCloseTo(42.827 / (2 * Math.PI), 2); // about 6.8 m
    expect(wavelengthM(0)).toBeNaN();
  });
  it('small loop: circumference <= 0.1 lambda (common practice, no source)', () => {
    const c = loopCircumferenceM({ shape: 'circle', diameterM: 0.5 });
    expect(c).toBeCloseTo(Math.PI * 0.5, 12);
    expect(loopCircumferenceM({ shape: 'square', sideM: 0.4 })).toBeCloseTo(1.6, 12);
    expect(loopCircumferenceM({ shape: 'rectangle', widthM: 0.3, heightM: 0.5 })).toBeCloseTo(1.6, 12);
    expect(loopCircumferenceM({ shape: 'regular-polygon', sides: 8, sideM: 0.2 })).toBeCloseTo(1.6, 12);
    expect(loopCircumferenceM({ shape: 'square', sideM: -1 })).toBeNaN();
    const check = loopCheck(1.6, 7e6); // 1.6 m at 42.83 m wavelength
    expect(check.isSmall).toBe(true);
    expect(check.maxSmallFrequencyHz).toBeCloseTo(0.1 * 299_792_458 / 1.6, 3); // about 18.7 MHz
    expect(loopCheck(1.6, 28e6).isSmall).toBe(false);
  });
  it('sanity warnings: loop too large, inside the near field', () => {
    expect(sanityWarnings({ frequencyHz: 28e6, loopCircumferenceM: 1.6 }).join(' ')).toMatch(/too large/);
    expect(sanityWarnings({ frequencyHz: 3.6e6, distanceM: 5 }).join(' ')).toMatch(/near field/); // lambda/2pi = 13 m
    expect(sanityWarnings({ frequencyHz: 3.6e6, loopCircumferenceM: 1.6, distanceM: 200 })).toEqual([]);
    expect(sanityWarnings({})).toEqual([]);
  });
});

describe('null width and transformers (common practice, no source)', () => {
  it('half the null width as 1-sigma; presets sharp/fair/broad 2/4/8 degrees', () => {
    expect(nullWidthToSigmaDeg(10)).toBe(5);
    expect(nullWidthToSigmaDeg(0)).toBeNaN();
    expect(NULL_SIGMA_PRESETS_DEG).toEqual({ sharp: 2, fair: 4, broad: 8 });
  });
  it('impedance ratio is the turns ratio squared', () => {
    expect(impedanceRatioFromTurns(4, 12)).toBeCloseTo(9, 12); // 1:9
    expect(impedanceRatioFromTurns(1, 2)).toBe(4); // 1:4
    expect(impedanceRatioFromTurns(0, 2)).toBeNaN();
  });
});
