import { estimateFix } from '../lib/df';
import { Geodesic } from '../lib/df/internal/geodesy';
function mulberry32(seed: number) { let a = seed >>> 0; return () => { a = (a + 0x6d2b79f5) >>> 0; let t = a; t = Math.imul(t ^ (t >>> 15), t | 1); t ^= t + Math.imul(t ^ (t >>> 7), t | 61); return ((t ^ (t >>> 14)) >>> 0) / 4294967296; }; }
const gaussian = (r: () => number) => () => Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
function sceneLines(source: any, spots: any[], noise?: () => number) {
  return spots.map((s, i) => { const obs = Geodesic.WGS84.Direct(source.lat, source.lon, s.fromSourceAzDeg, s.rangeM); const inv = Geodesic.WGS84.Inverse(obs.lat2!, obs.lon2!, source.lat, source.lon); const sigmaDeg = s.sigmaDeg ?? 3; return { id: `L${i}`, lat: obs.lat2!, lon: obs.lon2!, azimuthDeg: inv.azi1! + (noise ? noise() * sigmaDeg : 0), sigmaDeg, oneWay: s.oneWay }; });
}
const d = (a: any, b: any) => Geodesic.WGS84.Inverse(a.lat, a.lon, b.lat, b.lon).s12!;
const SOURCE = { lat: -12.4, lon: 95.3 };
const spots = [{"fromSourceAzDeg":359.99999999999994,"rangeM":3281.593249107827,"sigmaDeg":5.999999999999998},{"fromSourceAzDeg":40,"rangeM":2814.3884409140674,"sigmaDeg":2.329572556751876},{"fromSourceAzDeg":262.117639013252,"rangeM":200.0000000000001,"sigmaDeg":2.86558507887128},{"fromSourceAzDeg":8.787507804206168e-150,"rangeM":337.0120708386902,"sigmaDeg":5.982949186707772},{"fromSourceAzDeg":1.1665731572033396e-23,"rangeM":200.00000000000023,"sigmaDeg":5.999999999999994},{"fromSourceAzDeg":9e-323,"rangeM":200.7887920208376,"sigmaDeg":2.5492593553081786},{"fromSourceAzDeg":0.020406744975418337,"rangeM":927.0963520149362,"sigmaDeg":1.0000000000000018}];
const lines = sceneLines(SOURCE, spots, gaussian(mulberry32(999988)));
const a: any = estimateFix(lines), b: any = estimateFix([...lines].reverse());
console.log(d(a, b), a.ellipse, b.ellipse, a.outlierIds, b.outlierIds, a.notices.map((n: any) => n.code), b.notices.map((n: any) => n.code), a.varianceFactor, b.varianceFactor, !!a.region, !!b.region);
{
const SOURCE = { lat: 44.2, lon: -27.6 };
const spots = [{ fromSourceAzDeg: 30, rangeM: 900 }, { fromSourceAzDeg: 150, rangeM: 700 }, { fromSourceAzDeg: 260, rangeM: 500 }];
const lines = sceneLines(SOURCE, spots.map((s) => ({ ...s, oneWay: true })));
lines[2].azimuthDeg += 180;
const f: any = estimateFix(lines);
console.log(f.ok, f.reason, f.message, f.ok && d(f, SOURCE), f.notices, f.residuals);
// two diverging one-way lines
const two = sceneLines(SOURCE, [{ fromSourceAzDeg: 0, rangeM: 1000, oneWay: true }, { fromSourceAzDeg: 90, rangeM: 1000, oneWay: true }]);
two[0].azimuthDeg += 180 - 20; two[1].azimuthDeg += 180 + 20;
const g: any = estimateFix(two);
console.log(g.ok, g.reason, g.message, g.ok && d(g, SOURCE), g.notices);
}
