import { describe, expect, it } from 'vitest';
import { estimateFix } from '@/lib/df';
import { api, signIn } from '../support/http';
import { sceneLines } from '../unit/df/support/scene';

// Observers placed with GeographicLib (Karney 2013) around an invented source on open land.
const lines = sceneLines({ lat: -31.7, lon: 129.0 }, [
  { fromSourceAzDeg: 15, rangeM: 600, sigmaDeg: 2 },
  { fromSourceAzDeg: 140, rangeM: 900, sigmaDeg: 3 },
  { fromSourceAzDeg: 260, rangeM: 750, sigmaDeg: 2.5 },
]);

describe('POST /api/df/fix', () => {
  it('returns exactly the Fix that lib/df computes', async () => {
    const s = await signIn('hunter@example.test');
    const r = await api('/api/df/fix', { session: s, body: { lines, confidence: 0.9 } });
    expect(r.status).toBe(200);
    expect(r.json).toEqual(JSON.parse(JSON.stringify(estimateFix(lines, { confidence: 0.9 }))));
    expect(r.json.ellipse.confidence).toBe(0.9);
  });

  it('answers the robust fix: a reflected line set aside, the all-lines fix as the alternative (Lenth 1981)', async () => {
    // five lines around the source, the second bent by 30 degrees (a reflection, invented)
    const five = sceneLines({ lat: -31.7, lon: 129.0 }, [15, 85, 160, 235, 305].map((az, i) => ({ fromSourceAzDeg: az, rangeM: 450 + 30 * i, sigmaDeg: 2 })));
    five[1].azimuthDeg += 30;
    const s = await signIn('hunter@example.test');
    const r = await api('/api/df/fix', { session: s, body: { lines: five } });
    expect(r.status).toBe(200);
    expect(r.json).toEqual(JSON.parse(JSON.stringify(estimateFix(five))));
    expect(r.json.outlierIds).toEqual(['L1']);
    expect(r.json.allLines).toBeDefined();
    expect(r.json.notices.map((n: { code: string }) => n.code)).toContain('lines-set-aside');
  });

  it('answers a refusal as Fix JSON and bad input as 400 with zod issues', async () => {
    const s = await signIn('member@example.test');
    const one = await api('/api/df/fix', { session: s, body: { lines: lines.slice(0, 1) } });
    expect(one.status).toBe(200);
    expect(one.json).toMatchObject({ ok: false, reason: 'too-few-lines' });
    const bad = await api('/api/df/fix', { session: s, body: { lines: [{ lat: 'north', lon: 0, azimuthDeg: 10 }], confidence: 2 } });
    expect(bad.status).toBe(400);
    expect(bad.json.issues.map((i: { path: string }) => i.path).sort()).toEqual(['confidence', 'lines.0.lat']);
  });
});
