import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'correlary-demo-2026';

export async function signInAs(page: Page, who: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(`${who}@demo.example`);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/library/);
}

/** Fails the test if the page ever requests anything outside loopback. */
export function guardOffline(page: Page): string[] {
  const outside: string[] = [];
  page.on('request', (req) => {
    const url = new URL(req.url());
    if (!['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname) && !['data:', 'blob:'].includes(url.protocol)) outside.push(req.url());
  });
  return outside;
}
