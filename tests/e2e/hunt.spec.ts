/**
 * The hunt in a real browser at 360 px: a member files a report, a coordinator assigns it, the
 * hunter adds three bearings from the field screen and sees the fix and its ellipse drawn, the case
 * moves to located, and the timeline shows each step. Bearings come from GeographicLib geometry
 * (Karney 2013) toward an invented source on open land.
 */
import { expect, test, type Browser, type Page } from '@playwright/test';
import { signInPage } from '../support/sign-in-page';
// GeographicLib's Direct/Inverse (the reference library itself, not lib/df's internals).
import { geodesicDirect, geodesicInverse } from '../support/geodesic';

const SOURCE = { lat: -31.62, lon: 129.12 };
const SPOTS = [10, 130, 250].map((fromSource, i) => {
  const o = geodesicDirect(SOURCE.lat, SOURCE.lon, fromSource, 350 + 50 * i);
  const az = geodesicInverse(o.lat, o.lon, SOURCE.lat, SOURCE.lon).azi1;
  return { lat: o.lat, lon: o.lon, azimuthDeg: ((az % 360) + 360) % 360 };
});

async function signedIn(browser: Browser, who: string, geo?: { latitude: number; longitude: number }): Promise<Page> {
  const context = await browser.newContext({
    viewport: { width: 360, height: 740 },
    isMobile: true,
    hasTouch: true,
    geolocation: geo ?? { latitude: SOURCE.lat + 0.002, longitude: SOURCE.lon - 0.003 },
    permissions: ['geolocation'],
  });
  const page = await context.newPage();
  await signInPage(page, `${who}@example.test`);
  return page;
}

test('report -> assign -> three bearings -> fix and ellipse on the map -> located, with the timeline', async ({ browser }, info) => {
  test.skip(info.project.name !== 'phone-360', 'one run, at phone width');
  test.setTimeout(180_000);

  // 1. The member files a report from the phone.
  const member = await signedIn(browser, 'member');
  await member.goto('/reports/new');
  await member.getByLabel('Short title').fill('Crackle on 40 m near the old quarry');
  await member.getByText('Clicks, ticks or crackles').click();
  await member.getByLabel('Frequency 1', { exact: true }).fill('7.05');
  await member.getByLabel('Unit of frequency 1', { exact: true }).selectOption('MHz');
  await expect(member.getByTestId('frequency-band').first()).toContainText('40m');
  await member.getByText('All the time').click();
  await member.getByRole('button', { name: 'Use my location' }).click();
  await expect(member.getByTestId('position-status')).toContainText(/±|m/);
  await member.screenshot({ path: info.outputPath('report-form.png'), fullPage: true });
  await member.getByRole('button', { name: 'File the report' }).click();
  await expect(member).toHaveURL(/\/cases\/[0-9a-f-]{36}/);
  const caseUrl = new URL(member.url()).pathname;
  const caseId = caseUrl.split('/')[2];
  await expect(member.getByTestId('case-status')).toContainText('open');

  // 2. The coordinator assigns it to the demo hunter.
  const coordinator = await signedIn(browser, 'coordinator');
  await coordinator.goto(`/cases/${caseId}`);
  const cleo = coordinator.getByLabel('Assign to').locator('option', { hasText: 'Cleo Marchetti' });
  await expect(cleo).toHaveCount(1);
  await coordinator.getByLabel('Assign to').selectOption((await cleo.getAttribute('value'))!);
  await coordinator.getByTestId('assignment').getByRole('button', { name: 'Save' }).click();
  await expect(coordinator.getByTestId('assignee')).toContainText('Cleo Marchetti');

  // 3. The hunter adds three bearings on the field screen, each from where they stand.
  const hunter = await signedIn(browser, 'hunter', { latitude: SPOTS[0].lat, longitude: SPOTS[0].lon });
  await hunter.goto(`/cases/${caseId}/field`);
  for (const spot of SPOTS) {
    await hunter.context().setGeolocation({ latitude: spot.lat, longitude: spot.lon, accuracy: 5 });
    await hunter.getByRole('button', { name: 'Add bearing' }).click();
    const form = hunter.getByRole('form', { name: 'Add a bearing' });
    await form.getByRole('button', { name: 'Use my location' }).click();
    await expect(form.getByTestId('position-summary')).toContainText('device');
    await form.getByLabel('Azimuth of the null (degrees)').fill(spot.azimuthDeg.toFixed(1));
    await form.getByText('True', { exact: true }).click();
    await form.getByText('Sharp', { exact: true }).click();
    await form.getByRole('button', { name: 'Save bearing' }).click();
    await expect(hunter.getByText('Bearing saved; the fix is updated.')).toBeVisible();
  }
  const map = hunter.getByTestId('case-map');
  await expect(map.locator('.qf-bearing')).toHaveCount(3);
  await expect(map.locator('.qf-ellipse')).toHaveCount(1);
  await expect(map.locator('.qf-fix')).toHaveCount(1);
  await expect(hunter.getByTestId('tiles-off')).toBeVisible();
  await expect(hunter.getByTestId('fix-summary')).toBeVisible();
  await hunter.screenshot({ path: info.outputPath('field-screen.png'), fullPage: true });
  await map.screenshot({ path: info.outputPath('map.png') });

  // The numbers on screen are lib/df's: the API's fix is within a metre of the true source.
  const fix = await (await hunter.request.get(`/api/cases/${caseId}/fix`)).json();
  expect(fix.current.fix.ok).toBe(true);
  const miss = geodesicInverse(fix.current.fix.lat, fix.current.fix.lon, SOURCE.lat, SOURCE.lon).s12;
  expect(miss).toBeLessThan(1);
  expect(fix.locatable).toBe(true);

  // 4. The case moves to located on the case page.
  await hunter.goto(`/cases/${caseId}`);
  await hunter.getByRole('button', { name: 'Mark as located' }).click();
  await hunter.getByText('The current fix', { exact: true }).click();
  await hunter.getByRole('form', { name: 'Mark as located' }).getByRole('button', { name: 'Mark as located' }).click();
  await expect(hunter.getByTestId('case-status')).toContainText('located');

  // 5. The timeline shows each step, in order.
  const kinds = await hunter.getByTestId('timeline-event').evaluateAll((els) => els.map((e) => e.getAttribute('data-kind')));
  expect(kinds).toEqual(['reported', 'assigned', 'bearing-added', 'bearing-added', 'bearing-added', 'status-changed']);
  await hunter.screenshot({ path: info.outputPath('case-page.png'), fullPage: true });
  const overflow = await hunter.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);
});
