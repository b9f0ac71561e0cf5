import { expect, test } from '@playwright/test';
import { guardOffline, signInAs } from './helpers';

test('an engineer asks which tube correlations apply, sees the ranked table, the broken ranges and the plot, then a calculation’s uncertainty budget', async ({ page }) => {
  const outside = guardOffline(page);
  await signInAs(page, 'engineer');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Which applies?' }).click();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Which correlation applies?');
  const form = page.getByRole('form', { name: 'Situation and point' });
  await form.getByLabel('Situation').selectOption('circular tube');
  // Bad input stays beside its field and nothing runs.
  await form.locator('#adv-Re_D').fill('lots');
  await form.getByRole('button', { name: 'Show what applies' }).click();
  await expect(form.getByText('Enter a number, e.g. 3e4')).toBeVisible();
  await form.locator('#adv-Re_D').fill('3000');
  await form.locator('#adv-Pr').fill('3');
  await form.locator('#adv-L_over_D').fill('60');
  await form.locator('#adv-mu_ratio').fill('1');
  await form.getByRole('button', { name: 'Show what applies' }).click();
  const table = page.getByRole('table', { name: 'Ranked correlations' });
  await expect(table.getByTestId('advice-status-pipe-turbulent-gnielinski')).toHaveText('inside its ranges');
  await expect(table.getByTestId('advice-status-pipe-turbulent-dittus-boelter-heating')).toHaveText('outside a range');
  await expect(table.getByTestId('advice-pipe-turbulent-dittus-boelter-heating')).toContainText('Re_D = 3000 is below 10000 (0.3× the bound)');
  await expect(page.getByRole('region', { name: 'Plot of the correlations' }).locator('svg').first()).toBeVisible();
  await page.screenshot({ path: 'test-results/journey-advisor-transition.png', fullPage: true });

  await form.locator('#adv-Re_D').fill('30000');
  await form.getByRole('button', { name: 'Show what applies' }).click();
  for (const slug of ['pipe-turbulent-dittus-boelter-heating', 'pipe-turbulent-sieder-tate', 'pipe-turbulent-petukhov', 'pipe-turbulent-gnielinski']) {
    await expect(table.getByTestId(`advice-status-${slug}`)).toHaveText('inside its ranges');
  }
  await expect(page.getByTestId('advice-spread')).toContainText('spread among those in range');
  await page.screenshot({ path: 'test-results/journey-advisor.png', fullPage: true });

  // A template run shows the band of each result and where it comes from.
  await page.goto('/templates/flat-plate-forced-convection-air');
  const inputs = page.getByRole('form', { name: 'Inputs' });
  for (const [s, v] of [['T_inf', '288.15'], ['T_s', '328.15'], ['p', '98000'], ['u_inf', '20'], ['L', '1.2'], ['W', '0.25']]) await inputs.locator(`#in-${s}`).fill(v);
  await inputs.getByRole('button', { name: 'Run the calculation' }).click();
  const budget = page.getByTestId('uncertainty-budget');
  await expect(budget.getByTestId('budget-band')).toContainText('±');
  await expect(budget.getByRole('table', { name: 'Budget by step' }).locator('tbody tr').first()).toContainText('flat-plate-mixed-average');
  await expect(budget.getByTestId('sensitivity-u_inf')).toBeVisible();
  await expect(page.getByTestId('result-band-q')).toContainText('±');
  await budget.scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-results/journey-uncertainty-budget.png', fullPage: true });
  // The choice step links to what the other correlations say at its inputs.
  await page.getByTestId('alternatives-nusselt-mixed').click();
  await expect(page).toHaveURL(/\/advisor\?like=flat-plate-mixed-average/);
  await page.getByRole('form', { name: 'Situation and point' }).getByRole('button', { name: 'Show what applies' }).click();
  await expect(page.getByRole('table', { name: 'Ranked correlations' }).getByTestId('advice-status-flat-plate-mixed-average')).toHaveText('inside its ranges');
  await page.screenshot({ path: 'test-results/journey-advisor-from-template.png', fullPage: true });
  expect(outside).toEqual([]);
});
