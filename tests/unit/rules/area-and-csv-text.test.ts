import { describe, expect, it } from 'vitest';
import { booleanPointInPolygon, point, polygon } from '@turf/turf';
import { areaPolygon, areaSchema, areaText } from '@/lib/validation/queue';
import { guardCsvText, unguardCsvText } from '@/lib/export/csv-text';

/**
 * The drawn area's rules (lib/validation/queue.ts) and the CSV-injection guard (lib/export/csv-text.ts).
 * Polygon validity: OGC Simple Features (a ring must not cross itself); closed rings: RFC 7946 §3.1.6.
 * The characters that start a formula: OWASP "CSV Injection" (= + - @, tab, carriage return).
 */
describe('areaSchema', () => {
  it('reads lon,lat;… and gives a closed GeoJSON ring that Turf reads as a polygon around its middle', () => {
    const a = areaSchema.parse('129.74,-31.06;129.76,-31.06;129.75,-31.04');
    expect(a.vertices).toEqual([[129.74, -31.06], [129.76, -31.06], [129.75, -31.04]]);
    const ring = areaPolygon(a).coordinates[0];
    expect(ring[0]).toEqual(ring.at(-1));
    expect(booleanPointInPolygon(point([129.75, -31.055]), polygon([ring]))).toBe(true);
    expect(booleanPointInPolygon(point([129.70, -31.055]), polygon([ring]))).toBe(false);
    expect(areaSchema.parse(areaText(a))).toEqual(a);
  });

  it('drops a closing vertex equal to the first, and takes the old box form as its four corners', () => {
    expect(areaSchema.parse('0,0;1,0;1,1;0,0').vertices).toHaveLength(3);
    expect(areaSchema.parse('129.7,-31.1,129.8,-31').vertices).toEqual([[129.7, -31.1], [129.8, -31.1], [129.8, -31], [129.7, -31]]);
  });

  it.each([
    ['0,0;1,1;1,0;0,1', /crosses itself/],
    ['0,0;1,1', /at least 3/],
    ['0,0;1,0;200,1', /off the globe/],
    ['0,0;1,1;2,2', /no ground/],
    ['0,0;1,0;1,0;0,1', /twice in a row/],
    ['0,0;1,x;0,1', /not lon,lat/],
    ['0,0;1,0;0,1;', /not lon,lat/],
    ['1,2,3', /box west,south,east,north/],
  ])('%s is refused: %s', (text, message) => {
    const r = areaSchema.safeParse(text);
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].message).toMatch(message);
  });

  it('takes 50 vertices and refuses 51', () => {
    const ring = (n: number) => Array.from({ length: n }, (_, k) => `${Math.cos((2 * Math.PI * k) / n).toFixed(5)},${Math.sin((2 * Math.PI * k) / n).toFixed(5)}`).join(';');
    expect(areaSchema.safeParse(ring(50)).success).toBe(true);
    expect(areaSchema.safeParse(ring(51)).error!.issues[0].message).toMatch(/at most 50/);
  });
});

describe('guardCsvText', () => {
  it.each(['=1+1', '+1', '-2', '@SUM(A1)', '\tx', '\rx'])('%j gets a leading apostrophe and comes back unchanged', (s) => {
    expect(guardCsvText(s)).toBe(`'${s}`);
    expect(unguardCsvText(guardCsvText(s))).toBe(s);
  });
  it('plain text, empty and missing values pass as they are', () => {
    expect(guardCsvText('from the lane')).toBe('from the lane');
    expect(guardCsvText("'quoted")).toBe("'quoted");
    expect(unguardCsvText("'quoted")).toBe("'quoted");
    expect(guardCsvText(null)).toBe('');
    expect(guardCsvText('')).toBe('');
  });
});
