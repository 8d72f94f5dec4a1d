/**
 * What the case map draws for a fix, in a real browser at 360 px: in poor geometry (two lines
 * crossing at 12 degrees) the likelihood region instead of the ellipse; with a reflected line the
 * robust fix's ellipse, the all-lines alternative and the set-aside line; the fix marker above
 * the next-spot targets. Geometry from GeographicLib (Karney 2013) toward an invented source on
 * open land; what is expected of the fix comes from the API (lib/df), the test checks the drawing.
 */
import { expect, test, type Browser } from '@playwright/test';
import { signInPage } from '../support/sign-in-page';
import { api, signIn } from '../support/http';
import { noiseReport } from '../support/fixtures';
// GeographicLib's Direct/Inverse (the reference library itself, not lib/df's internals).
import { geodesicDirect, geodesicInverse } from '../support/geodesic';

const SOURCE = { lat: -31.655, lon: 129.31 };
/** An observer rangeM from the source, bearing toward it (rounded to 0.1 degree) plus bendDeg. */
const spot = (fromSourceDeg: number, rangeM: number, bendDeg = 0) => {
  const o = geodesicDirect(SOURCE.lat, SOURCE.lon, fromSourceDeg, rangeM);
  const az = geodesicInverse(o.lat, o.lon, SOURCE.lat, SOURCE.lon).azi1 + bendDeg;
  return { lat: o.lat, lon: o.lon, azimuthDeg: Math.round((((az % 360) + 360) % 360) * 10) / 10 };
};

/** A case of our own, assigned to the demo hunter, with these bearings stored (sharp nulls, true north). */
async function caseWith(title: string, spots: { lat: number; lon: number; azimuthDeg: number }[]): Promise<string> {
  const [member, coordinator, hunter] = await Promise.all(['member', 'coordinator', 'hunter'].map((w) => signIn(`${w}@example.test`)));
  const filed = await api('/api/cases', { session: member, body: noiseReport({ title, position: { lat: SOURCE.lat + 0.004, lon: SOURCE.lon - 0.004, source: 'map' } }) });
  expect(filed.status, filed.text).toBe(201);
  const caseId: string = filed.json.case.id;
  const hunterId: string = (await api('/api/auth/session', { session: hunter })).json.user.id;
  const c = (await api(`/api/cases/${caseId}`, { session: coordinator })).json;
  expect((await api(`/api/cases/${caseId}`, { method: 'PATCH', session: coordinator, body: { version: c.version, assigneeId: hunterId } })).status).toBe(200);
  for (const s of spots) {
    const r = await api(`/api/cases/${caseId}/bearings`, { session: hunter, body: { lat: s.lat, lon: s.lon, positionSource: 'map', reference: 'true', azimuthDeg: s.azimuthDeg, quality: 'sharp' } });
    expect(r.status, r.text).toBe(201);
  }
  return caseId;
}

async function hunterPage(browser: Browser) {
  const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });
  const page = await context.newPage();
  await signInPage(page, 'hunter@example.test');
  return page;
}

test('poor geometry: the map draws the likelihood region, not an ellipse', async ({ browser }, info) => {
  test.skip(info.project.name !== 'phone-360', 'one run, at phone width');
  test.setTimeout(120_000);
  const caseId = await caseWith('Buzz at the far fence (narrow crossing)', [spot(0, 1000), spot(12, 1000)]);
  const page = await hunterPage(browser);
  const fix = (await (await page.request.get(`/api/cases/${caseId}/fix`)).json()).current.fix;
  expect(fix.ok).toBe(true);
  expect(fix.region.length).toBeGreaterThan(3);
  await page.goto(`/cases/${caseId}`);
  const map = page.getByTestId('case-map');
  await expect(map.locator('.qf-bearing')).toHaveCount(2);
  await expect(map.locator('.qf-region')).toHaveCount(1);
  await expect(map.locator('.qf-ellipse')).toHaveCount(1); // the region is the one drawn shape
  await expect(map.locator('.qf-ellipse-alt')).toHaveCount(0);
  await map.screenshot({ path: info.outputPath('region.png') });
});

test('a reflected line: robust fix drawn, all-lines alternative beside it, fix above the next spots', async ({ browser }, info) => {
  test.skip(info.project.name !== 'phone-360', 'one run, at phone width');
  test.setTimeout(120_000);
  // five lines around the source, the second bent by 30 degrees (a reflection, invented)
  const caseId = await caseWith('Hum by the sheds (one reflected line)', [spot(15, 450), spot(85, 520, 30), spot(160, 480), spot(235, 560), spot(305, 500)]);
  const page = await hunterPage(browser);
  const view = await (await page.request.get(`/api/cases/${caseId}/fix`)).json();
  const fix = view.current.fix;
  expect(fix.ok).toBe(true);
  expect(fix.outlierIds).toHaveLength(1);
  expect(fix.allLines).toBeDefined();
  expect(fix.region).toBeUndefined();
  expect(geodesicInverse(fix.lat, fix.lon, SOURCE.lat, SOURCE.lon).s12).toBeLessThan(geodesicInverse(fix.allLines.lat, fix.allLines.lon, SOURCE.lat, SOURCE.lon).s12);
  expect(view.nextSpots.length).toBeGreaterThan(0);
  await page.goto(`/cases/${caseId}`);
  const map = page.getByTestId('case-map');
  await expect(map.locator('.qf-bearing')).toHaveCount(5);
  await expect(map.locator('.qf-bearing-outlier')).toHaveCount(1);
  await expect(map.locator('.qf-ellipse:not(.qf-region)')).toHaveCount(1);
  await expect(map.locator('.qf-region')).toHaveCount(0);
  await expect(map.locator('.qf-ellipse-alt')).toHaveCount(1);
  await expect(map.locator('.qf-fix-alt')).toHaveCount(1);
  await expect(map.locator('.qf-spot')).toHaveCount(view.nextSpots.length);
  // Leaflet stacks markers by z-index: the fix's must be above every next-spot target's
  const z = async (sel: string) => map.locator(sel).evaluateAll((els) => els.map((e) => Number(getComputedStyle(e).zIndex)));
  const [fixZ] = await z('.qf-fix');
  for (const spotZ of await z('.qf-spot')) expect(fixZ).toBeGreaterThan(spotZ);
  await map.screenshot({ path: info.outputPath('reflection.png') });
});
