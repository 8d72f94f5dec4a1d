import { expect, test } from '@playwright/test';

test.describe('signing in through the form', () => {
  test('a coordinator signs in and sees the cases page', async ({ page }, info) => {
    const problems: string[] = [];
    page.on('console', (m) => m.type() === 'error' && problems.push(m.text()));
    await page.goto('/cases');
    await expect(page).toHaveURL(/\/sign-in\?next=%2Fcases/);
    await page.getByLabel('E-mail').fill('coordinator@example.test');
    await page.getByLabel('Password').fill('quietfix-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page).toHaveURL(/\/cases$/);
    await expect(page.getByRole('heading', { name: 'All cases' })).toBeVisible();
    await expect(page.getByRole('list', { name: 'Cases' }).getByRole('listitem').first()).toBeVisible();
    // The search finds a demo case by its words.
    await page.getByLabel('Search').fill('Rasping');
    await page.getByRole('button', { name: 'Filter' }).click();
    await expect(page.getByRole('link', { name: /Rasping hash on 80 m/ })).toBeVisible();
    if (info.project.name === 'phone-360') {
      // Nothing wider than the phone's screen.
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow).toBeLessThanOrEqual(0);
    }
    await page.screenshot({ path: info.outputPath('cases.png'), fullPage: true });
    expect(problems).toEqual([]);
  });

  test('a wrong password shows a plain message and stays on the form', async ({ page }) => {
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill('hunter@example.test');
    await page.getByLabel('Password').fill('not my password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('alert').filter({ hasText: 'do not match' })).toBeVisible();
    await expect(page).toHaveURL(/\/sign-in/);
  });

  test('the landing and cautions pages say what Quietfix does and how to stay safe', async ({ page }) => {
    await page.goto('/');
    await expect(page.getByRole('heading', { level: 1 })).toContainText('Find the noisy gadget');
    await page.getByRole('link', { name: 'Read the cautions first' }).click();
    await expect(page.getByText('Never touch or climb utility hardware')).toBeVisible();
    await expect(page.getByText('Hunt from public ground only')).toBeVisible();
  });
});
