import { expect, type Page } from '@playwright/test';

/** Signs a demo person in through the sign-in page (password `quietfix-demo`) and waits for the cases page. */
export async function signInPage(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('quietfix-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/cases/);
}
