import { expect, test } from '@playwright/test';
import { guardOffline, signInAs } from './helpers';

test.describe.configure({ mode: 'serial' });

test('an engineer runs the flat-plate template in °C and atm, sees a warning at its step, saves, runs 50 cases from CSV and opens the report', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'engineer');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Templates' }).click();
  await page.getByRole('link', { name: 'Flat plate in parallel flow of air: average heat transfer' }).click();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Flat plate in parallel flow of air: average heat transfer');

  const form = page.getByRole('form', { name: 'Inputs' });
  const set = async (symbol: string, value: string, unit?: string) => {
    await form.locator(`#in-${symbol}`).fill(value);
    if (unit) await form.getByLabel(`${symbol} unit`).selectOption(unit);
  };
  // Bad input is named beside its field and nothing runs.
  await set('u_inf', 'fast');
  await form.getByRole('button', { name: 'Run the calculation' }).click();
  await expect(form.getByText('"fast" is not a number')).toBeVisible();
  // A hot plate: the film temperature leaves the air table, and the warning appears at that step.
  await set('T_inf', '1100', 'degC');
  await set('T_s', '1500', 'degC');
  await set('p', '1', 'atm');
  await set('u_inf', '3');
  await set('L', '0.4');
  await set('W', '0.3');
  await form.getByRole('button', { name: 'Run the calculation' }).click();
  const airStep = page.getByTestId('step-air-properties');
  await expect(airStep.getByRole('alert')).toContainText('T = 1573.15 is above the maximum 1500');
  await expect(page.getByTestId('step-reynolds').getByRole('alert')).toHaveCount(0);
  await expect(page.getByText(/1 range warning/)).toBeVisible();
  await page.screenshot({ path: 'test-results/journey-calc-warning-at-step.png', fullPage: true });

  // The design point: 35 °C air, 50 °C panel, 1 atm.
  await set('T_inf', '35', 'degC');
  await set('T_s', '50', 'degC');
  await form.getByRole('button', { name: 'Run the calculation' }).click();
  await expect(page.getByText('every step inside its validity range')).toBeVisible();
  await expect(page.getByTestId('picked-nusselt')).toHaveText('laminar');
  const save = page.getByRole('form', { name: 'Save' });
  await save.getByLabel('Title').fill('Journey: cabinet door at 35 °C');
  await save.getByRole('button', { name: 'Save calculation' }).click();
  await expect(page).toHaveURL(/\/calculations\/\d+\?saved=1/);
  await expect(page.getByText(/Saved as revision 1/)).toBeVisible();
  await page.screenshot({ path: 'test-results/journey-calc-saved.png', fullPage: true });
  const saved = page.url();

  // 50 cases from a CSV file: wind speed from 0.5 to 25 m/s, crossing transition.
  await page.goto('/templates/flat-plate-forced-convection-air');
  await page.getByRole('tab', { name: 'Table of cases' }).click();
  const csv = ['T_inf [degC],T_s [degC],p [atm],u_inf,L,W', ...Array.from({ length: 50 }, (_, k) => `35,50,1,${(0.5 + k * 0.5).toFixed(1)},1.2,0.6`)].join('\n');
  await page.getByTestId('cases-file').setInputFiles({ name: 'wind.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
  await expect(page.getByLabel('Cases as CSV')).toHaveValue(/T_inf \[degC\]/);
  await page.getByRole('button', { name: 'Run all cases' }).click();
  const results = page.getByRole('region', { name: 'Results of the cases' });
  await expect(results.getByRole('heading', { name: 'Results of 50 cases' })).toBeVisible();
  await expect(results.getByRole('table', { name: 'Case results' }).locator('tbody tr')).toHaveCount(50);
  await expect(results.getByRole('cell', { name: /nusselt: mixed/ }).first()).toBeVisible();
  const download = page.waitForEvent('download');
  await results.getByRole('button', { name: 'Download results (CSV)' }).click();
  expect((await download).suggestedFilename()).toBe('flat-plate-forced-convection-air-cases.csv');
  await page.screenshot({ path: 'test-results/journey-calc-parametric.png', fullPage: true });

  // The report of the saved calculation, with versions, hashes and the caution.
  await page.goto(saved);
  await page.getByRole('link', { name: 'Report (print or save as PDF)' }).click();
  await expect(page.getByRole('heading', { name: 'Journey: cabinet door at 35 °C' })).toBeVisible();
  await expect(page.getByRole('note')).toContainText('Engineering estimate');
  await expect(page.getByRole('cell', { name: /flat-plate-laminar-average/ }).first()).toBeVisible();
  await page.emulateMedia({ media: 'print' });
  await page.screenshot({ path: 'test-results/journey-calc-report.png', fullPage: true });
  expect(outside).toEqual([]);
});

test('the demo project shows the calculation flagged by the withdrawn louvre version', async ({ page }) => {
  await signInAs(page, 'engineer');
  await page.goto('/projects');
  await page.getByRole('link', { name: 'TW-7 outdoor telecom cabinet: thermal design' }).click();
  await expect(page.getByText(/used a version that has since been withdrawn/)).toBeVisible();
  await expect(page.getByTestId('calc-flag')).toContainText('brightwater-louvre-pressure-loss v1');
  await page.getByRole('link', { name: 'TW-7 intake louvre pressure drop at the design air flow' }).click();
  await expect(page.getByTestId('withdrawn-flag')).toContainText('out of calibration');
  await page.getByRole('button', { name: 'Re-run against the latest approved versions' }).click();
  await expect(page.getByTestId('rerun')).toContainText('No approved version any more: brightwater-louvre-pressure-loss');
  await page.screenshot({ path: 'test-results/journey-calc-flagged.png', fullPage: true });
});
