import { describe, expect, it } from 'vitest';
import { estimateFix, fitNullSweep } from '@/lib/df';
import { covers } from './support/covers';
import { distanceM, gaussian, mulberry32, sceneLines, type Spot } from './support/scene';

// Seeded Monte Carlo, GeographicLib truth (Karney 2013); invented scenes on open sea.
const SOURCE = { lat: -35.2, lon: -20.4 }; // open South Atlantic

describe('honest region in poor geometry (likelihood-ratio region, Lenth 1981 Technometrics 23(2))', { timeout: 30_000 }, () => {
  const cases: [string, Spot[], number][] = [
    ['two lines crossing at 10 degrees, 1 km', [{ fromSourceAzDeg: 0, rangeM: 1000 }, { fromSourceAzDeg: 10, rangeM: 1000 }], 0.92],
    ['two lines crossing at 20 degrees, 2 and 3 km', [{ fromSourceAzDeg: 100, rangeM: 2000 }, { fromSourceAzDeg: 120, rangeM: 3000 }], 0.92],
    ['three lines within 25 degrees, 1-2 km', [{ fromSourceAzDeg: 200, rangeM: 1000 }, { fromSourceAzDeg: 212, rangeM: 1500 }, { fromSourceAzDeg: 225, rangeM: 2000 }], 0.92],
  ];
  let seed = 70;
  for (const [name, spots, min] of cases) {
    it(`${name}: region covers the source in >= ${min * 100} % of fixes (the rest refused as near-parallel)`, () => {
      const noise = gaussian(mulberry32(seed++));
      const trials = 300;
      let hit = 0, regions = 0, refused = 0;
      for (let t = 0; t < trials; t++) {
        const fix = estimateFix(sceneLines(SOURCE, spots, noise));
        if (!fix.ok) { refused++; continue; }
        if (fix.region) regions++;
        if (covers(fix, SOURCE)) hit++;
      }
      console.log(`[df] ${name}: covered ${(hit / trials * 100).toFixed(1)} %, region drawn in ${(regions / trials * 100).toFixed(0)} %, refused ${(refused / trials * 100).toFixed(1)} %, covered among fixes ${(hit / (trials - refused) * 100).toFixed(1)} %`);
      expect(hit / (trials - refused)).toBeGreaterThanOrEqual(min);
      expect(refused / trials).toBeLessThan(0.2);
    });
  }

  it('the region is a closed [lon, lat] ring around the fix, and the ellipse is at least as large in area', () => {
    const fix = estimateFix(sceneLines(SOURCE, cases[0][1], gaussian(mulberry32(3))));
    expect(fix.ok).toBe(true);
    if (!fix.ok || !fix.region) return;
    expect(fix.region[0]).toEqual(fix.region[fix.region.length - 1]);
    expect(Math.abs(fix.region[0][0] - fix.lon)).toBeLessThan(1);
    expect(Math.abs(fix.region[0][1] - fix.lat)).toBeLessThan(1);
  });
});

describe('duplicate lines count once (common practice, no source)', { timeout: 30_000 }, () => {
  const spots: Spot[] = [{ fromSourceAzDeg: 0, rangeM: 900 }, { fromSourceAzDeg: 110, rangeM: 700 }, { fromSourceAzDeg: 230, rangeM: 600 }];

  it('the same line entered twice: same fix and ellipse as once, and a notice naming both', () => {
    const noise = gaussian(mulberry32(11));
    for (let t = 0; t < 50; t++) {
      const lines = sceneLines(SOURCE, spots, noise);
      const once = estimateFix(lines);
      const twice = estimateFix([...lines, { ...lines[1], id: 'again', lat: lines[1].lat + 1e-6 * (t % 3), azimuthDeg: lines[1].azimuthDeg + 0.1 }]);
      expect(once.ok && twice.ok).toBe(true);
      if (!once.ok || !twice.ok) continue;
      expect(distanceM(once, twice)).toBeLessThan(1e-3);
      expect(twice.ellipse.semiMajorM).toBeCloseTo(once.ellipse.semiMajorM, 3);
      const n = twice.notices.find((x) => x.code === 'duplicate-lines');
      expect(n?.ids).toEqual(['L1', 'again']);
      expect(twice.residuals[3].setAside).toBe(true);
    }
  });

  it('lines from the same spot in clearly different directions are not merged', () => {
    const lines = sceneLines(SOURCE, spots);
    const fix = estimateFix([...lines, { ...lines[1], id: 'other', azimuthDeg: lines[1].azimuthDeg + 5 }]);
    expect(fix.ok && fix.notices.some((x) => x.code === 'duplicate-lines')).toBe(false);
  });
});

describe('one-way lines constrain (Stansfield 1947 likelihood on the unfolded bearing)', { timeout: 30_000 }, () => {
  it('noisy one-way lines: the fix is never behind one of them', () => {
    const noise = gaussian(mulberry32(21));
    const rand = mulberry32(22);
    let behind = 0, fixes = 0;
    for (let t = 0; t < 200; t++) {
      const spots: Spot[] = [0, 1, 2].map((i) => ({ fromSourceAzDeg: 120 * i + 60 * rand(), rangeM: 300 + 1500 * rand(), sigmaDeg: 8, oneWay: i < 2 }));
      const fix = estimateFix(sceneLines(SOURCE, spots, noise));
      if (!fix.ok) continue;
      fixes++;
      if (fix.residuals.some((r, i) => spots[i].oneWay && Math.abs(r.offsetDeg) > 90)) behind++;
    }
    expect(fixes).toBeGreaterThan(160);
    expect(behind).toBe(0);
  });

  it('two one-way lines that diverge are refused with the reason, not fixed behind both', () => {
    const two = sceneLines(SOURCE, [{ fromSourceAzDeg: 0, rangeM: 1000, oneWay: true }, { fromSourceAzDeg: 90, rangeM: 1000, oneWay: true }]);
    two[0].azimuthDeg += 160;
    two[1].azimuthDeg += 200;
    const fix = estimateFix(two);
    expect(fix).toMatchObject({ ok: false, reason: 'behind-one-way' });
    if (!fix.ok) expect(fix.message).toMatch(/L0, L1.*one-way/);
  });

  it('a one-way line pulls the fix to its side when two-way lines alone would be ambiguous', () => {
    const lines = sceneLines(SOURCE, [{ fromSourceAzDeg: 0, rangeM: 800, oneWay: true }, { fromSourceAzDeg: 80, rangeM: 800, oneWay: true }, { fromSourceAzDeg: 200, rangeM: 900 }]);
    const fix = estimateFix(lines);
    expect(fix.ok && distanceM(fix, SOURCE)).toBeLessThan(1);
  });
});

describe('sweep sigma for small samples (Student 1908 t factor; Abramowitz & Stegun 26.7.5)', { timeout: 30_000 }, () => {
  function sweep(nullDeg: number, depthDb: number, azimuths: number[], noise: () => number) {
    const b = 1 / (Math.pow(10, depthDb / 10) - 1);
    return azimuths.map((az) => {
      const s = Math.sin(((az - nullDeg) * Math.PI) / 180);
      return { azimuthDeg: az, levelDbm: -70 + 10 * Math.log10(s * s + b) + noise() };
    });
  }
  const angleDiff = (a: number, b: number) => Math.abs((((a - b) % 180) + 270) % 180 - 90);

  it('7-point sweeps around the null: +-1.96 sigma covers the true null in >= 93 % (was 88-90 %)', () => {
    const noise = gaussian(mulberry32(77));
    const rand = mulberry32(78);
    let inside = 0, fits = 0;
    for (let t = 0; t < 600; t++) {
      const nullDeg = 180 * rand();
      const az = [-45, -30, -15, 0, 15, 30, 45].map((d) => nullDeg + d + 4 * (rand() - 0.5));
      const fit = fitNullSweep(sweep(nullDeg, 25, az, () => noise() * 1.5));
      if (!fit.ok) continue;
      fits++;
      if (angleDiff(fit.nullAzimuthDeg, nullDeg) <= 1.96 * fit.sigmaDeg) inside++;
    }
    console.log(`[df] 7-point sweeps: sigma coverage ${(inside / fits * 100).toFixed(1)} % of ${fits}`);
    expect(inside / fits).toBeGreaterThanOrEqual(0.93);
    expect(inside / fits).toBeLessThanOrEqual(0.985);
  });
});
