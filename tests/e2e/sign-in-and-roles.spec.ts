import { expect, test } from '@playwright/test';
import { guardOffline, signInAs } from './helpers';

const CASES = [
  { who: 'admin', allowed: '/admin/users', heading: 'Users and roles', forbidden: '/review' },
  { who: 'author', allowed: '/author', heading: 'My drafts', forbidden: '/admin/users' },
  { who: 'approver', allowed: '/review', heading: 'Review queue', forbidden: '/author' },
  { who: 'engineer', allowed: '/library', heading: 'Correlation library', forbidden: '/review' },
  { who: 'integrator', allowed: '/account', heading: 'My API tokens', forbidden: '/admin/tokens' },
];

for (const c of CASES) {
  test(`${c.who} reaches ${c.allowed} and is turned away from ${c.forbidden}`, async ({ page }) => {
    const outside = guardOffline(page);
    await signInAs(page, c.who);
    await page.goto(c.allowed);
    await expect(page.getByRole('heading', { name: c.heading })).toBeVisible();
    await page.goto(c.forbidden);
    await expect(page.getByRole('heading', { name: 'Not available with your roles' })).toBeVisible();
    expect(outside).toEqual([]);
  });
}

test('sign-in explains bad input next to the field and keeps what was typed', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.getByText('Enter your e-mail address')).toBeVisible();
  await expect(page.getByText('Enter your password')).toBeVisible();
  await page.getByLabel('E-mail').fill('engineer@demo.example');
  await page.getByLabel('Password').fill('definitely-wrong');
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.getByRole('form', { name: 'Sign in' }).getByRole('alert')).toHaveText('E-mail or password is not correct.');
  await expect(page.getByLabel('E-mail')).toHaveValue('engineer@demo.example');
  await page.screenshot({ path: 'test-results/sign-in-error.png' });
});

test('pages need a session: an anonymous visit goes to sign-in', async ({ page }) => {
  await page.goto('/library');
  await expect(page).toHaveURL(/\/sign-in/);
});
