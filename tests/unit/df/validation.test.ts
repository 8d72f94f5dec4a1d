import { describe, expect, it } from 'vitest';
import { fixRequestSchema, lineOfBearingSchema } from '@/lib/validation/df';

// Schema limits are the product's own choices (no external source).
describe('df validation schemas', () => {
  const line = { id: 'a', lat: 44.2, lon: -27.6, azimuthDeg: 123.4, sigmaDeg: 3, oneWay: false };

  it('accepts a good line and normalises the longitude', () => {
    expect(lineOfBearingSchema.parse(line)).toEqual(line);
    expect(lineOfBearingSchema.parse({ ...line, lon: 190 }).lon).toBeCloseTo(-170, 12);
    expect(lineOfBearingSchema.parse({ ...line, lon: -540 }).lon).toBeCloseTo(180 - 360, 12);
    expect(lineOfBearingSchema.parse({ ...line, azimuthDeg: -725 }).azimuthDeg).toBe(-725);
  });

  it('rejects bad values', () => {
    for (const bad of [
      { ...line, lat: 90.5 }, { ...line, lon: 541 }, { ...line, azimuthDeg: Infinity }, { ...line, sigmaDeg: 0 },
      { ...line, sigmaDeg: 46 }, { ...line, oneWay: 'yes' }, { ...line, id: 'x'.repeat(65) }, { ...line, lat: NaN },
    ]) expect(lineOfBearingSchema.safeParse(bad).success).toBe(false);
  });

  it('fix request: 1..2000 lines, confidence in (0, 1)', () => {
    expect(fixRequestSchema.safeParse({ lines: [line] }).success).toBe(true);
    expect(fixRequestSchema.safeParse({ lines: [] }).success).toBe(false);
    expect(fixRequestSchema.safeParse({ lines: Array(2001).fill(line) }).success).toBe(false);
    expect(fixRequestSchema.safeParse({ lines: [line], confidence: 0.95 }).success).toBe(true);
    expect(fixRequestSchema.safeParse({ lines: [line], confidence: 1 }).success).toBe(false);
    expect(fixRequestSchema.safeParse({ lines: [line], confidence: 0 }).success).toBe(false);
  });
});
