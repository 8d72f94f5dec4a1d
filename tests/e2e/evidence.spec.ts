import { expect, test } from '@playwright/test';
import { signInPage } from '../support/sign-in-page';
import { m4aHeaderOnly, mp3Bytes } from '../support/encoders';
import { harmonicFamily, mix, wavBytes, whiteNoise } from '../support/signals';

const DEMO_OPEN_TITLE = 'Rasping hash on 80 m and 40 m in the evenings'; // db/seeds/demo.ts

/**
 * Evidence on a 360-px phone: the assigned hunter attaches a synthetic WAV (a 50 Hz harmonic
 * family, made here) through the file input; the upload goes straight to the object store with
 * a real progress bar (the connection is throttled so the bar is seen moving), then the worker's
 * audio signature appears on the case page with its spectrum.
 */
/** The demo's open case by its own title (a text search can also match cases other tests filed). */
async function demoOpenCase(page: import('@playwright/test').Page): Promise<string> {
  const items = (await (await page.request.get('/api/cases?q=Rasping')).json()).items as { id: string; title: string }[];
  return items.find((c) => c.title === DEMO_OPEN_TITLE)!.id;
}

/** Leave the demo case as it was: delete what this test attached. */
async function removeAttached(page: import('@playwright/test').Page, caseId: string, names: string[]) {
  const files = (await (await page.request.get(`/api/cases/${caseId}/files`)).json()).items as { id: string; name: string }[];
  for (const f of files.filter((x) => names.includes(x.name))) await page.request.delete(`/api/cases/${caseId}/files/${f.id}`, { headers: { origin: new URL(page.url()).origin } });
}

test('a hunter uploads a WAV with a moving progress bar and later sees its signature', async ({ browser }, info) => {
  test.skip(info.project.name !== 'phone-360', 'a phone-sized check');
  const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  await signInPage(page, 'hunter@example.test');
  const caseId = await demoOpenCase(page);
  await page.goto(`/cases/${caseId}`);
  const card = page.getByTestId('evidence-card');
  await expect(card.getByRole('heading', { name: 'Recordings and photos' })).toBeVisible();

  // About 1.3 MB at 400 kB/s: a few seconds of upload to watch.
  const rate = 16000;
  const wav = Buffer.from(wavBytes(mix(harmonicFamily(rate * 40, rate, 50), whiteNoise(rate * 40, 0.003, 6)), rate));
  const cdp = await context.newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: 4_000_000, uploadThroughput: 400_000 });
  const t0 = Date.now();
  await card.getByTestId('file-input').setInputFiles({ name: 'hum by the lane.wav', mimeType: 'audio/wav', buffer: wav });

  const row = card.getByTestId('upload-row');
  const bar = row.getByTestId('upload-progress');
  await expect(bar).toBeVisible();
  await expect(row).toHaveAttribute('data-phase', 'sending');
  // Part-way: the bar shows some bytes sent but not all.
  await expect
    .poll(async () => {
      const [v, max] = await bar.evaluate((el: HTMLProgressElement) => [el.value, el.max]);
      return v > 0 && v < max;
    }, { timeout: 15_000 })
    .toBe(true);
  await expect(row.getByRole('status')).toContainText(/Sending… \d+ % of 1\.3 MB/);
  await expect(row).toHaveAttribute('data-phase', 'done', { timeout: 30_000 });
  const uploadMs = Date.now() - t0;
  await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

  const item = card.getByTestId('file-item').filter({ hasText: 'hum by the lane.wav' });
  await expect(item.getByTestId('analysis')).toContainText('mains family 50 Hz', { timeout: 30_000 });
  await expect(item.getByTestId('analysis')).toContainText('common practice');
  await item.getByRole('button', { name: 'Show the spectrum' }).click();
  await expect(item.getByTestId('signature-view').locator('canvas')).toHaveCount(2);
  const box = await card.boundingBox();
  expect(box!.width).toBeLessThanOrEqual(360);
  expect(errors.filter((e) => /Content Security Policy|Refused/.test(e))).toEqual([]);
  console.log(`[evidence e2e] 1.3 MB WAV at 400 kB/s upload: attached ${uploadMs} ms after choosing; signature shown ${Date.now() - t0} ms after choosing`);
  await removeAttached(page, caseId, ['hum by the lane.wav']);
  await context.close();
});

/**
 * An MP3 (made here by LAME from a 60 Hz family) gets its signature like a WAV; an M4A is kept and
 * the case page says plainly that its format is not analysed and which formats are.
 */
test('an MP3 gets a signature; an M4A says it is stored but not analysed', async ({ page }) => {
  await signInPage(page, 'hunter@example.test');
  const caseId = await demoOpenCase(page);
  await page.goto(`/cases/${caseId}`);
  const card = page.getByTestId('evidence-card');
  await expect(card).toContainText('MP3 or OGG (Vorbis, Opus) get an audio signature');
  const rate = 8000;
  const mp3 = Buffer.from(await mp3Bytes(mix(harmonicFamily(rate * 5, rate, 60), whiteNoise(rate * 5, 0.003, 6)), rate, 64));
  await card.getByTestId('file-input').setInputFiles([
    { name: 'hum at the stile.mp3', mimeType: 'audio/mpeg', buffer: mp3 },
    { name: 'voice memo.m4a', mimeType: 'audio/mp4', buffer: Buffer.from(m4aHeaderOnly()) },
  ]);
  const mp3Item = card.getByTestId('file-item').filter({ hasText: 'hum at the stile.mp3' });
  await expect(mp3Item.getByTestId('analysis')).toContainText('mains family 60 Hz', { timeout: 30_000 });
  const m4aItem = card.getByTestId('file-item').filter({ hasText: 'voice memo.m4a' });
  await expect(m4aItem.getByTestId('analysis-status')).toContainText('Not analysed:');
  await expect(m4aItem.getByTestId('analysis-status')).toContainText('upload it as WAV, MP3 or OGG');
  await card.scrollIntoViewIfNeeded();
  await card.screenshot({ path: `test-results/evidence/compressed-${test.info().project.name}.png` });
  await removeAttached(page, caseId, ['hum at the stile.mp3', 'voice memo.m4a']);
});
