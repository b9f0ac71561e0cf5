import { expect, test } from '@playwright/test';
import { guardOffline, signInAs, DEMO_PASSWORD } from './helpers';

test.describe.configure({ mode: 'serial' });

test('an author drafts a correlation, uploads check cases from CSV, sees one fail, fixes it and submits', async ({ page }) => {
  const outside = guardOffline(page);
  const slug = `journey-duct-${Date.now()}`;
  await signInAs(page, 'author');
  await page.goto('/author');
  const form = page.getByRole('form', { name: 'New correlation' });
  await form.getByLabel('Slug (stable public identifier)').fill('Not A Slug');
  await form.getByLabel('Title').fill('Journey duct correlation');
  await form.getByLabel('Situation').fill('test duct');
  await form.getByRole('button', { name: 'Create draft' }).click();
  await expect(form.getByText('Lower-case words joined by hyphens')).toBeVisible();
  await expect(form.getByLabel('Title')).toHaveValue('Journey duct correlation');
  await form.getByLabel('Slug (stable public identifier)').fill(slug);
  await form.getByRole('button', { name: 'Create draft' }).click();
  await expect(page).toHaveURL(new RegExp(`/author/${slug}/1`));
  await expect(page.getByTestId('json-editor')).toBeVisible();

  await page.getByRole('tab', { name: /Check cases/ }).click();
  const header = 'label,Re_D,expected:Nu_D,rel,why,source_kind,citation,locator\n';
  // First file: one row lacks the locator a published source needs; nothing may be added.
  await page.getByLabel('CSV file of check cases').setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from(`${header}low,100,3,1e-9,arithmetic,common-practice,arithmetic,\nbad,1e4,30,1e-9,arithmetic,published,a handbook,\n`) });
  const preview = page.getByRole('region', { name: 'CSV preview' }).or(page.getByLabel('CSV preview'));
  await expect(preview.getByText('source: "locator" is required here')).toBeVisible();
  await expect(page.getByRole('button', { name: /^Add \d+ row/ })).toBeDisabled();
  await page.getByRole('button', { name: 'Discard' }).click();
  // Second file: valid rows, but the last expected value is wrong (0.3 √1e5 = 94.868…, not 95).
  const rows = 'low,100,3,1e-9,arithmetic,common-practice,arithmetic of 0.3 Re^0.5,\nmid,1e4,30,1e-9,arithmetic,common-practice,arithmetic of 0.3 Re^0.5,\nhigh,1e5,95,1e-9,arithmetic,common-practice,arithmetic of 0.3 Re^0.5,\n';
  await page.getByLabel('CSV file of check cases').setInputFiles({ name: 'cases.csv', mimeType: 'text/csv', buffer: Buffer.from(header + rows) });
  await page.getByRole('button', { name: 'Add 3 rows' }).click();
  await page.getByRole('button', { name: 'Save and validate' }).click();
  await expect(page.getByText('Saved; validation found problems')).toBeVisible();
  const report = page.getByRole('region', { name: 'Validation report' });
  await expect(report.getByText(/computed 94\.86\d+ differs from expected 95/).first()).toBeVisible();
  await page.screenshot({ path: 'test-results/journey-author-failing-case.png', fullPage: true });

  await page.getByLabel('high expected Nu_D').fill('94.8x');
  await page.getByLabel('high expected Nu_D').blur();
  await expect(page.getByText('Not a number (use e.g. 2.5e4)')).toBeVisible();
  await expect(page.getByLabel('high expected Nu_D')).toHaveValue('94.8x');
  await page.getByLabel('high expected Nu_D').fill('94.86832980505137');
  await page.getByLabel('high expected Nu_D').blur();
  await page.getByRole('button', { name: 'Save and validate' }).click();
  await expect(page.getByText('Saved; validation passed')).toBeVisible();
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page).toHaveURL(new RegExp(`/correlations/${slug}/versions/1`));
  await expect(page.getByText('in review').first()).toBeVisible();
  await page.screenshot({ path: 'test-results/journey-author-submitted.png', fullPage: true });
  expect(outside).toEqual([]);
});

test('an approver reviews the diff and deviation chart and approves with the password', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'approver');
  await page.goto('/review');
  const row = page.getByRole('row', { name: /brightwater-louvre-pressure-loss/ });
  await row.getByRole('link', { name: 'Review' }).click();
  // The definition itself comes first: equations, inputs and outputs with units, validity ranges, references.
  const underReview = page.getByRole('region', { name: 'The definition under review' });
  await expect(underReview.getByText('800 ≤ Re_h ≤ 12000')).toBeVisible();
  await expect(underReview.getByRole('region', { name: 'References' })).toContainText('BTS-TR-2026-014');
  await expect(page.getByRole('table', { name: 'Definition differences' })).toBeVisible();
  await expect(page.getByRole('table', { name: 'Definition differences' }).getByText('"expression": "2.1 * (1/sigma - 1)^2 + 38 / Re_h^0.5"')).toBeVisible();
  await expect(page.getByTestId('largest-difference')).toContainText('Largest difference');
  await expect(page.locator('.recharts-surface').first()).toBeVisible();
  await page.screenshot({ path: 'test-results/journey-approver-review.png', fullPage: true });
  const signOff = page.getByRole('form', { name: 'Sign-off' });
  await signOff.getByRole('button', { name: 'Approve and sign' }).click();
  await expect(signOff.getByText('Enter your password to sign')).toBeVisible();
  await signOff.getByLabel('Your password, to sign').fill('not-my-password');
  await signOff.getByRole('button', { name: 'Approve and sign' }).click();
  await expect(signOff.getByRole('alert')).toContainText('password is not correct');
  await signOff.getByLabel('Comment (required when returning)').fill('Recalibration certificate attached; values agree with the rerun.');
  // The in-house rig data are one kind of evidence: below the approval policy, so the signature carries a waiver.
  await expect(page.getByTestId('evidence-summary')).toContainText('Evidence: thin');
  await signOff.getByLabel(/Waiver: why you approve below the evidence policy/).fill('In-house fit of our own louvre; the only data that exist are the recalibrated rig runs.');
  await signOff.getByLabel('Your password, to sign').fill(DEMO_PASSWORD);
  await signOff.getByRole('button', { name: 'Approve and sign' }).click();
  await expect(page).toHaveURL(/\/correlations\/brightwater-louvre-pressure-loss\/versions\/2/);
  await expect(page.getByText('approved').first()).toBeVisible();
  expect(outside).toEqual([]);
});

test('an engineer evaluates with an out-of-range input and sees the warning beside it', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'engineer');
  await page.goto('/library');
  await page.getByRole('searchbox').fill('colebrook');
  await page.getByRole('link', { name: /Colebrook/ }).click();
  const panel = page.getByRole('complementary', { name: 'Evaluate' });
  await panel.getByLabel(/^Re_D/).fill('abc');
  await panel.getByRole('button', { name: 'Evaluate' }).click();
  await expect(panel.getByText('Enter a number, e.g. 2.5e4')).toBeVisible();
  await expect(panel.getByLabel(/^Re_D/)).toHaveValue('abc');
  await panel.getByLabel(/^Re_D/).fill('1000');
  await panel.getByLabel(/^eps_D/).fill('0.001');
  await panel.getByRole('button', { name: 'Evaluate' }).click();
  await expect(panel.getByRole('alert')).toContainText('Re_D = 1000 is below the minimum 4000');
  await expect(panel.getByTestId('out-f')).not.toHaveText('—');
  await expect(page.getByRole('note').first()).toContainText('Engineering estimate');
  await page.screenshot({ path: 'test-results/journey-engineer-warning.png', fullPage: true });
  // Keyboard: the snippet tabs follow the arrow keys.
  await page.getByRole('tab', { name: 'curl' }).focus();
  await page.keyboard.press('ArrowRight');
  await expect(page.getByRole('tab', { name: 'Python' })).toHaveAttribute('aria-selected', 'true');
  await expect(page.getByRole('region', { name: 'Use from a script' })).toContainText('import os, requests');

  // Unit picker: 15 °C converts on the server to 288.15 K; U.S. Standard Atmosphere 1976 gives μ = 1.7894e-5 Pa s at sea level.
  await page.goto('/correlations/air-viscosity-sutherland');
  const air = page.getByRole('complementary', { name: 'Evaluate' });
  await air.getByLabel('T unit').selectOption('degC');
  await air.getByLabel(/^T —/).fill('15');
  await air.getByRole('button', { name: 'Evaluate' }).click();
  await expect(air.getByTestId('out-mu')).toHaveText(/^1\.789\d*e-5$/);
  expect(outside).toEqual([]);
});

test('an engineer compares cylinder correlations with their validity ranges shaded', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'engineer');
  await page.goto('/compare');
  await page.getByLabel('Situation').selectOption('cylinder in cross-flow');
  await page.getByLabel(/Churchill–Bernstein/).check();
  await page.getByLabel(/Hilpert/).check();
  await page.getByRole('button', { name: 'Plot' }).click();
  await expect(page.locator('.recharts-reference-area').first()).toBeVisible();
  await expect(page.getByText(/differs from .* by at most/)).toBeVisible();
  await page.screenshot({ path: 'test-results/journey-compare.png', fullPage: true });
  expect(outside).toEqual([]);
});

test('an admin creates an API token and sees it once', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'admin');
  await page.goto('/admin/tokens');
  const form = page.getByRole('form', { name: 'Create an API token' });
  await form.getByRole('button', { name: 'Create token' }).click();
  await expect(form.getByText('Give the token a name')).toBeVisible();
  await form.getByLabel('Token name').fill('nightly sizing run');
  await form.getByLabel('Expires in (days)').fill('30');
  await form.getByRole('button', { name: 'Create token' }).click();
  await expect(page.getByTestId('new-token')).toHaveText(/^crl_/);
  await expect(page.getByRole('cell', { name: 'nightly sizing run' })).toBeVisible();
  await page.goto('/admin/audit');
  await expect(page.getByTestId('chain-status')).toContainText('Hash chain intact');
  await page.screenshot({ path: 'test-results/journey-admin-audit.png', fullPage: true });
  expect(outside).toEqual([]);
});
