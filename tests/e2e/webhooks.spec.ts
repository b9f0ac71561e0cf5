import { expect, test } from '@playwright/test';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { guardOffline, signInAs } from './helpers';

test('an admin allows a receiver, an integrator registers a webhook, copies its secret once, sends a test and reads the delivery log', async ({ page }) => {
  const got: { event: string; signature: string }[] = [];
  const server = createServer((req, res) => {
    req.resume();
    req.on('end', () => { got.push({ event: String(req.headers['correlary-webhook-event']), signature: String(req.headers['correlary-webhook-signature']) }); res.end('ok'); });
  });
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const outside = guardOffline(page);
  try {
    await signInAs(page, 'admin');
    await page.goto('/admin/webhooks');
    const allow = page.getByRole('form', { name: 'Webhook allow-list' });
    await allow.getByLabel('Allowed URL prefixes, one per line').fill(`${base}/e2e/`);
    await allow.getByRole('button', { name: 'Save the allow-list' }).click();
    await expect(allow.getByRole('status')).toContainText('Allow-list saved');
    await page.screenshot({ path: 'test-results/journey-webhook-allowlist.png', fullPage: true });

    await page.context().clearCookies();
    await signInAs(page, 'integrator');
    await page.goto('/account/webhooks');
    const form = page.getByRole('form', { name: 'Register a webhook endpoint' });
    // A URL off the allow-list is refused beside the field.
    await form.getByLabel('Receiving URL').fill('http://192.0.2.1/hook');
    await form.getByRole('button', { name: 'Register the endpoint' }).click();
    await expect(form.getByText('Not on the webhook allow-list')).toBeVisible();
    await form.getByLabel('Receiving URL').fill(`${base}/e2e/hook`);
    await form.getByLabel('Correlations to follow (slugs, optional)').fill('pipe-turbulent-gnielinski');
    await form.getByRole('button', { name: 'Register the endpoint' }).click();
    await expect(page.getByTestId('webhook-secret')).toHaveText(/^whsec_/);
    const row = page.getByRole('row').filter({ hasText: `${base}/e2e/hook` });
    await row.getByRole('button', { name: 'Delivery log' }).click();
    await page.getByRole('button', { name: 'Send a test delivery' }).click();
    await expect.poll(() => got.some((g) => g.event === 'ping'), { timeout: 15_000 }).toBe(true);
    expect(got.find((g) => g.event === 'ping')!.signature).toMatch(/^v1=[0-9a-f]{64}$/);
    await expect(page.getByRole('table').filter({ hasText: 'ping' }).getByText('delivered')).toBeVisible({ timeout: 10_000 });
    await page.screenshot({ path: 'test-results/journey-webhooks.png', fullPage: true });
    expect(outside).toEqual([]);
  } finally {
    server.close();
  }
});
