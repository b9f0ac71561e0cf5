import { expect, test } from '@playwright/test';
import { checkScreen, guardOffline, signInAs } from './helpers';

/**
 * Every screen each role can reach, checked by axe-core for serious and critical violations (the journeys check the
 * states in between: errors, previews, confirmations), with a screenshot of each in test-results/screens.
 */
const SCREENS: Record<string, string[]> = {
  engineer: ['/library', '/library?q=laminar%20plate&category=external-flow', '/correlations/pipe-turbulent-gnielinski', '/correlations/ideal-gas-density/versions/1',
    '/compare', '/advisor', '/templates', '/templates/flat-plate-forced-convection-air', '/projects', '/account', '/api-reference', '/forbidden?needs=admin', '/no-such-page'],
  author: ['/author'],
  approver: ['/review'],
  integrator: ['/account', '/account/webhooks'],
  admin: ['/admin/users', '/admin/tokens', '/admin/audit', '/admin/mail', '/admin/evidence', '/admin/webhooks'],
};

test.describe.configure({ timeout: 300_000 });
for (const [who, paths] of Object.entries(SCREENS)) {
  test(`every screen of the ${who} passes the accessibility checks`, async ({ page }) => {
    const outside = guardOffline(page);
    await signInAs(page, who);
    for (const path of paths) {
      await page.goto(path);
      await checkScreen(page, `${who}${path.replace(/[^a-z0-9]+/gi, '-')}`);
    }
    test.expect(outside).toEqual([]);
  });
}

test('the sign-in screen passes the accessibility checks', async ({ page }) => {
  await page.goto('/sign-in');
  await checkScreen(page, 'sign-in');
});

test('an engineer opens the source document behind a check case, inline beside the case', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'engineer');
  await page.goto('/correlations/brightwater-cp3-cold-plate-channel');
  const docs = page.getByRole('region', { name: 'Source documents' });
  await expect(docs).toContainText('BTS-TR-2026-030 table 2 (invented demo).pdf');
  await docs.getByText('run 5').click();
  const pdf = docs.getByLabel(/the source of run 5/);
  await expect(pdf).toBeVisible();
  // What the browser shows is what was uploaded: the store's bytes, served with their type, start as a PDF.
  const answer = await page.request.get(await pdf.getAttribute('data') ?? '');
  expect(answer.headers()['content-type']).toBe('application/pdf');
  expect((await answer.body()).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  await checkScreen(page, 'engineer-source-document');
  expect(outside).toEqual([]);
});
