import { describe, expect, it } from 'vitest';
import { estimateFix } from '@/lib/df';
import { distanceM, gaussian, insideEllipse, mulberry32, sceneLines, type Spot } from './support/scene';

// Scenes: GeographicLib (Karney 2013) truth, invented source points on open sea.
const SOURCE = { lat: 44.2, lon: -27.6 }; // mid North Atlantic
const TRIALS = 2000;

const geometries: Record<string, Spot[]> = {
  'three lines, wide spread, 3 degrees': [
    { fromSourceAzDeg: 10, rangeM: 800, sigmaDeg: 3 },
    { fromSourceAzDeg: 135, rangeM: 1500, sigmaDeg: 3 },
    { fromSourceAzDeg: 250, rangeM: 400, sigmaDeg: 3 },
  ],
  'four lines, mixed sigmas and ranges': [
    { fromSourceAzDeg: 0, rangeM: 3000, sigmaDeg: 2 },
    { fromSourceAzDeg: 80, rangeM: 600, sigmaDeg: 4 },
    { fromSourceAzDeg: 170, rangeM: 5000, sigmaDeg: 3 },
    { fromSourceAzDeg: 290, rangeM: 1200, sigmaDeg: 5 },
  ],
  'two lines at 75 degrees': [
    { fromSourceAzDeg: 200, rangeM: 700, sigmaDeg: 3 },
    { fromSourceAzDeg: 275, rangeM: 500, sigmaDeg: 3 },
  ],
  'two lines at 90 degrees, long range': [
    { fromSourceAzDeg: 30, rangeM: 4000, sigmaDeg: 2 },
    { fromSourceAzDeg: 120, rangeM: 6000, sigmaDeg: 2 },
  ],
};

describe('95 % ellipse is honest under Gaussian bearing noise (seeded Monte Carlo)', () => {
  let seed = 1;
  for (const [name, spots] of Object.entries(geometries)) {
    it(`${name}: true point inside in 93-97 % of ${TRIALS} trials`, () => {
      const noise = gaussian(mulberry32(seed++));
      let inside = 0;
      for (let t = 0; t < TRIALS; t++) {
        const fix = estimateFix(sceneLines(SOURCE, spots, noise));
        if (fix.ok && insideEllipse(fix, fix.ellipse, SOURCE)) inside++;
      }
      const rate = inside / TRIALS;
      console.log(`[df] clean data, ${name}: 95 % ellipse covers ${(rate * 100).toFixed(1)} % of ${TRIALS}`);
      expect(rate).toBeGreaterThanOrEqual(0.93);
      expect(rate).toBeLessThanOrEqual(0.97);
    });
  }

  it('ellipse scale for 95 % is sqrt(-2 ln 0.05) = 2.4477 (chi-square, 2 dof)', () => {
    const lines = sceneLines(SOURCE, geometries['three lines, wide spread, 3 degrees']);
    const a = estimateFix(lines, { confidence: 0.95 });
    const b = estimateFix(lines, { confidence: 1 - Math.exp(-0.5) }); // 1-sigma ellipse: scale 1
    expect(a.ok && b.ok).toBe(true);
    if (a.ok && b.ok) expect(a.ellipse.semiMajorM / b.ellipse.semiMajorM).toBeCloseTo(2.4477, 4);
  });
});

describe('outliers', () => {
  const spots: Spot[] = [0, 50, 100, 160, 220, 290].map((az, i) => ({ fromSourceAzDeg: az, rangeM: 600 + 150 * i, sigmaDeg: 3 }));

  it('sets aside a line bent by a reflection; the all-lines fix is the alternative', () => {
    const lines = sceneLines(SOURCE, spots, gaussian(mulberry32(99)));
    lines[3].azimuthDeg += 25; // reflection off a fence: 25 degrees off (invented)
    const fix = estimateFix(lines);
    expect(fix.ok).toBe(true);
    if (!fix.ok) return;
    expect(fix.outlierIds).toEqual(['L3']);
    expect(fix.allLines).toBeDefined();
    expect(distanceM(fix, SOURCE)).toBeLessThan(distanceM(fix.allLines!, SOURCE));
    expect(fix.residuals[3].setAside).toBe(true);
    expect(fix.notices.map((n) => n.code)).toContain('lines-set-aside');
  });

  it('names lines without id by their index', () => {
    const lines = sceneLines(SOURCE, spots).map(({ id: _id, ...rest }) => rest);
    lines[1].azimuthDeg += 30;
    const fix = estimateFix(lines);
    expect(fix.ok && fix.outlierIds).toEqual(['1']);
  });

  it('rarely flags clean data with 10 lines (false-flag rate < 5 %)', () => {
    const ten: Spot[] = Array.from({ length: 10 }, (_, i) => ({ fromSourceAzDeg: i * 36 + 5, rangeM: 300 + 250 * i, sigmaDeg: 3 }));
    const noise = gaussian(mulberry32(2024));
    let flagged = 0;
    const trials = 400;
    for (let t = 0; t < trials; t++) {
      const fix = estimateFix(sceneLines(SOURCE, ten, noise));
      if (fix.ok && fix.outlierIds.length > 0) flagged++;
    }
    console.log(`[df] clean 10 lines: false flags ${(flagged / trials * 100).toFixed(1)} % of ${trials}`);
    expect(flagged / trials).toBeLessThan(0.05);
  });

  it('with three disagreeing lines it says the odd one cannot be told', () => {
    const lines = sceneLines(SOURCE, [0, 120, 240].map((az) => ({ fromSourceAzDeg: az, rangeM: 800, sigmaDeg: 2 })));
    lines[0].azimuthDeg += 20;
    const fix = estimateFix(lines);
    expect(fix.ok && fix.outlierIds).toEqual([]);
    expect(fix.ok && fix.warnings.join(' ')).toMatch(/fourth bearing/);
  });
});

describe('loop 180-degree ambiguity and one-way lines', () => {
  const spots: Spot[] = [{ fromSourceAzDeg: 30, rangeM: 900 }, { fromSourceAzDeg: 150, rangeM: 700 }, { fromSourceAzDeg: 260, rangeM: 500 }];

  it('flipping a two-way line by 180 degrees moves nothing', () => {
    const lines = sceneLines(SOURCE, spots, gaussian(mulberry32(5)));
    const a = estimateFix(lines);
    const b = estimateFix(lines.map((l, i) => (i === 1 ? { ...l, azimuthDeg: l.azimuthDeg + 180 } : l)));
    expect(a.ok && b.ok).toBe(true);
    if (a.ok && b.ok) {
      expect(distanceM(a, b)).toBeLessThan(1e-3);
      expect(b.residuals[1].offsetDeg).toBeCloseTo(a.residuals[1].offsetDeg, 6);
    }
  });

  it('refuses, naming the line, when the lines can only cross behind a one-way line', () => {
    const lines = sceneLines(SOURCE, spots.map((s) => ({ ...s, oneWay: true })));
    lines[2].azimuthDeg += 180;
    const fix = estimateFix(lines);
    expect(fix).toMatchObject({ ok: false, reason: 'behind-one-way' });
    if (fix.ok) return;
    expect(fix.message).toMatch(/behind line L2/);
    expect(fix.message).not.toMatch(/L0/);
  });
});

describe('refusals', () => {
  it('too few lines', () => {
    expect(estimateFix([])).toMatchObject({ ok: false, reason: 'too-few-lines' });
    expect(estimateFix(sceneLines(SOURCE, [{ fromSourceAzDeg: 0, rangeM: 500 }]))).toMatchObject({ ok: false, reason: 'too-few-lines' });
  });

  it('near-parallel lines', () => {
    const two = sceneLines(SOURCE, [{ fromSourceAzDeg: 0, rangeM: 2000 }, { fromSourceAzDeg: 0.5, rangeM: 2100 }]);
    const fix = estimateFix(two);
    expect(fix).toMatchObject({ ok: false, reason: 'near-parallel' });
    if (!fix.ok) expect(fix.message).toMatch(/spot well to the side/);
    // two observers side by side both bearing due north: the lines never cross
    const never = [
      { lat: 44.0, lon: -27.6, azimuthDeg: 0 },
      { lat: 44.0, lon: -27.59, azimuthDeg: 0 },
    ];
    expect(estimateFix(never)).toMatchObject({ ok: false, reason: 'near-parallel' });
  });

  it('invalid input names the line and the problem', () => {
    const good = sceneLines(SOURCE, [{ fromSourceAzDeg: 0, rangeM: 500 }, { fromSourceAzDeg: 90, rangeM: 500 }]);
    const r1 = estimateFix([good[0], { ...good[1], lat: 91 }]);
    expect(r1).toMatchObject({ ok: false, reason: 'invalid-input' });
    if (!r1.ok) expect(r1.message).toMatch(/L1.*latitude/);
    expect(estimateFix([good[0], { ...good[1], sigmaDeg: 0 }])).toMatchObject({ reason: 'invalid-input' });
    expect(estimateFix([good[0], { ...good[1], azimuthDeg: NaN }])).toMatchObject({ reason: 'invalid-input' });
    expect(estimateFix([good[0], { ...good[1], lon: Infinity }])).toMatchObject({ reason: 'invalid-input' });
    expect(estimateFix(good, { confidence: 1 })).toMatchObject({ reason: 'invalid-input' });
    expect(estimateFix(good, { confidence: 0 })).toMatchObject({ reason: 'invalid-input' });
  });
});
