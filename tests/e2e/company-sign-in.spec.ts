import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import { checkScreen, guardOffline, signInAs } from './helpers';
import { call, signIn } from '../support/http';
import { plateCases, plateDefinition, FIXTURE_WAIVER } from '../support/fixtures';

test.describe.configure({ mode: 'serial' });

/** The local provider's company directory (scripts/fake-oidc.ts reads it at every sign-in). */
const DIRECTORY = process.env.OIDC_DIRECTORY ?? join(process.cwd(), '.data', 'oidc-directory-test.json');
interface Person { login: string; email: string; name: string; groups: string[] }
const readDirectory = () => JSON.parse(readFileSync(DIRECTORY, 'utf8')) as Person[];
function setGroups(login: string, groups: string[]) {
  writeFileSync(DIRECTORY, JSON.stringify(readDirectory().map((p) => (p.login === login ? { ...p, groups } : p)), null, 2));
}

async function companySignIn(page: Page, login: string) {
  await page.goto('/sign-in');
  await page.getByRole('button', { name: 'Sign in with your company account' }).click();
  // The provider's own pages (the local stand-in's login and consent).
  await page.locator('input[name="login"]').fill(login);
  await page.locator('input[name="password"]').fill('any password at the stand-in');
  await page.locator('button[type="submit"]').click();
  const consent = page.locator('button[type="submit"]', { hasText: /Continue/i });
  if (await consent.isVisible().catch(() => false)) await consent.click();
}

test('a company account in the approvers group signs in with the approver role; out of the group, the next sign-in has none', async ({ page, context }) => {
  const outside = guardOffline(page);
  await page.goto('/sign-in');
  await checkScreen(page, 'sign-in-with-company');
  await companySignIn(page, 'hanna.marlow');
  await expect(page).toHaveURL(/\/library/);
  await expect(page.getByText('Hanna Marlow · approver, engineer')).toBeVisible();
  await page.goto('/review');
  await expect(page.getByRole('heading', { name: /Review queue/ })).toBeVisible();

  // She signs off a version: her signature is the sign-in she just made at the company's provider.
  const author = (await signIn('author@demo.example')).cookie!;
  const slug = `company-sign-off-${Date.now()}`;
  expect((await call('/api/correlations', { cookie: author, body: { slug, definition: plateDefinition(), checkCases: plateCases() } })).status).toBe(200);
  expect((await call(`/api/correlations/${slug}/versions/1/submit`, { cookie: author, method: 'POST' })).status).toBe(200);
  await page.goto(`/review/${slug}/1`);
  const form = page.getByRole('form', { name: 'Sign-off' });
  await expect(form.getByTestId('company-signature')).toContainText('Identity confirmed with your company account');
  await form.getByLabel(/Waiver/).fill(FIXTURE_WAIVER);
  await checkScreen(page, 'company-approver-sign-off');
  await form.getByRole('button', { name: 'Approve and sign' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'is approved with your signature' })).toBeVisible();
  await expect(page.getByRole('listitem').filter({ hasText: 'by Hanna Marlow' })).toContainText('approved');

  // The company removes her from the approvers group: her next sign-in carries the engineer role only.
  setGroups('hanna.marlow', ['thermal-engineers']);
  try {
    await page.getByRole('button', { name: 'Sign out' }).click();
    await expect(page).toHaveURL(/sign-in/);
    // Signing out of Correlary does not sign out of the provider; a fresh browser session does both.
    await context.clearCookies({ domain: '127.0.0.1' });
    await companySignIn(page, 'hanna.marlow');
    await expect(page.getByText('Hanna Marlow · engineer')).toBeVisible();
    await page.goto('/review');
    await expect(page).toHaveURL(/forbidden/);
  } finally {
    setGroups('hanna.marlow', ['thermal-approvers', 'thermal-engineers']);
  }
  expect(outside).toEqual([]);
});

test('someone in no mapped group is told so; an admin edits the mapping and can switch passwords off', async ({ page, context }) => {
  const outside = guardOffline(page);
  await companySignIn(page, 'tomas.reyes');
  await expect(page.getByRole('form', { name: 'Sign in' }).getByRole('alert')).toHaveText(/in no group that Correlary gives a role to/);
  await context.clearCookies();

  await signInAs(page, 'admin');
  await page.goto('/admin/sign-in');
  const form = page.getByRole('form', { name: 'Company sign-in' });
  await expect(form.getByLabel('Group 2', { exact: true })).toHaveValue('thermal-approvers');
  await form.getByRole('button', { name: 'Add a group' }).click();
  await form.getByLabel('Group 6', { exact: true }).fill('has space');
  await form.getByRole('button', { name: 'Save sign-in settings' }).click();
  await expect(form.getByText('A group name has no spaces or commas')).toBeVisible();
  await form.getByLabel('Group 6', { exact: true }).fill('sales');
  await form.getByLabel('Role of group 6').selectOption('engineer');
  await form.getByLabel(/Accept Correlary passwords too/).uncheck();
  await form.getByRole('button', { name: 'Save sign-in settings' }).click();
  await expect(page.getByRole('status')).toHaveText(/Saved/);
  await checkScreen(page, 'admin-company-sign-in');
  // Passwords are off: an engineer's is refused with the reason; the sales group now signs in as engineer.
  const other = await context.browser()!.newContext();
  const second = await other.newPage();
  await second.goto('/sign-in');
  await second.getByLabel('E-mail').fill('engineer@demo.example');
  await second.getByLabel('Password').fill('correlary-demo-2026');
  await second.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(second.getByRole('form', { name: 'Sign in' }).getByRole('alert')).toHaveText(/Password sign-in is switched off here/);
  await companySignIn(second, 'tomas.reyes');
  await expect(second.getByText('Tomas Reyes · engineer')).toBeVisible();
  await other.close();
  // Undo, so the settings stay as seeded for the runs that follow.
  await form.getByRole('button', { name: 'Remove group sales' }).click();
  await form.getByLabel(/Accept Correlary passwords too/).check();
  await form.getByRole('button', { name: 'Save sign-in settings' }).click();
  await expect(page.getByRole('status')).toHaveText(/Saved/);
  expect(outside).toEqual([]);
});
