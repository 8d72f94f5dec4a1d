import { describe, expect, it } from 'vitest';
import * as geographiclib from 'geographiclib-geodesic';
import { confidenceRadius, ellipsePolygon, whiteningAffine } from '@/lib/df';

type GL = typeof geographiclib;
const G: GL = (geographiclib as GL & { default?: GL }).default?.Geodesic ? (geographiclib as { default?: GL }).default! : geographiclib;
const WGS84 = G.Geodesic.WGS84;
const apply = (m: NonNullable<ReturnType<typeof whiteningAffine>>, lat: number, lon: number) => Math.hypot(m.a * lon + m.b * lat + m.xoff, m.d * lon + m.e * lat + m.yoff);

describe('whiteningAffine', () => {
  // Chi-square quantile, 2 degrees of freedom: -2 ln(0.05) = 5.9915 (any statistics table), sqrt = 2.4477.
  it('uses the chi-square radius of the confidence level', () => {
    expect(confidenceRadius(0.95)).toBeCloseTo(2.4477, 4);
    expect(confidenceRadius(0.3935)).toBeCloseTo(1, 3); // 1 - e^(-1/2): the 1-sigma ellipse
  });

  it('maps the 95 % ellipse onto the circle of that radius, and agrees with GeographicLib offsets inside it', () => {
    const centre = { lat: -31.05, lon: 129.75 };
    const ellipse = { semiMajorM: 140, semiMinorM: 55, majorAxisAzimuthDeg: 62, confidence: 0.95 };
    const m = whiteningAffine(centre, ellipse)!;
    const k = confidenceRadius(0.95);
    for (const [lat, lon] of ellipsePolygon(centre, ellipse, 36)) expect(apply(m, lat, lon) / k).toBeCloseTo(1, 3);
    // points placed with GeographicLib Direct (Karney 2013): Mahalanobis distance from their own east/north offset
    const az = (ellipse.majorAxisAzimuthDeg * Math.PI) / 180;
    for (const [bearing, s] of [[0, 50], [62, 140], [152, 55], [200, 80], [300, 30]]) {
      const p = WGS84.Direct(centre.lat, centre.lon, bearing, s);
      const e = s * Math.sin((bearing * Math.PI) / 180);
      const n = s * Math.cos((bearing * Math.PI) / 180);
      const expected = Math.hypot((e * Math.sin(az) + n * Math.cos(az)) / (ellipse.semiMajorM / k), (e * Math.cos(az) - n * Math.sin(az)) / (ellipse.semiMinorM / k));
      expect(apply(m, p.lat2!, p.lon2!)).toBeCloseTo(expected, 2);
    }
  });

  it('refuses unusable input', () => {
    expect(whiteningAffine({ lat: 10, lon: 10 }, { semiMajorM: 10, semiMinorM: 0, majorAxisAzimuthDeg: 0, confidence: 0.95 })).toBeNull();
    expect(whiteningAffine({ lat: Number.NaN, lon: 10 }, { semiMajorM: 10, semiMinorM: 5, majorAxisAzimuthDeg: 0, confidence: 0.95 })).toBeNull();
  });
});
