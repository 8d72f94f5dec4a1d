import { expect, test, type Browser, type Page } from '@playwright/test';
import { signInPage } from '../support/sign-in-page';

const DEMO_OPEN_TITLE = 'Rasping hash on 80 m and 40 m in the evenings'; // db/seeds/demo.ts

/**
 * From a fix to a door, on a 360-px phone: the demo's open case lists the houses of the demo town
 * inside its 95 % region, the map shows their numbers at street zoom, the hunter confirms one as
 * the premises, and the coordinator's notice form is pre-filled with that address.
 */
async function signedIn(browser: Browser, email: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });
  const page = await context.newPage();
  await signInPage(page, email);
  return page;
}

test('a hunter sees house numbers inside the region, confirms the premises, and the notice form shows that address', async ({ browser }, info) => {
  test.skip(info.project.name !== 'phone-360', 'a phone-sized check; the desktop run covers the rest of the case page');
  const hunter = await signedIn(browser, 'hunter@example.test');
  // The demo's open case by its own title (a text search can also match cases other tests filed).
  const caseId = ((await (await hunter.request.get('/api/cases?q=Rasping')).json()).items as { id: string; title: string }[]).find(
    (c) => c.title === DEMO_OPEN_TITLE,
  )!.id;
  // The field screen lists the same houses, with the cautions beside them.
  await hunter.goto(`/cases/${caseId}/field`);
  const fieldDoors = hunter.getByTestId('doors');
  await expect(fieldDoors.getByRole('heading', { name: /\d+ houses? inside the region/ })).toBeVisible({ timeout: 20_000 });
  await expect(hunter.getByTestId('doors-caution')).toContainText('not an accusation');
  await expect(fieldDoors.getByTestId('candidate').first()).toContainText(/, QH7 0DM Quillon/);

  await hunter.goto(`/cases/${caseId}`);

  const doors = hunter.getByTestId('doors');
  await expect(doors.getByRole('heading', { name: /\d+ houses? inside the region/ })).toBeVisible();
  await expect(hunter.getByTestId('doors-caution')).toContainText('not an accusation');
  const first = doors.getByTestId('candidate').first();
  await expect(first).toContainText('inside the region');
  const address = (await first.locator('p').first().textContent())!.trim();
  expect(address).toMatch(/^\d+ [A-Z][a-z]+ [A-Z][a-z]+, QH7 0DM Quillon$/); // the demo town's own streets
  const houseNumber = address.split(' ')[0];

  // The hunt has loaded (lines and the fix's ellipse drawn) before the hunter asks for a house, as on a phone in the field.
  const map = hunter.getByTestId('case-map');
  await expect(map.locator('.qf-ellipse')).toHaveCount(1, { timeout: 20_000 });
  // Street zoom on the first candidate: its number and its neighbours' are drawn, candidates highlighted.
  await first.getByRole('button', { name: 'Show on map' }).click();
  const label = map.locator('.qf-house-number').filter({ hasText: new RegExp(`^${houseNumber}$`) });
  // The map flies to street zoom, then fetches the places of the new view and draws their numbers.
  await expect(label.first()).toBeVisible({ timeout: 20_000 });
  expect(await map.locator('.qf-house-number').count()).toBeGreaterThan(3);
  await expect(map.locator('path.qf-candidate').first()).toBeVisible();
  await expect(map.locator('.qf-ellipse')).toHaveCount(1);
  const [box, mapBox] = [await label.first().boundingBox(), await map.boundingBox()];
  expect(box!.x).toBeGreaterThanOrEqual(mapBox!.x);
  expect(box!.x + box!.width).toBeLessThanOrEqual(mapBox!.x + mapBox!.width);
  await map.screenshot({ path: info.outputPath('house-numbers.png') });

  // The hunter confirms it as the premises.
  await first.getByRole('button', { name: 'Confirmed here…' }).click();
  const form = hunter.getByRole('form', { name: 'Confirm the premises' });
  await expect(form.getByLabel('Address')).toHaveValue(address);
  // The form checks with the handler's schema first: without the "how", nothing is sent and the choice says why.
  await form.getByRole('button', { name: 'Save the premises' }).click();
  await expect(form.locator('#premises-how-error')).toHaveText('Say how the premises were confirmed.');
  await form.getByText('Level peaked').click();
  await expect(form.locator('#premises-how-error')).toHaveCount(0);
  await form.getByLabel('Note (optional)').fill('Loudest at the front fence, from the pavement.');
  await form.getByRole('button', { name: 'Save the premises' }).click();
  await expect(hunter.getByTestId('premises')).toContainText(address);
  await expect(hunter.getByTestId('premises')).toContainText('the level peaked there');
  await hunter.screenshot({ path: info.outputPath('premises.png'), fullPage: true });

  // The coordinator sees it, locates the case by the confirmed premises and starts a notice.
  const coordinator = await signedIn(browser, 'coordinator@example.test');
  await coordinator.goto(`/cases/${caseId}`);
  await expect(coordinator.getByTestId('premises')).toContainText(address);
  const c = await (await coordinator.request.get(`/api/cases/${caseId}`)).json();
  const headers = { origin: new URL(coordinator.url()).origin };
  const located = await coordinator.request.post(`/api/cases/${caseId}/transitions`, { headers, data: { to: 'located', version: c.version, evidence: 'premises', note: '' } });
  expect(located.status(), await located.text()).toBe(200);
  try {
    await coordinator.goto(`/cases/${caseId}/notices`);
    await expect(coordinator.getByLabel('Postal address')).toHaveValue(address.split(', ').join('\n'));
    await coordinator.screenshot({ path: info.outputPath('notice-form.png'), fullPage: true });
  } finally {
    // Leave the demo case as the other tests expect it: open.
    const now = await (await coordinator.request.get(`/api/cases/${caseId}`)).json();
    await coordinator.request.post(`/api/cases/${caseId}/transitions`, { headers, data: { to: 'open', version: now.version, reason: 'Browser test done: back to open.' } });
  }
});
