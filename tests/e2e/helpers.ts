import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'correlary-demo-2026';

export async function signInAs(page: Page, who: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(`${who}@demo.example`);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page).toHaveURL(/\/library/);
}

/**
 * Collects what must never happen on a page: a request outside loopback, an uncaught error in the
 * page, or a Content-Security-Policy refusal. Tests assert the list stays empty.
 */
export function guardOffline(page: Page): string[] {
  const outside: string[] = [];
  page.on('pageerror', (err) => outside.push(`page error: ${err.message}`));
  page.on('console', (msg) => { if (msg.type() === 'error' && /Content Security Policy/i.test(msg.text())) outside.push(`CSP: ${msg.text()}`); });
  page.on('request', (req) => {
    const url = new URL(req.url());
    // chrome: and chrome-extension: are the browser's own built-in PDF viewer, loaded from the browser, not the network.
    if (!['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname) && !['data:', 'blob:', 'chrome:', 'chrome-extension:'].includes(url.protocol)) outside.push(req.url());
  });
  return outside;
}

/**
 * Runs axe-core (WCAG 2.1 A and AA rules) on the page as it is now and fails on any serious or critical violation,
 * naming the rule and the first elements; saves a full-page screenshot as test-results/screens/<name>.png.
 */
export async function checkScreen(page: Page, name: string) {
  await page.waitForLoadState('networkidle');
  const { default: AxeBuilder } = await import('@axe-core/playwright');
  const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
  await page.screenshot({ path: `test-results/screens/${name}.png`, fullPage: true });
  const bad = result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join(' | ')}`);
  expect(bad, `accessibility of the screen "${name}"`).toEqual([]);
}
