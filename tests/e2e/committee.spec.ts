import { expect, test } from '@playwright/test';
import { signInPage } from '../support/sign-in-page';

/**
 * The committee's queue in a real browser: filtering the table moves the URL, and the map of all
 * cases follows the same filter (only the chosen status's symbols remain); a click on a symbol
 * opens the case.
 */
test('a coordinator filters the queue and the map follows', async ({ page }, info) => {
  test.skip(info.project.name !== 'desktop', 'one desktop run covers the queue and its map');
  await signInPage(page, 'coordinator@example.test');
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
