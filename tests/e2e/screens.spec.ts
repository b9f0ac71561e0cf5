import { test } from '@playwright/test';
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
