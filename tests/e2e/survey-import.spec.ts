/**
 * A walked survey imported from files on a 360-px phone: the assigned hunter chooses a GPX that
 * is not XML and sees the parser's plain message (nothing stored), then a GPX track with a CSV of
 * timed levels (tests/fixtures/survey, fiction on open land), sees the server's dry run (points,
 * the row left out, the strongest reading), imports, and finds the strongest reading's own
 * marker on the case map with its level, time and position; with a walked reading beside it, the
 * two trails are told apart and shown one at a time. The case is filed here, so the
 * demo's open case, which other browser tests read, keeps no readings of ours.
 */
import path from 'node:path';
import { expect, test } from '@playwright/test';
import { signInPage } from '../support/sign-in-page';
import { api, signIn, type Session } from '../support/http';
import { noiseReport } from '../support/fixtures';

const FIXTURES = path.resolve('tests/fixtures/survey');
const readingsOn = async (s: Session, caseId: string): Promise<number> => (await api(`/api/cases/${caseId}/readings`, { session: s })).json.total;

test('a hunter checks and imports a GPX + CSV survey and sees its strongest reading on the case map', async ({ browser }, info) => {
  test.skip(info.project.name !== 'phone-360', 'a phone-sized check');
  // A case of our own near the walk, assigned to the demo hunter.
  const [member, coordinator, hunterApi] = await Promise.all(['member', 'coordinator', 'hunter'].map((w) => signIn(`${w}@example.test`)));
  const filed = await api('/api/cases', { session: member, body: noiseReport({ title: 'Survey import browser test', position: { lat: -31.0592, lon: 129.7607, source: 'map' } }) });
  expect(filed.status, filed.text).toBe(201);
  const caseId: string = filed.json.case.id;
  const hunterId: string = (await api('/api/auth/session', { session: hunterApi })).json.user.id;
  const c = (await api(`/api/cases/${caseId}`, { session: coordinator })).json;
  expect((await api(`/api/cases/${caseId}`, { method: 'PATCH', session: coordinator, body: { version: c.version, assigneeId: hunterId } })).status).toBe(200);

  const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2, locale: 'en-GB', timezoneId: 'UTC' });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  await signInPage(page, 'hunter@example.test');
  await page.goto(`/cases/${caseId}`);
  const card = page.getByTestId('survey-import');
  await expect(card.getByRole('heading', { name: 'Import a walked survey' })).toBeVisible();
  await expect(card.getByRole('link', { name: 'cautions' })).toHaveAttribute('href', '/cautions');
  await expect(card.getByLabel('Time tolerance (seconds)')).toHaveValue('5');

  // 1. Not XML at all: the plain message, and nothing stored.
  await card.getByLabel('GPX track (.gpx)').setInputFiles(path.join(FIXTURES, 'not-xml.gpx'));
  await card.getByRole('button', { name: 'Check the files' }).click();
  const refusal = card.getByRole('alert').filter({ hasText: 'cannot be imported' });
  await expect(refusal).toContainText('The GPX is not well-formed XML');
  await expect(refusal).toContainText('Nothing was stored');
  await expect(card.getByRole('button', { name: /^Import \d+ points?$/ })).toHaveCount(0);
  expect(await readingsOn(hunterApi, caseId)).toBe(0);

  // 2. The track and its levels: the dry run's preview, still nothing stored.
  await card.getByLabel('GPX track (.gpx)').setInputFiles(path.join(FIXTURES, 'east-track.gpx'));
  await card.getByLabel('CSV of timed levels (optional)').setInputFiles(path.join(FIXTURES, 'east-track-levels.csv'));
  await card.getByRole('button', { name: 'Check the files' }).click();
  const preview = card.getByTestId('survey-preview');
  // 9 CSV rows; the last (15:03:20) is 130 s after the last track point, beyond the 5 s tolerance.
  await expect(preview).toContainText('8 points');
  await expect(preview).toContainText('CSV row 10');
  // The -60 dBm row beats S8 (-79 dBm: S9 = -73 dBm below 30 MHz, 6 dB per S-unit, IARU Region 1 R.1).
  await expect(preview.getByTestId('survey-strongest')).toContainText('-60 dBm');
  await expect(preview.getByTestId('survey-strongest')).toContainText('31.06000° S, 129.76080° E');
  expect(await readingsOn(hunterApi, caseId)).toBe(0);
  await card.screenshot({ path: info.outputPath('survey-preview.png') });
  const box = await card.boundingBox();
  expect(box!.width).toBeLessThanOrEqual(360);

  // 3. Import: all eight points, and the map draws them with the strongest reading's own marker.
  await preview.getByRole('button', { name: 'Import 8 points' }).click();
  await expect(card.getByTestId('survey-imported')).toContainText('8 points were added');
  expect(await readingsOn(hunterApi, caseId)).toBe(8);
  const map = page.getByTestId('case-map');
  const marker = map.getByTestId('strongest-marker');
  await expect(marker).toHaveCount(1);
  await expect(marker).toHaveAttribute('data-source', 'gpx');
  await expect(marker).toBeVisible();
  await expect(map.locator('.qf-trail-peak')).toHaveCount(1);
  const legend = map.getByTestId('trail-legend');
  await expect(legend).toContainText('strongest single reading');
  await expect(legend).toContainText('level peak (smoothed over neighbours)');
  await marker.click();
  const popup = map.getByTestId('strongest-popup');
  await expect(popup).toContainText('-60 dBm');
  await expect(popup).toContainText('31.06000° S, 129.76080° E');
  await expect(popup).toContainText('29/11/2026, 15:00:41'); // the CSV row's own time, shown in the browser's zone (UTC here)
  await map.screenshot({ path: info.outputPath('survey-on-map.png') });

  // 4. A reading typed on the walk as well: two trails on one grading, told apart and shown one at a time.
  const walked = await api(`/api/cases/${caseId}/readings`, {
    session: hunterApi,
    body: { clientId: crypto.randomUUID(), lat: -31.0597, lon: 129.7604, level: { unit: 'S', value: 6 }, frequencyKhz: 7100, takenAt: '2026-11-30T16:00:00Z' },
  });
  expect(walked.status, walked.text).toBe(201);
  await page.reload();
  const sources = map.getByTestId('trail-sources');
  await expect(sources.getByRole('checkbox')).toHaveCount(2);
  await expect(map.getByTestId('strongest-marker')).toHaveCount(2);
  await sources.getByRole('checkbox', { name: /Walk \(1 reading\)/ }).uncheck();
  await expect(map.getByTestId('strongest-marker')).toHaveCount(1);
  await expect(map.getByTestId('strongest-marker')).toHaveAttribute('data-source', 'gpx');
  await expect(sources.getByRole('checkbox', { name: /Imported survey \(8 readings\)/ })).toBeChecked();
  await map.screenshot({ path: info.outputPath('two-trails.png') });
  expect(errors.filter((e) => /Content Security Policy|Refused/.test(e))).toEqual([]);
  await context.close();
});
