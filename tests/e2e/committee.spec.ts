import { expect, test, type Page } from '@playwright/test';
import { booleanPointInPolygon, point, polygon } from '@turf/turf';
import { signInPage } from '../support/sign-in-page';

/**
 * The map of all cases opens on the most recently active case. Other suites file cases of their
 * own elsewhere, so a comment on the demo's resolved case first brings the map to the demo town,
 * where these tests tap and count.
 */
async function openOnTheDemoTown(page: Page) {
  const found = await (await page.request.get('/api/cases?q=Wideband%20hiss%20on%20160')).json();
  const id = found.items[0].id as string;
  const r = await page.request.post(`/api/cases/${id}/comments`, { headers: { origin: new URL(page.url()).origin }, data: { text: 'Committee review of the queue.' } });
  expect(r.status()).toBe(201);
}

/**
 * The committee's queue in a real browser: filtering the table moves the URL, and the map of all
 * cases follows the same filter (only the chosen status's symbols remain); a click on a symbol
 * opens the case.
 */
test('a coordinator filters the queue and the map follows', async ({ page }, info) => {
  test.skip(info.project.name !== 'desktop', 'one desktop run covers the queue and its map');
  await signInPage(page, 'coordinator@example.test');
  await openOnTheDemoTown(page);
  await page.goto('/cases');
  const map = page.getByRole('region', { name: 'Map of cases' });
  const mapCount = page.getByTestId('map-count');
  await expect(mapCount).toBeVisible();
  const countOf = async () => Number((await mapCount.textContent())!.replace(/[^\d]/g, ''));
  const allOnMap = await countOf();
  expect(allOnMap).toBeGreaterThan(0);

  await page.getByLabel('Status').selectOption('resolved');
  await expect(page).toHaveURL(/status=resolved/);
  const rows = page.getByTestId('queue-row');
  await expect(rows.first()).toBeVisible();
  // The table keeps the old rows on screen until the new answer is in: wait for it.
  await expect.poll(async () => (await rows.allTextContents()).every((t) => t.includes('resolved'))).toBe(true);
  // The map asked again with the same filter: no open symbol is left, a resolved one is there.
  await expect(map.locator('.qf-case-open')).toHaveCount(0);
  await expect(map.locator('.qf-case-resolved').first()).toBeVisible();
  await expect.poll(countOf).toBeLessThan(allOnMap);
  const total = Number((await page.getByTestId('queue-total').textContent())!.replace(/\D/g, ''));
  expect(total).toBeGreaterThan(0);

  // The view is in the address: a reload shows the same filter.
  await page.reload();
  await expect(page.getByLabel('Status')).toHaveValue('resolved');

  await map.locator('.qf-case-resolved').first().click();
  await expect(page).toHaveURL(/\/cases\/[0-9a-f-]{36}$/);
});

/**
 * An area drawn on the map: corners tapped on the map (one taken back with "Undo last corner"),
 * closed into a polygon that the URL keeps; the table and the map count only the cases inside.
 * What is inside is decided here by Turf's booleanPointInPolygon on the cases' exported GeoJSON
 * points, apart from the server's PostGIS filter.
 */
test('a coordinator draws an area and the queue and map follow it', async ({ page }, info) => {
  test.skip(info.project.name !== 'desktop', 'one desktop run covers drawing on the map');
  await signInPage(page, 'coordinator@example.test');
  await openOnTheDemoTown(page);
  const mapAsks: string[] = [];
  page.on('request', (r) => {
    if (r.url().includes('/api/cases/map?')) mapAsks.push(r.url());
  });
  await page.goto('/cases');
  const map = page.getByRole('region', { name: 'Map of cases' });
  const mapCount = page.getByTestId('map-count');
  await expect(mapCount).toBeVisible();
  const countOf = async (el: typeof mapCount) => Number((await el.textContent())!.replace(/\(.*\)/, '').replace(/[^\d]/g, ''));

  // Where the demo's located case is on screen: the map's own box (what it asked the server for)
  // and Web Mercator (EPSG:3857: x linear in longitude, y in ln tan(π/4 + φ/2)).
  const gj = await (await page.request.get('/api/cases/export?format=geojson')).json();
  const target = gj.features.find((f: { properties: { title: string } }) => f.properties.title.startsWith('Warbling carriers'));
  const [w, s, e, n] = new URL(mapAsks.at(-1)!).searchParams.get('bbox')!.split(',').map(Number);
  const frame = (await map.locator('.leaflet-container').boundingBox())!;
  const merc = (lat: number) => Math.log(Math.tan(Math.PI / 4 + (lat * Math.PI) / 360));
  const [lon, lat] = target.geometry.coordinates as [number, number];
  const cx = frame.x + ((lon - w) / (e - w)) * frame.width;
  const cy = frame.y + ((merc(n) - merc(lat)) / (merc(n) - merc(s))) * frame.height;

  await map.getByRole('button', { name: 'Draw an area' }).click();
  const status = page.getByTestId('draw-status');
  await expect(status).toContainText('0 of at least 3');
  for (const [dx, dy] of [[-45, -35], [50, -40], [20, 60], [-120, 90]]) await page.mouse.click(cx + dx, cy + dy);
  await expect(status).toContainText('4 corners');
  await expect(map.locator('path.qf-area-vertex')).toHaveCount(4);
  await map.getByRole('button', { name: 'Undo last corner' }).click();
  await expect(status).toContainText('3 corners');
  await map.getByRole('button', { name: 'Close the area' }).click();

  await expect(page).toHaveURL(/area=/);
  const vertices = new URL(page.url()).searchParams.get('area')!.split(';').map((p) => p.split(',').map(Number) as [number, number]);
  expect(vertices).toHaveLength(3);
  await expect(map.locator('path.qf-area')).toHaveCount(1);

  const ring = polygon([[...vertices, vertices[0]]]);
  const inside = gj.features.filter((f: { geometry: { coordinates: [number, number] } }) => booleanPointInPolygon(point(f.geometry.coordinates), ring));
  expect(inside.map((f: { properties: { title: string } }) => f.properties.title)).toContain(target.properties.title);
  expect(inside.length).toBeLessThan(gj.features.length);

  const total = page.getByTestId('queue-total');
  await expect.poll(async () => countOf(total)).toBe(inside.length);
  await expect.poll(async () => countOf(mapCount)).toBe(inside.length);
  await expect(page.getByTestId('queue-row').filter({ hasText: 'Warbling carriers' })).toBeVisible();

  // The view is in the address: a reload shows the same area and the same count.
  await page.reload();
  await expect(map.locator('path.qf-area')).toHaveCount(1);
  await expect.poll(async () => countOf(total)).toBe(inside.length);

  await page.getByRole('button', { name: 'Clear the drawn area' }).click();
  await expect(page).not.toHaveURL(/area=/);
  await expect(map.locator('path.qf-area')).toHaveCount(0);
  const all = (await (await page.request.get('/api/cases?pageSize=1')).json()).total as number;
  await expect.poll(async () => countOf(total)).toBe(all);
});

/**
 * Saving a queue view goes through the one form hook: the schema's limit on the name shows under
 * the field and nothing is saved; a good name saves the filter the queue shows, which opens again
 * from its link and can be removed.
 */
test('a coordinator saves the current queue view under a name, then removes it', async ({ page }, info) => {
  test.skip(info.project.name !== 'desktop', 'the saved views do not depend on the screen');
  await signInPage(page, 'coordinator@example.test');
  await page.goto('/cases?status=located');
  const views = page.getByLabel('Saved views');
  const nameBox = page.getByLabel('Name for this view');
  const saves: string[] = [];
  page.on('request', (r) => {
    if (r.url().endsWith('/api/saved-filters') && r.method() === 'POST') saves.push(r.url());
  });

  await nameBox.fill('q'.repeat(61));
  await page.getByRole('button', { name: 'Save view' }).click();
  await expect(nameBox).toHaveAttribute('aria-invalid', 'true');
  await expect(page.locator('#view-name-error')).toContainText('60');
  expect(saves).toEqual([]);

  const name = `Located ${Date.now() % 100000}`;
  await nameBox.fill(name);
  await page.getByRole('button', { name: 'Save view' }).click();
  const link = views.getByRole('link', { name });
  await expect(link).toBeVisible();
  await expect(link).toHaveAttribute('href', /status=located/);
  await expect(nameBox).toHaveValue('');
  await expect(nameBox).not.toHaveAttribute('aria-invalid', 'true');

  await page.goto('/cases');
  await views.getByRole('link', { name }).click();
  await expect(page).toHaveURL(/status=located/);
  await views.getByRole('button', { name: `Remove the view ${name}` }).click();
  await expect(views.getByRole('link', { name })).toHaveCount(0);
});
