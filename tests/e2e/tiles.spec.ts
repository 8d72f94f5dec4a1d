import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { mkdtemp, writeFile } from 'node:fs/promises';
import { createServer, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { expect, test } from '@playwright/test';
import { closedPort } from '../support/net';
import { signInPage } from '../support/sign-in-page';
import { OSM_PLACES_ATTRIBUTION } from '../../lib/places/attribution';

/**
 * The map's base layer is chosen at run time: the same build, started once more with TILE_URL and
 * TILE_ATTRIBUTION pointing at a tile server on this machine (our own, serving one blank PNG),
 * draws that server's tiles with that attribution, and its Content-Security-Policy lets them in.
 * The instance scripts/test.sh started (no TILE_URL) draws the places layer alone, and credits
 * OpenStreetMap where it draws imported OSM data. No traffic leaves 127.0.0.1.
 */
const DEMO_OPEN_TITLE = 'Rasping hash on 80 m and 40 m in the evenings'; // db/seeds/demo.ts
const ATTRIBUTION = 'Tiles: Quillon Heath test tiles';
// A 1x1 transparent PNG (PNG signature, IHDR, IDAT, IEND; value recalled from memory, checked by the browser decoding it).
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAQAAAC1HAwCAAAAC0lEQVR42mNkYAAAAAYAAjCB0C8AAAAASUVORK5CYII=', 'base64');

let tiles: Server;
let tileOrigin: string;
const tileRequests: string[] = [];
let app: ChildProcess | undefined;
let appOrigin: string;
let appLog = '';

test.beforeAll(async ({}, info) => {
  if (info.project.name !== 'desktop') return;
  tiles = createServer((req, res) => {
    tileRequests.push(req.url ?? '');
    if (!/^\/tiles\/\d+\/\d+\/\d+\.png$/.test(req.url ?? '')) return void res.writeHead(404).end();
    res.writeHead(200, { 'content-type': 'image/png', 'cache-control': 'no-store' }).end(PNG);
  });
  await new Promise<void>((r) => tiles.listen(0, '127.0.0.1', () => r()));
  tileOrigin = `http://127.0.0.1:${(tiles.address() as { port: number }).port}`;

  // The built app once more, with the tile settings in its environment only (no rebuild).
  const port = await closedPort();
  appOrigin = `http://127.0.0.1:${port}`;
  app = spawn(process.execPath, ['--import', 'tsx', 'scripts/serve.ts', '-p', String(port), '-H', '127.0.0.1'], {
    env: { ...process.env, NODE_ENV: 'production', PORT: String(port), TILE_URL: `${tileOrigin}/tiles/{z}/{x}/{y}.png`, TILE_ATTRIBUTION: ATTRIBUTION },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  app.stdout?.on('data', (d) => (appLog += d));
  app.stderr?.on('data', (d) => (appLog += d));
  const end = Date.now() + 60_000;
  for (;;) {
    const ok = await fetch(`${appOrigin}/api/health`).then((r) => r.ok, () => false);
    if (ok) break;
    if (Date.now() > end || app.exitCode !== null) throw new Error(`the app with TILE_URL did not start:\n${appLog}`);
    await new Promise((r) => setTimeout(r, 250));
  }
});

test.afterAll(async () => {
  if (app && app.exitCode === null) {
    const gone = new Promise((r) => app!.once('exit', r));
    app.kill('SIGTERM');
    await gone;
  }
  if (tiles) await new Promise((r) => tiles.close(r));
});

test('TILE_URL and TILE_ATTRIBUTION are read when the server starts: the same build draws tiles from the configured server', async ({ page }, info) => {
  test.skip(info.project.name !== 'desktop', 'one run is enough: the setting is the server’s, not the screen’s');
  await signInPage(page, 'hunter@example.test'); // on the instance without tiles; the session cookie is good on both
  const caseId = ((await (await page.request.get('/api/cases?q=Rasping')).json()).items as { id: string; title: string }[]).find((c) => c.title === DEMO_OPEN_TITLE)!.id;

  // Without TILE_URL: no tiles requested, the places layer is the map (the demo town's streets and houses).
  await page.goto(`/cases/${caseId}`);
  const plain = page.getByTestId('case-map');
  await expect(plain.getByTestId('tiles-off')).toHaveText('No map tiles — streets and houses from the club’s places');
  // (a building: a north-south street's path has a zero-width box, which Playwright calls hidden)
  await expect(plain.locator('path.qf-building').first()).toBeVisible({ timeout: 20_000 });
  expect(await plain.locator('path.qf-street').count()).toBeGreaterThanOrEqual(3); // Quill Row, Hushbeck Lane, Ostmere Way around the open case
  await expect(plain.locator('img.leaflet-tile')).toHaveCount(0);
  expect(tileRequests).toHaveLength(0);

  // With TILE_URL: the page's CSP admits the tile server, tiles load from it, the attribution shows.
  const res = await page.goto(`${appOrigin}/cases/${caseId}`);
  const csp = res!.headers()['content-security-policy'] ?? '';
  expect(csp).toMatch(new RegExp(`img-src [^;]*${tileOrigin.replace(/[.:/]/g, '\\$&')}`));
  const map = page.getByTestId('case-map');
  await expect(map.locator('img.leaflet-tile-loaded').first()).toBeVisible({ timeout: 20_000 });
  const src = await map.locator('img.leaflet-tile-loaded').first().getAttribute('src');
  expect(src).toMatch(new RegExp(`^${tileOrigin}/tiles/\\d+/\\d+/\\d+\\.png$`));
  expect(tileRequests.length).toBeGreaterThan(0);
  await expect(map.locator('.leaflet-control-attribution')).toContainText(ATTRIBUTION);
  await expect(map.getByTestId('tiles-off')).toHaveCount(0);

  // At street zoom the places layer goes on top of the tiles: house numbers over the tile pane.
  await page.getByTestId('doors').getByTestId('candidate').first().getByRole('button', { name: 'Show on map' }).click();
  await expect(map.locator('.qf-house-number').first()).toBeVisible({ timeout: 20_000 });
  await expect(map.locator('img.leaflet-tile-loaded').first()).toBeVisible();
});

test('places imported from OpenStreetMap are credited on the map (ODbL), the demo town alone is not', async ({ page }, info) => {
  test.skip(info.project.name !== 'desktop', 'one run is enough');
  await signInPage(page, 'hunter@example.test');
  const caseId = ((await (await page.request.get('/api/cases?q=Rasping')).json()).items as { id: string; title: string }[]).find((c) => c.title === DEMO_OPEN_TITLE)!.id;
  const credit = page.getByTestId('case-map').locator('.leaflet-control-attribution');
  await page.goto(`/cases/${caseId}`);
  await expect(page.getByTestId('case-map').locator('path.qf-building').first()).toBeVisible({ timeout: 20_000 });
  await expect(credit).toBeVisible();
  await expect(credit).not.toContainText('OpenStreetMap');

  // Our own OSM XML: one footpath (no building, so the candidate houses stay the demo town's), 60 m
  // north of Quill Row, imported with the command a club uses. It stays in the (fresh per run) test database.
  const [lat, w, e] = [-31.05026, 129.74853, 129.75167];
  const osm = `<?xml version="1.0" encoding="UTF-8"?>
<osm version="0.6" generator="quietfix-test">
  <node id="7101" lat="${lat}" lon="${w}"/>
  <node id="7102" lat="${lat}" lon="${e}"/>
  <way id="7103"><nd ref="7101"/><nd ref="7102"/><tag k="highway" v="footway"/><tag k="name" v="Test Quire Path"/></way>
</osm>
`;
  const file = join(await mkdtemp(join(tmpdir(), 'quietfix-tiles-')), 'path.osm');
  await writeFile(file, osm);
  const out = await promisify(execFile)(process.execPath, ['--import', 'tsx', 'scripts/places-import.ts', file], { env: process.env });
  expect(out.stdout).toMatch(/path\.osm: [01] new/);

  await page.reload();
  await expect(credit).toContainText('Streets and houses © OpenStreetMap contributors (ODbL)', { timeout: 20_000 });
  // The link is the one the licence notice names (lib/places/attribution.ts); it is never followed.
  const licenceLink = OSM_PLACES_ATTRIBUTION.match(/href="([^"]+)"/)![1];
  await expect(credit.getByRole('link', { name: 'OpenStreetMap' })).toHaveAttribute('href', licenceLink);
});
