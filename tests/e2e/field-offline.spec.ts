/**
 * The hunt without signal, in a real browser at 360 × 640 against the production build (its
 * service worker from `serwist build`): open a case online, go offline, reload (the screen comes
 * from the service worker and says what it shows), add a bearing and two level readings, see them
 * queued and kept across a reload, go online, see each on the server exactly once (a forced
 * second send stores nothing new), and see a refused item with the server's reason. Screenshots
 * of the field screen, walk mode and the queue go to test-results/field/. Geometry from
 * GeographicLib (Karney 2013) toward an invented source on open land.
 */
import { expect, test, type Page } from '@playwright/test';
import { signInPage } from '../support/sign-in-page';
import { api, signIn, type Session } from '../support/http';
import { noiseReport } from '../support/fixtures';
import { geodesicDirect, geodesicInverse } from '../support/geodesic';

const SOURCE = { lat: -31.7132, lon: 129.2127 };
const spot = (fromSourceDeg: number, rangeM: number) => {
  const o = geodesicDirect(SOURCE.lat, SOURCE.lon, fromSourceDeg, rangeM);
  const az = geodesicInverse(o.lat, o.lon, SOURCE.lat, SOURCE.lon).azi1;
  return { lat: o.lat, lon: o.lon, azimuthDeg: Math.round((((az % 360) + 360) % 360) * 10) / 10 };
};
const SHOTS = 'test-results/field';

type Counts = { bearings: number; readings: number };
async function serverCounts(s: Session, caseId: string): Promise<Counts> {
  const [b, r] = await Promise.all([api(`/api/cases/${caseId}/bearings`, { session: s }), api(`/api/cases/${caseId}/readings`, { session: s })]);
  return { bearings: b.json.total, readings: r.json.total };
}

/** Every item in the phone's IndexedDB queue (read straight from the browser's store). */
const queuedInBrowser = (page: Page) =>
  page.evaluate(
    () =>
      new Promise<{ clientId: string; url: string; body: Record<string, unknown>; state: string }[]>((resolve, reject) => {
        const open = indexedDB.open('quietfix-field');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const req = open.result.transaction('queue').objectStore('queue').getAll();
          req.onsuccess = () => resolve(req.result);
          req.onerror = () => reject(req.error);
        };
      }),
  );

/** Bytes held in the service worker's precache (Serwist's precache cache). */
const precacheBytes = (page: Page) =>
  page.evaluate(async () => {
    let bytes = 0;
    let entries = 0;
    for (const name of await caches.keys()) {
      if (!name.includes('precache')) continue;
      const cache = await caches.open(name);
      for (const req of await cache.keys()) {
        const res = await cache.match(req);
        bytes += (await res!.clone().arrayBuffer()).byteLength;
        entries++;
      }
    }
    return { bytes, entries };
  });

/** True when two boxes overlap (px). */
const overlaps = (a: { x: number; y: number; width: number; height: number }, b: { x: number; y: number; width: number; height: number }) =>
  a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

test('offline: the field screen reopens from the service worker, typed items wait and are stored once', async ({ browser }, info) => {
  test.skip(info.project.name !== 'phone-360', 'one run, at phone width');
  test.setTimeout(180_000);

  // A case of our own, assigned to the demo hunter, with two lines already stored.
  const [member, coordinator, hunterApi] = await Promise.all(['member', 'coordinator', 'hunter'].map((w) => signIn(`${w}@example.test`)));
  const filed = await api('/api/cases', { session: member, body: noiseReport({ title: 'Offline walk test', position: { lat: SOURCE.lat + 0.003, lon: SOURCE.lon + 0.003, source: 'map' } }) });
  expect(filed.status, filed.text).toBe(201);
  const caseId: string = filed.json.case.id;
  const hunterId: string = (await api('/api/auth/session', { session: hunterApi })).json.user.id;
  const c = (await api(`/api/cases/${caseId}`, { session: coordinator })).json;
  expect((await api(`/api/cases/${caseId}`, { method: 'PATCH', session: coordinator, body: { version: c.version, assigneeId: hunterId } })).status).toBe(200);
  for (const s of [spot(20, 420), spot(140, 380)]) {
    const r = await api(`/api/cases/${caseId}/bearings`, { session: hunterApi, body: { lat: s.lat, lon: s.lon, positionSource: 'map', reference: 'true', azimuthDeg: s.azimuthDeg, quality: 'sharp' } });
    expect(r.status, r.text).toBe(201);
  }
  const third = spot(260, 400);
  const context = await browser.newContext({
    viewport: { width: 360, height: 640 },
    isMobile: true,
    hasTouch: true,
    geolocation: { latitude: third.lat, longitude: third.lon, accuracy: 6 },
    permissions: ['geolocation'],
  });
  const page = await context.newPage();
  await signInPage(page, 'hunter@example.test');

  // 1. Online: open the field screen; once the worker controls the page, load it again so the
  //    page and its data go into the worker's caches.
  await page.goto(`/cases/${caseId}/field`);
  await expect(page.getByTestId('fix-summary')).toContainText('±');
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.reload();
  await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller)).toBe(true);
  await expect(page.getByTestId('fix-summary')).toContainText('±');
  await expect(page.getByTestId('case-map').locator('.qf-bearing')).toHaveCount(2);
  const manifest = await page.request.get('/manifest.webmanifest');
  expect(manifest.status()).toBe(200);
  expect((await manifest.json()).short_name).toBe('Quietfix');

  // The 360 × 640 layout: nav on one line, the fix figure never under the action bar, map ≥ 40 %, buttons ≥ 48 px.
  const header = await page.locator('header').first().boundingBox();
  expect(header!.height).toBeLessThanOrEqual(64);
  const bar = (await page.getByTestId('action-bar').boundingBox())!;
  await expect(page.getByTestId('bar-fix')).toContainText('±');
  await page.getByTestId('fix-summary').scrollIntoViewIfNeeded();
  const figure = (await page.getByTestId('fix-summary').locator('p').first().boundingBox())!;
  expect(overlaps(figure, bar), `fix figure ${JSON.stringify(figure)} vs bar ${JSON.stringify(bar)}`).toBe(false);
  const map = (await page.getByTestId('case-map').locator('.leaflet-container').boundingBox())!;
  expect(map.height / 640).toBeGreaterThanOrEqual(0.4);
  // The map's own note (no tiles here) never covers its zoom buttons.
  const zoomButtons = (await page.getByTestId('case-map').locator('.leaflet-control-zoom').boundingBox())!;
  const tilesNote = (await page.getByTestId('case-map').getByTestId('tiles-off').boundingBox())!;
  expect(overlaps(tilesNote, zoomButtons), `note ${JSON.stringify(tilesNote)} vs zoom ${JSON.stringify(zoomButtons)}`).toBe(false);
  for (const target of [...['Add bearing', 'Sweep', 'Bearings', 'Walk', 'Sign out'].map((name) => page.getByRole('button', { name, exact: true })), page.getByTestId('nav-menu')]) {
    const box = (await target.boundingBox())!;
    expect(box.height, (await target.textContent()) ?? "").toBeGreaterThanOrEqual(48);
  }
  // The menu opens from the keyboard and lists the pages.
  await page.getByTestId('nav-menu').focus();
  await page.keyboard.press('Enter');
  await expect(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cases' })).toBeVisible();
  await page.keyboard.press('Enter');
  // Next spots: a list under the fix, each with its distance from where the phone stands.
  await expect(page.getByTestId('spot-distance').first()).toContainText('from you');
  const precache = await precacheBytes(page);
  console.log(`[field] precache: ${precache.entries} entries, ${(precache.bytes / 1e6).toFixed(2)} MB`);
  expect(precache.entries).toBeGreaterThan(10);
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: `${SHOTS}/field-screen-360.png` });

  // 2. Offline: a reload still renders, from the worker, and says what it shows.
  await context.setOffline(true);
  await page.reload();
  await expect(page.getByTestId('fix-summary')).toContainText('±');
  await expect(page.getByTestId('offline-copy')).toContainText('Showing what was last loaded at');
  await expect(page.getByTestId('case-map').locator('.qf-bearing')).toHaveCount(2);

  // 3. A bearing and two level readings, typed offline.
  await page.getByRole('button', { name: 'Walk', exact: true }).click();
  await expect(page.getByTestId('walk-position')).toContainText('±6 m');
  await page.getByRole('button', { name: 'Bearings', exact: true }).click();
  await page.getByRole('button', { name: 'Add bearing' }).click();
  const form = page.getByRole('form', { name: 'Add a bearing' });
  await form.getByRole('button', { name: 'Use my location' }).click();
  await expect(form.getByTestId('position-summary')).toContainText('device', { timeout: 30_000 });
  await form.getByLabel('Azimuth of the null (degrees)').fill(third.azimuthDeg.toFixed(1));
  await form.getByText('True', { exact: true }).click();
  await form.getByText('Sharp', { exact: true }).click();
  await form.getByRole('button', { name: 'Save bearing' }).click();
  await expect(page.getByText('Bearing kept on this phone')).toBeVisible();
  await expect(page.getByTestId('offline-fix')).toContainText('Not yet sent');
  await expect(page.getByTestId('offline-fix')).toContainText('3 lines, 1 of them still waiting');
  const phoneFigure = (await page.getByTestId('offline-fix').locator('p.text-3xl').textContent())!.trim();
  expect(phoneFigure).toMatch(/^±\d+ m$/);

  await page.getByRole('button', { name: 'Walk', exact: true }).click();
  await expect(page.getByTestId('walk-position')).toContainText('±6 m');
  await page.getByRole('group', { name: 'Log the level in S-units' }).getByRole('button', { name: 'S7', exact: true }).click();
  await expect(page.getByText('S7 kept on this phone (not yet sent).')).toBeVisible();
  await context.setGeolocation({ latitude: third.lat + 0.0001, longitude: third.lon, accuracy: 5 });
  await page.getByRole('group', { name: 'Log the level in S-units' }).getByRole('button', { name: 'S9', exact: true }).click();
  await expect(page.getByTestId('queue-count')).toHaveText('3 waiting to send');
  await expect(page.getByTestId('trail-peak')).toBeVisible();
  await page.screenshot({ path: `${SHOTS}/walk-mode-360.png` });

  // Kept across a reload (IndexedDB), still offline.
  await page.reload();
  await expect(page.getByTestId('queue-count')).toHaveText('3 waiting to send');
  await page.getByTestId('queue-panel').scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${SHOTS}/queue-360.png` });
  const queued = await queuedInBrowser(page);
  expect(queued.map((q) => q.url.split('/').pop())).toEqual(expect.arrayContaining(['bearings', 'readings', 'readings']));
  expect(await serverCounts(hunterApi, caseId)).toEqual({ bearings: 2, readings: 0 });

  // 4. Online again: sent in order, each stored once.
  const t0 = Date.now();
  await context.setOffline(false);
  await expect.poll(() => serverCounts(hunterApi, caseId), { timeout: 20_000, intervals: [100] }).toEqual({ bearings: 3, readings: 2 });
  const storedMs = Date.now() - t0;
  await expect(page.getByTestId('queue-panel')).toContainText('All sent: 3 stored on the server.');
  console.log(`[field] queued 3 items (1 bearing, 2 readings), sent 3; reconnect -> all stored on the server in ${storedMs} ms`);
  info.annotations.push({ type: 'field figures', description: `queued 3, sent 3, reconnect to stored ${storedMs} ms, precache ${precache.bytes} bytes in ${precache.entries} entries` });
  await expect(page.getByTestId('offline-fix')).toHaveCount(0);
  // The phone's fix (lib/df in the browser) was the one the server computes once the line arrives.
  const serverFix = (await api(`/api/cases/${caseId}/fix`, { session: hunterApi })).json.current.fix;
  expect(`±${Math.round(serverFix.ellipse.semiMajorM)} m`).toBe(phoneFigure);
  await expect(page.getByTestId('fix-summary')).toContainText(phoneFigure);
  const readings = (await api(`/api/cases/${caseId}/readings`, { session: hunterApi })).json.items;
  expect(readings.map((r: { level: { value: number } }) => r.level.value)).toEqual([7, 9]);

  // A forced second send of every item (the same clientIds) stores nothing new: 200, same rows.
  for (const q of queued) {
    const again = await api(q.url, { session: hunterApi, body: q.body });
    expect(again.status, again.text).toBe(200);
  }
  expect(await serverCounts(hunterApi, caseId)).toEqual({ bearings: 3, readings: 2 });

  // 5. Refused items: typed offline, the case is closed meanwhile, the server's reason stays on screen;
  //    one is edited and sent again once the case is back to open, the other discarded.
  await context.setOffline(true);
  await page.getByRole('button', { name: 'Walk', exact: true }).click();
  const sButtons = page.getByRole('group', { name: 'Log the level in S-units' });
  await sButtons.getByRole('button', { name: 'S5', exact: true }).click();
  await expect(page.getByTestId('queue-count')).toHaveText('1 waiting to send');
  await sButtons.getByRole('button', { name: 'S4', exact: true }).click();
  await expect(page.getByTestId('queue-count')).toHaveText('2 waiting to send');
  const now = (await api(`/api/cases/${caseId}`, { session: coordinator })).json;
  const closed = await api(`/api/cases/${caseId}/transitions`, { session: coordinator, body: { to: 'resolved', version: now.version, outcome: 'not-found', note: 'Test: closed while the hunter is offline.' } });
  expect(closed.status, closed.text).toBe(200);
  await context.setOffline(false);
  await expect(page.getByTestId('queue-refused')).toHaveCount(2, { timeout: 15_000 });
  await expect(page.getByTestId('refusal-reason').first()).toContainText('while it is being hunted');
  await page.getByTestId('queue-refused').first().scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${SHOTS}/queue-refused-360.png` });
  expect((await serverCounts(hunterApi, caseId)).readings).toBe(2);
  // Kept across a reload with the reason.
  await page.reload();
  await expect(page.getByTestId('queue-refused')).toHaveCount(2);
  await expect(page.getByTestId('refusal-reason').first()).toContainText('while it is being hunted');
  // Back to open: the S5 is corrected to S6 on screen and sent again; the S4 is discarded.
  const resolved = (await api(`/api/cases/${caseId}`, { session: coordinator })).json;
  const reopened = await api(`/api/cases/${caseId}/transitions`, { session: coordinator, body: { to: 'open', version: resolved.version, reason: 'Test: the hunt goes on.' } });
  expect(reopened.status, reopened.text).toBe(200);
  const s5 = page.getByTestId('queue-refused').filter({ hasText: 'S5' });
  await s5.getByRole('button', { name: 'Edit' }).click();
  await s5.getByLabel('Level (as read)').fill('6');
  await s5.getByRole('button', { name: 'Send again' }).click();
  await expect.poll(async () => (await serverCounts(hunterApi, caseId)).readings, { timeout: 15_000 }).toBe(3);
  const values = (await api(`/api/cases/${caseId}/readings`, { session: hunterApi })).json.items.map((r: { level: { value: number } }) => r.level.value);
  expect(values).toEqual([7, 9, 6]);
  await expect(page.getByTestId('queue-refused')).toHaveCount(1);
  await page.getByTestId('queue-refused').getByRole('button', { name: 'Discard' }).click();
  await expect(page.getByTestId('queue-refused')).toHaveCount(0);
  expect((await queuedInBrowser(page)).length).toBe(0);
  expect((await serverCounts(hunterApi, caseId)).readings).toBe(3);
  await context.close();
});

/** WCAG 2.2 contrast ratio (its definitions of relative luminance and contrast ratio) of an element's text against what is behind it. */
const textContrast = (page: Page, testId: string) =>
  page.getByTestId(testId).first().evaluate((el) => {
    // Any CSS colour (Tailwind 4 computes oklab/oklch and color-mix) as sRGB bytes and alpha 0-1: painted on a 1-px canvas.
    const ctx = document.createElement('canvas').getContext('2d', { willReadFrequently: true })!;
    const rgba = (c: string): [number, number, number, number] => {
      ctx.clearRect(0, 0, 1, 1);
      ctx.fillStyle = c;
      ctx.fillRect(0, 0, 1, 1);
      const [r, g, b, a] = ctx.getImageData(0, 0, 1, 1).data;
      return a === 0 ? [0, 0, 0, 0] : [r, g, b, a / 255];
    };
    const over = (top: number[], under: number[]) => top.slice(0, 3).map((v, i) => v * top[3] + under[i] * (1 - top[3]));
    // the backgrounds from the element outwards, laid over each other (white behind everything)
    const layers: [number, number, number, number][] = [];
    for (let n: Element | null = el; n; n = n.parentElement) layers.push(rgba(getComputedStyle(n).backgroundColor));
    let bg = [255, 255, 255];
    for (const l of layers.reverse()) bg = over(l, bg);
    const fg = over(rgba(getComputedStyle(el).color), bg);
    const lum = (c: number[]) => {
      const [r, g, b] = c.map((v) => v / 255).map((v) => (v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
      return 0.2126 * r + 0.7152 * g + 0.0722 * b;
    };
    const [a, b] = [lum(fg), lum(bg)].sort((x, y) => y - x);
    return (a + 0.05) / (b + 0.05);
  });

test('prepare for the field: the area is kept, places come back offline for a view never shown, key figures readable', async ({ browser }, info) => {
  test.skip(info.project.name !== 'phone-360', 'one run, at phone width');
  test.setTimeout(120_000);
  const hunterApi = await signIn('hunter@example.test');
  // The demo's open case, whose fix lies among the demo town's houses (db/seeds/demo.ts, demo-town.ts).
  const caseId: string = ((await api('/api/cases?q=Rasping', { session: hunterApi })).json.items as { id: string; title: string }[]).find((c) => c.title === 'Rasping hash on 80 m and 40 m in the evenings')!.id;
  const fix = (await api(`/api/cases/${caseId}/fix`, { session: hunterApi })).json.current.fix;
  expect(fix.ok).toBe(true);

  const context = await browser.newContext({ viewport: { width: 360, height: 640 }, isMobile: true, hasTouch: true });
  const page = await context.newPage();
  await signInPage(page, 'hunter@example.test');
  await page.goto(`/cases/${caseId}/field`);
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.reload();
  await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller)).toBe(true);
  await expect(page.getByTestId('fix-summary')).toContainText('±');
  await expect(page.getByTestId('case-map').locator('.qf-building').first()).toBeAttached({ timeout: 20_000 });

  // Sunlight: the key figures (the fix in the bar and in the summary) at 7:1 or better (WCAG 2.2 level AAA, 1.4.6).
  for (const id of ['bar-fix', 'fix-summary']) {
    const ratio = await textContrast(page, id);
    console.log(`[field] contrast of ${id}: ${ratio.toFixed(1)}:1`);
    expect(ratio, id).toBeGreaterThanOrEqual(7);
  }

  // The issue's own example: "±151 m" in the bar beside the actions, nothing overlapping, each label on one line.
  const barFix = (await page.getByTestId('bar-fix').boundingBox())!;
  const actions = [page.getByRole('button', { name: 'Add bearing', exact: true }), page.getByRole('button', { name: 'Sweep', exact: true })];
  const boxes = [barFix];
  for (const b of actions) {
    const box = (await b.boundingBox())!;
    const lineHeight = await b.evaluate((el) => parseFloat(getComputedStyle(el).lineHeight));
    const textHeight = await b.evaluate((el) => {
      const r = document.createRange();
      r.selectNodeContents(el);
      return r.getBoundingClientRect().height;
    });
    expect(textHeight, `${await b.textContent()} on one line`).toBeLessThan(lineHeight * 1.5);
    expect(box.x + box.width).toBeLessThanOrEqual(360);
    boxes.push(box);
  }
  for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) expect(overlaps(boxes[i], boxes[j]), `bar items ${i} and ${j}`).toBe(false);
  console.log(`[field] bar at 360 px: fix figure "${(await page.getByTestId('bar-fix').locator('span').first().textContent())}"`);

  await page.getByTestId('prepare-area').click();
  await expect(page.getByTestId('prepare-result')).toContainText('Case, lines, walk and places kept on this phone.', { timeout: 30_000 });
  await expect(page.getByTestId('prepare-result')).toContainText('Storage used by Quietfix on this phone:');
  await page.getByTestId('prepare-result').scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${SHOTS}/prepare-360.png` });

  // Offline: a places box inside the kept area that no screen asked for (200 m east of the fix, 300 m a side).
  await context.setOffline(true);
  const dLat = 150 / 111_320;
  const dLon = 150 / (111_320 * Math.cos((fix.lat * Math.PI) / 180));
  const east = 200 / (111_320 * Math.cos((fix.lat * Math.PI) / 180));
  const bbox = [fix.lon + east - dLon, fix.lat - dLat, fix.lon + east + dLon, fix.lat + dLat].map((v: number) => v.toFixed(6)).join(',');
  const offline = await page.evaluate(async (b) => {
    const res = await fetch(`/api/places?bbox=${b}`);
    const body = await res.json();
    return { status: res.status, storedAt: res.headers.get('x-quietfix-stored-at'), features: body.features.length as number };
  }, bbox);
  expect(offline.status).toBe(200);
  expect(offline.storedAt).toBeTruthy();
  expect(offline.features).toBeGreaterThan(0);

  // And the screen itself, reloaded offline: lines, fix and the places layer, saying what it shows.
  await page.reload();
  await expect(page.getByTestId('fix-summary')).toContainText('±');
  await expect(page.getByTestId('offline-copy')).toContainText('Showing what was last loaded at');
  await expect(page.getByTestId('case-map').locator('.qf-bearing').first()).toBeAttached();
  await expect(page.getByTestId('case-map').locator('.qf-building').first()).toBeAttached({ timeout: 20_000 });
  await context.close();
});
