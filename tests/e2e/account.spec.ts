import { expect, test, type Browser, type Page } from '@playwright/test';

/**
 * An account's own password in the browser: invited by the chair, the link from the catcher
 * sets a password, and a change on the profile page signs out every device, this one too.
 */
const CATCHER = process.env.MAIL_CATCHER_URL ?? 'http://127.0.0.1:8125';

async function signInAs(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/cases/);
}

async function device(browser: Browser, email: string, password: string) {
  const page = await (await browser.newContext()).newPage();
  await signInAs(page, email, password);
  return page;
}

test('a new member sets a password from the invitation, then a password change signs out every device', async ({ page, browser, baseURL }, info) => {
  test.skip(info.project.name !== 'desktop', 'one account life is enough; the forms are the same on the phone');
  const email = `e2e-account-${Date.now()}@example.test`;
  const chair = await device(browser, 'chair@example.test', 'quietfix-demo');
  const invited = await chair.request.post('/api/invitations', {
    data: { email, name: 'Quade Member', role: 'member' },
    headers: { origin: new URL(baseURL!).origin },
  });
  expect(invited.status()).toBe(201);

  let link = '';
  await expect
    .poll(async () => {
      const r = await page.request.get(`${CATCHER}/api/v2/search?kind=to&query=${encodeURIComponent(email)}`);
      const m = (await r.json()).items[0];
      link = m?.text.match(/https?:\/\/\S+\/set-password\?token=\S+/)?.[0] ?? '';
      return link !== '';
    }, { timeout: 20_000 })
    .toBe(true);

  await page.goto(link);
  await page.getByLabel('New password').fill('first of two passwords');
  await page.getByLabel('The same again').fill('first of two passwords');
  await page.getByRole('button', { name: 'Save password' }).click();
  await expect(page.getByText('Password saved')).toBeVisible();

  await signInAs(page, email, 'first of two passwords');
  const other = await device(browser, email, 'first of two passwords');

  await page.goto('/profile');
  const form = page.getByRole('form', { name: 'Change your password' });
  await form.getByLabel('Current password').fill('not the password at all');
  await form.getByLabel('New password').fill('second of two passwords');
  await form.getByLabel('The same again').fill('second of two passwords');
  await form.getByRole('button', { name: 'Change password' }).click();
  await expect(form.getByText('This is not your current password.')).toBeVisible();

  await form.getByLabel('Current password').fill('first of two passwords');
  await form.getByRole('button', { name: 'Change password' }).click();
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fprofile/);
  // The other device is signed out too.
  await other.goto('/cases');
  await expect(other).toHaveURL(/\/sign-in/);
  await signInAs(page, email, 'second of two passwords');
});
