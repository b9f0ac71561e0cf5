import { expect, test, type Page } from '@playwright/test';
import { simplePdf } from '@/lib/evidence/demo-document';
import { checkScreen, guardOffline, signInAs, DEMO_PASSWORD } from './helpers';

test.describe.configure({ mode: 'serial' });

const slug = `journey-duct-${Date.now()}`;

/** Types into a NumberCell-like input and commits it (they commit on blur). */
async function enter(page: Page, label: string | RegExp, value: string) {
  const field = page.getByLabel(label, { exact: typeof label === 'string' });
  await field.fill(value);
  await field.blur();
}

test('an author writes a correlation from its formula, types, pastes and uploads check cases, sees one fail, fixes it and submits', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'author');
  await page.goto('/author');
  await checkScreen(page, 'author-home');
  const form = page.getByRole('form', { name: 'New correlation' });
  await form.getByLabel('Slug (stable public identifier)').fill('Not A Slug');
  await form.getByLabel('Title').fill('Journey duct correlation');
  await form.getByLabel('Summary').fill('A made-up square-root law for the journey test.');
  await form.getByLabel('Situation').fill('test duct');
  await form.getByRole('button', { name: 'Create the draft' }).click();
  await expect(form.getByText('Lower-case words joined by hyphens')).toBeVisible();
  await expect(form.getByText('Write the formula')).toBeVisible();
  await expect(form.getByLabel('Title')).toHaveValue('Journey duct correlation');
  await checkScreen(page, 'author-new-errors');

  // The formula first: its inputs are found in it, named and given units here; the preview typesets it.
  await form.getByLabel('Slug (stable public identifier)').fill(slug);
  await form.getByLabel('Symbol').fill('Nu_D');
  await form.getByLabel('Name', { exact: true }).fill('Nusselt number');
  await form.getByLabel('Formula').fill('0.3 * Re_D^0.5');
  await expect(form.getByLabel('Name of Re_D')).toBeVisible();
  await expect(form.getByTestId('formula-preview')).toBeVisible();
  await form.getByLabel('Name of Re_D').fill('Reynolds number on the diameter');
  await form.getByLabel('Source (citation)').fill('Journey test law (2026), an invented square-root law for the browser test');
  await form.getByRole('button', { name: 'Create the draft' }).click();
  await expect(page).toHaveURL(new RegExp(`/author/${slug}/1`));
  await expect(page.getByText('Draft v1 created')).toBeVisible();

  // The form is the definition: a range, and a formula error shown beside its field as it is typed.
  await page.getByRole('button', { name: 'Add a range' }).click();
  await enter(page, 'limit 1 min', '10');
  await enter(page, 'limit 1 max', '1e5');
  const formula = page.getByLabel('Formula for Nu_D');
  await formula.fill('0.3 * Re^0.5');
  await expect(page.getByText(/unknown symbol "Re"/).first()).toBeVisible();
  await expect(page.getByTestId('form-status')).toContainText('to fix');
  await checkScreen(page, 'author-form-error');
  await formula.fill('0.3 * Re_D^0.5');
  await expect(page.getByTestId('form-status')).toContainText('passes the schema, formula, symbol and unit checks');
  await expect(page.getByTestId('preview-Nu_D')).toBeVisible();

  // Check cases: one typed in its row, the rest pasted from a spreadsheet, and a CSV file with one wrong value.
  await page.getByRole('tab', { name: /Check cases/ }).click();
  await page.getByRole('button', { name: 'Add a check case' }).click();
  await expect(page.getByTestId('case-problems-0')).toContainText('give the case a label');
  await page.getByLabel('case 1 label').fill('low');
  await enter(page, 'low input Re_D', '100');
  await enter(page, 'low expected Nu_D', '3');
  await enter(page, 'low relative tolerance', '1e-9');
  await page.getByLabel('low kind of source').selectOption('transcription');
  await page.getByLabel('low citation').fill('arithmetic of 0.3 Re^0.5');
  await expect(page.getByTestId('case-problems-0')).toHaveCount(0);
  await page.getByRole('button', { name: 'Duplicate low' }).click();
  await page.getByRole('button', { name: 'Delete low (copy)' }).click();
  // The source document: a text file named .pdf is refused by its content; a real PDF is attached and linked.
  await page.getByLabel('Source document of low').setInputFiles({ name: 'notes.pdf', mimeType: 'application/pdf', buffer: Buffer.from('plain text, not a PDF') });
  await expect(page.getByRole('alert').filter({ hasText: 'attach a PDF, PNG or JPEG' })).toBeVisible();
  await page.getByLabel('Source document of low').setInputFiles({ name: 'worked-value.pdf', mimeType: 'application/pdf', buffer: Buffer.from(simplePdf(['Journey test: the worked value (invented)'])) });
  await expect(page.getByTestId('attachment-link')).toHaveText('worked-value.pdf');
  await checkScreen(page, 'author-cases-typed');

  await page.getByLabel(/Or paste rows copied from a spreadsheet/).fill('label\tRe_D\texpected:Nu_D\trel\tsource_kind\tcitation\nmid\t1e4\t30\t1e-9\ttranscription\tarithmetic of 0.3 Re^0.5\n');
  await page.getByRole('button', { name: 'Preview the pasted rows' }).click();
  await expect(page.getByText(/Preview of the pasted rows: 1 valid row/)).toBeVisible();
  // Saving with rows still waiting in the preview is refused, with the reason.
  await page.getByRole('button', { name: 'Save and validate' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'waiting in the preview' })).toBeVisible();
  await page.getByRole('button', { name: 'Add 1 row' }).click();

  const header = 'label,Re_D,expected:Nu_D,rel,why,source_kind,citation,locator\n';
  await page.getByLabel('CSV file of check cases').setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from(`${header}bad,1e4,30,1e-9,arithmetic,published,a handbook,\n`) });
  const preview = page.getByRole('region', { name: 'Preview of the rows to add' });
  await expect(preview.getByText('source: "locator" is required here')).toBeVisible();
  await expect(page.getByRole('button', { name: /^Add \d+ row/ })).toBeDisabled();
  await checkScreen(page, 'author-csv-preview-errors');
  await page.getByRole('button', { name: 'Discard' }).click();
  // The last expected value is wrong: 0.3 √1e5 = 94.868…, not 95.
  await page.getByLabel('CSV file of check cases').setInputFiles({ name: 'cases.csv', mimeType: 'text/csv', buffer: Buffer.from(`${header}high,1e5,95,1e-9,arithmetic,transcription,arithmetic of 0.3 Re^0.5,\n`) });
  await page.getByRole('button', { name: 'Add 1 row' }).click();
  await page.getByRole('button', { name: 'Save and validate' }).click();
  await expect(page.getByText('Saved; validation found problems')).toBeVisible();
  const report = page.getByRole('region', { name: 'Validation report' });
  await expect(report.getByText(/computed 94\.86\d+ differs from expected 95/).first()).toBeVisible();
  await expect(report.getByText('Check cases reproduced: 2 of 3.')).toBeVisible();
  await checkScreen(page, 'author-failing-case');

  await enter(page, 'high expected Nu_D', '94.8x');
  await expect(page.getByText('Not a number (use e.g. 2.5e4)')).toBeVisible();
  await enter(page, 'high expected Nu_D', '94.86832980505137');
  await page.getByRole('button', { name: 'Save and validate' }).click();
  await expect(page.getByText('Saved; validation passed')).toBeVisible();
  await page.getByRole('tab', { name: 'JSON' }).click();
  await expect(page.getByTestId('json-editor')).toBeVisible();
  await expect(page.getByText('Ctrl').first()).toBeVisible();
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page).toHaveURL(new RegExp(`/correlations/${slug}/versions/1`));
  await expect(page.getByText('in review').first()).toBeVisible();
  await checkScreen(page, 'author-submitted');
  expect(outside).toEqual([]);
});

test('an approver reads what changed in the trade\'s terms, signs with the password, and returns a first version with a comment', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'approver');
  await page.goto('/review');
  await checkScreen(page, 'approver-queue');
  const row = page.getByRole('row', { name: /brightwater-louvre-pressure-loss/ });
  await row.getByRole('link', { name: 'Review' }).click();
  // The definition itself comes first: equations, inputs and outputs with units, validity ranges, references.
  const underReview = page.getByRole('region', { name: 'The definition under review' });
  await expect(underReview.getByText('800 ≤ Re_h ≤ 12000')).toBeVisible();
  await expect(underReview.getByRole('region', { name: 'References' })).toContainText('BTS-TR-2026-014');
  // What changed: the formula before and after, the changed check cases; the raw lines behind a disclosure.
  const diff = page.getByTestId('domain-diff');
  await expect(diff.getByRole('heading', { name: 'Formulas that changed' })).toBeVisible();
  await expect(diff.getByText('Check cases: 0 added, 0 removed, 3 changed')).toBeVisible();
  await expect(page.getByRole('table', { name: 'Definition differences' })).toBeHidden();
  await diff.getByText('The raw definition, line by line').click();
  await expect(page.getByRole('table', { name: 'Definition differences' }).getByText('"expression": "2.1 * (1/sigma - 1)^2 + 38 / Re_h^0.5"')).toBeVisible();
  // 2.1 against 1.9 in the leading term: the difference varies across the range and is said in words.
  await expect(page.getByTestId('largest-difference')).toContainText(/Version 2 differs from version 1 by \+\d/);
  await page.getByText('The numbers behind the chart').first().click();
  await checkScreen(page, 'approver-review-louvre');

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
  await checkScreen(page, 'approver-sign-off-filled');
  await signOff.getByRole('button', { name: 'Approve and sign' }).click();
  await expect(page).toHaveURL(/\/correlations\/brightwater-louvre-pressure-loss\/versions\/2/);
  // The page shows the new state at once, with a confirmation; no "in review" left over.
  await expect(page.getByRole('status').filter({ hasText: 'is approved with your signature' })).toBeVisible();
  await expect(page.getByText('not approved for design use')).toHaveCount(0);
  await expect(page.getByRole('link', { name: 'Review this version' })).toHaveCount(0);

  // A first version: nothing to compare with, so the review page says so and the definition is the whole story.
  await page.goto(`/review/${slug}/1`);
  await expect(page.getByText('This is the first version to be approved: there is nothing to compare with.')).toBeVisible();
  await expect(page.getByRole('region', { name: 'The definition under review' }).getByRole('region', { name: 'Equations' })).toBeVisible();
  await checkScreen(page, 'approver-review-first-version');
  const form = page.getByRole('form', { name: 'Sign-off' });
  await form.getByRole('button', { name: 'Return to the author' }).click();
  await expect(form.getByText('Say what the author should change')).toBeVisible();
  await form.getByLabel('Comment (required when returning)').fill('Give the source of the 0.3 coefficient with its table number.');
  await form.getByRole('button', { name: 'Return to the author' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'went back to its author' })).toBeVisible();
  expect(outside).toEqual([]);
});

test('the author finds the reviewer\'s comment first and starts a new version to address it', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'author');
  await page.goto('/author');
  const row = page.getByRole('row', { name: new RegExp(slug) });
  await expect(row).toContainText('Returned by Maren Holt');
  await expect(row).toContainText('Give the source of the 0.3 coefficient');
  await checkScreen(page, 'author-returned-list');
  await row.getByRole('link', { name: 'Journey duct correlation' }).click();
  await expect(page.getByRole('note').filter({ hasText: 'Returned to its author' })).toContainText('Give the source of the 0.3 coefficient');
  await checkScreen(page, 'author-returned-version');
  await page.getByRole('button', { name: 'Start a new version from v1' }).click();
  await expect(page).toHaveURL(new RegExp(`/author/${slug}/2`));
  await page.getByLabel('reference 1 locator').fill('table 1');
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page).toHaveURL(new RegExp(`/correlations/${slug}/versions/2`));
  expect(outside).toEqual([]);
});

test('the approver approves the new version, then withdraws it with a reason and the password', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'approver');
  await page.goto(`/review/${slug}/2`);
  const answer = page.getByRole('region', { name: 'Answer to the return' });
  await expect(answer).toContainText('Give the source of the 0.3 coefficient');
  await expect(answer.getByTestId('domain-diff')).toContainText('table 1');
  await checkScreen(page, 'approver-review-resubmission');
  const form = page.getByRole('form', { name: 'Sign-off' });
  await form.getByLabel(/Waiver/).fill('Journey fixture: an invented law with no outside evidence.');
  await form.getByLabel('Your password, to sign').fill(DEMO_PASSWORD);
  await form.getByRole('button', { name: 'Approve and sign' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'is approved with your signature' })).toBeVisible();
  await page.getByRole('button', { name: 'Withdraw…' }).click();
  await expect(page.getByTestId('version-uses')).toBeVisible();
  await page.getByLabel(/Reason for withdrawal/).fill('The coefficient has no traceable source.');
  await page.getByRole('button', { name: 'Withdraw version 2' }).click();
  await expect(page.getByText('Required to sign')).toBeVisible();
  await checkScreen(page, 'approver-withdraw-form');
  await page.getByLabel('Your password, to sign the withdrawal').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Withdraw version 2' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'is withdrawn with your signature' })).toBeVisible();
  await expect(page.getByRole('alert').filter({ hasText: 'Withdrawn' })).toBeVisible();
  expect(outside).toEqual([]);
});

test('an engineer evaluates: bad input clears the old result, an out-of-range result is marked, results in other units', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'engineer');
  await page.goto('/library');
  await page.getByRole('searchbox').fill('colebrook');
  await page.getByRole('link', { name: /Colebrook/ }).click();
  const panel = page.getByRole('complementary', { name: 'Evaluate' });
  await panel.getByRole('button', { name: 'Evaluate' }).click();
  await expect(panel.getByText('Inside the published validity ranges.')).toBeVisible();
  await panel.getByRole('textbox', { name: /^Re_D/ }).fill('abc');
  await panel.getByRole('button', { name: 'Evaluate' }).click();
  await expect(panel.getByText('Enter a number, e.g. 2.5e4')).toBeVisible();
  await expect(panel.getByTestId('evaluation-result')).toHaveCount(0);
  await expect(panel.getByRole('textbox', { name: /^Re_D/ })).toHaveValue('abc');
  await panel.getByRole('textbox', { name: /^Re_D/ }).fill('1000');
  await panel.getByRole('textbox', { name: /^eps_D/ }).fill('0.001');
  await panel.getByRole('button', { name: 'Evaluate' }).click();
  await expect(panel.getByText(/Extrapolated: an input is outside the published validity range/)).toBeVisible();
  await expect(panel.getByText('Re_D = 1000 is below the minimum 4000').first()).toBeVisible();
  // A warning is not an error: the field is described by it, not marked invalid.
  await expect(panel.getByRole('textbox', { name: /^Re_D/ })).toHaveAttribute('aria-invalid', 'false');
  await expect(panel.getByRole('textbox', { name: /^Re_D/ })).toHaveAttribute('aria-describedby', /warn/);
  await expect(panel.getByTestId('out-f')).toHaveText(/ \*$/);
  await expect(page.getByRole('note').first()).toContainText('Engineering estimate');
  await checkScreen(page, 'engineer-evaluate-warning');
  // Keyboard: the snippet tabs follow the arrow keys.
  await page.getByRole('tab', { name: 'curl' }).focus();
  await page.keyboard.press('ArrowRight');
  await expect(page.getByRole('tab', { name: 'Python' })).toHaveAttribute('aria-selected', 'true');
  await expect(page.getByRole('region', { name: 'Use from a script' })).toContainText('import os, requests');

  // Unit picker: 15 °C converts on the server to 288.15 K; U.S. Standard Atmosphere 1976 gives μ = 1.7894e-5 Pa s at sea level.
  await page.goto('/correlations/air-viscosity-sutherland');
  const air = page.getByRole('complementary', { name: 'Evaluate' });
  await air.getByLabel('T unit', { exact: true }).selectOption('degC');
  await air.getByRole('textbox', { name: /^T —/ }).fill('15');
  await air.getByRole('button', { name: 'Evaluate' }).click();
  await expect(air.getByTestId('out-mu')).toHaveText(/^1\.789\d*e-5$/);
  // Results in another unit: 1 mPa s = 1e-3 Pa s (SI prefixes, common practice).
  await air.getByLabel('mu result unit', { exact: true }).selectOption('mPa s');
  await air.getByRole('button', { name: 'Evaluate' }).click();
  await expect(air.getByTestId('out-mu')).toHaveText(/^0\.01789\d*$/);
  await expect(air.getByTestId('evaluation-result')).toContainText('mPa s');
  // The plot keeps to the asked range, offers its scales, and has its numbers in a table.
  const plot = page.getByRole('region', { name: 'Plot' });
  await plot.getByLabel(/^to/).fill('1000');
  await plot.getByRole('button', { name: 'Redraw' }).click();
  await expect(plot.getByRole('group', { name: 'Axis scales' })).toBeVisible();
  await plot.getByText('The numbers behind the chart').click();
  await expect(plot.locator('table')).toContainText('1000');
  await checkScreen(page, 'engineer-evaluate-units-plot');
  expect(outside).toEqual([]);
});

test('an engineer compares cylinder correlations, each dashed outside its own range, differences only where both are valid', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'engineer');
  await page.goto('/compare');
  await page.getByLabel('Situation').selectOption('cylinder in cross-flow');
  await page.getByLabel(/Churchill–Bernstein/).check();
  await page.getByLabel(/Hilpert/).check();
  await page.getByRole('button', { name: 'Plot' }).click();
  await expect(page.getByText(/where both are valid/).first()).toBeVisible();
  await checkScreen(page, 'engineer-compare');
  expect(outside).toEqual([]);
});

test('an admin manages tokens and roles with confirmations, and filters the audit trail', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'admin');
  const name = `nightly sizing run ${Date.now()}`;
  await page.goto('/admin/tokens');
  const form = page.getByRole('form', { name: 'Create an API token' });
  await form.getByRole('button', { name: 'Create token' }).click();
  await expect(form.getByText('Give the token a name')).toBeVisible();
  await form.getByLabel('Token name').fill(name);
  await form.getByLabel('Expires in (days)').fill('30');
  await form.getByRole('button', { name: 'Create token' }).click();
  await expect(page.getByTestId('new-token')).toHaveText(/^crl_/);
  await expect(page.getByRole('button', { name: 'Copy the new token' })).toBeVisible();
  await expect(page.getByRole('cell', { name, exact: true })).toBeVisible();
  await page.getByRole('button', { name: `Revoke the token ${name}` }).click();
  await checkScreen(page, 'admin-token-revoke-confirm');
  await page.getByRole('button', { name: `Revoke “${name}”` }).click();
  await expect(page.getByRole('status').filter({ hasText: 'is revoked' })).toBeVisible();

  await page.goto('/admin/users');
  await expect(page.getByLabel('admin@demo.example admin')).toBeDisabled();
  await page.getByLabel('integrator@demo.example author').check();
  await expect(page.getByRole('button', { name: /^Save / })).toBeVisible();
  await checkScreen(page, 'admin-users-staged');
  await page.getByRole('button', { name: 'Undo' }).click();
  await expect(page.getByLabel('integrator@demo.example author')).not.toBeChecked();

  await page.goto('/admin/audit');
  await expect(page.getByTestId('chain-status')).toContainText('Hash chain intact');
  await page.getByLabel('What').selectOption('version.');
  await page.getByRole('button', { name: 'Show' }).click();
  await expect(page.getByRole('link', { name: /brightwater-louvre-pressure-loss@2/ }).first()).toBeVisible();
  await checkScreen(page, 'admin-audit-filtered');
  expect(outside).toEqual([]);
});
