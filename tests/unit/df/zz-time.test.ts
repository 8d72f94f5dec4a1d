import fc from 'fast-check';
import { it } from 'vitest';
import { estimateFix } from '@/lib/df';
import { gaussian, mulberry32, sceneLines, type Spot } from './support/scene';
const SOURCE = { lat: -12.4, lon: 95.3 };
it('t', () => {
  const spotsArb = fc.array(fc.record({ fromSourceAzDeg: fc.double({ min: 0, max: 360, noNaN: true }), rangeM: fc.double({ min: 200, max: 8000, noNaN: true }), sigmaDeg: fc.double({ min: 1, max: 6, noNaN: true }) }), { minLength: 3, maxLength: 7 });
  const samples = fc.sample(spotsArb, { numRuns: 300, seed: 5 });
  let worst = 0, wc: Spot[] = [], total = 0;
  for (const s of samples) { const lines = sceneLines(SOURCE, s, gaussian(mulberry32(1))); const t0 = performance.now(); estimateFix(lines); const dt = performance.now() - t0; total += dt; if (dt > worst) { worst = dt; wc = s; } }
  console.log('total', total.toFixed(0), 'worst', worst.toFixed(1), JSON.stringify(wc));
}, 60000);
