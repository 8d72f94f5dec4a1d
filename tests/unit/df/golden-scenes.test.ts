import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { estimateFix, type Fix, type LineOfBearing } from '@/lib/df';

// Golden in/out scenes (Turf style): fixtures/in/<scene>.json -> estimateFix -> fixtures/out/<scene>.json.
// Regenerate after an intended change with REGEN=true and review the diff of the out files.
// The scenes are invented (open sea); their truth is checked by the Monte-Carlo tests, these
// files show what changed in behaviour.
const dir = path.join(__dirname, 'fixtures');
const round = (x: number, d: number) => Number(x.toFixed(d));

function summary(fix: Fix) {
  if (!fix.ok) return { ok: false, reason: fix.reason, message: fix.message };
  const e = (x: { lat: number; lon: number; ellipse: { semiMajorM: number; semiMinorM: number; majorAxisAzimuthDeg: number } }) => ({
    lat: round(x.lat, 6), lon: round(x.lon, 6),
    ellipse: { semiMajorM: round(x.ellipse.semiMajorM, 1), semiMinorM: round(x.ellipse.semiMinorM, 1), majorAxisAzimuthDeg: round(x.ellipse.majorAxisAzimuthDeg, 1) },
  });
  return {
    ok: true,
    fix: e(fix),
    varianceFactor: round(fix.varianceFactor, 3),
    outlierIds: fix.outlierIds,
    allLines: fix.allLines ? e(fix.allLines) : null,
    region: fix.region ? { vertices: fix.region.length, first: fix.region[0].map((v) => round(v, 6)) } : null,
    notices: fix.notices.map((n) => ({ code: n.code, ids: n.ids ?? [] })),
    setAside: fix.residuals.map((r, i) => (r.setAside ? r.id ?? String(i) : null)).filter(Boolean),
  };
}

describe('golden scenes (fixtures/in -> fixtures/out)', () => {
  for (const file of readdirSync(path.join(dir, 'in')).filter((f) => f.endsWith('.json')).sort()) {
    it(file.replace('.json', ''), () => {
      const scene = JSON.parse(readFileSync(path.join(dir, 'in', file), 'utf8')) as { lines: LineOfBearing[] };
      const out = summary(estimateFix(scene.lines));
      const outFile = path.join(dir, 'out', file);
      if (process.env.REGEN === 'true') {
        mkdirSync(path.dirname(outFile), { recursive: true });
        writeFileSync(outFile, JSON.stringify(out, null, 2) + '\n');
      }
      expect(out).toEqual(JSON.parse(readFileSync(outFile, 'utf8')));
    });
  }
});
