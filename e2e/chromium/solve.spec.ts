import { expect, test } from './fixtures.ts';
import { findNonRedColours, scanScreenshot } from './nightColours.ts';

// The Solve view on the demo archive (an invented observatory, 32 stars, 7558 transits): a solve
// with the default model runs in the worker with progress, can be cancelled, is saved, survives a
// reload, and two saved solves can be compared star by star.
test('the Solve view runs, cancels, saves and compares joint solves of the demo archive', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.goto('./#/exchange');
  await expect(page.getByTestId('archive-counts')).toContainText('32 stars · 920 nights · 7558 transits', { timeout: 30_000 });
  await page.getByRole('tab', { name: 'Solve' }).click();
  const status = page.getByTestId('solve-status');
  const run = page.getByRole('button', { name: 'Run solve', exact: true });

  // A run cancelled during the nightly reductions saves nothing.
  await run.click();
  await expect(status).toHaveAttribute('data-phase', 'running');
  await expect(page.getByRole('progressbar', { name: 'Solve progress' })).toBeVisible();
  await page.getByRole('button', { name: 'Cancel solve', exact: true }).click();
  await expect(status).toHaveAttribute('data-phase', 'cancelled', { timeout: 30_000 });
  await expect(status).toContainText('nothing was saved');
  await expect(page.getByText('No solve saved yet.')).toBeVisible();

  // A full run with the default model.
  await page.getByLabel('Label for this solve').fill('Defaults');
  await run.click();
  await expect(status).toHaveAttribute('data-phase', 'running');
  await expect(status).toContainText(/Solving: \d+ %/);
  await expect(status).toHaveAttribute('data-phase', 'finished', { timeout: 120_000 });
  const results = page.getByTestId('solve-results');
  await expect(results.getByRole('heading', { name: 'Defaults' })).toBeVisible();
  await expect(page.getByTestId('solve-star-table').locator('tbody tr')).toHaveCount(32);
  await expect(page.getByTestId('solve-global')).toContainText(/Δκ\/σ = [−-]?\d+\.\d/);
  await expect(page.getByTestId('saved-solves').locator('tbody tr')).toHaveCount(1);
  await page.screenshot({ path: 'e2e-output/screenshots/day-3-solve-results.png', fullPage: true });

  // It survives a reload.
  await page.reload();
  await expect(page.getByTestId('saved-solves').getByRole('rowheader', { name: 'Defaults' })).toBeVisible({ timeout: 20_000 });
  await page.getByRole('button', { name: 'Show Defaults', exact: true }).click();
  await expect(page.getByTestId('solve-inputs-state')).toHaveAttribute('data-state', 'unchanged', { timeout: 30_000 });
  await expect(page.getByTestId('solve-star-table').locator('tbody tr')).toHaveCount(32);

  // A second solve with catalogue priors and the temperature term left out (free by default), then the two side by side.
  await page.getByLabel('Label for this solve').fill('Priors, no temperature');
  await page.getByLabel('Catalogue precision as priors').check();
  await expect(page.getByLabel('Catalogue position, σ (mas)')).toHaveValue('5');
  await page.getByLabel('Temperature coefficients').selectOption('absent');
  await run.click();
  await expect(status).toHaveAttribute('data-phase', 'finished', { timeout: 120_000 });
  await expect(page.getByTestId('saved-solves').locator('tbody tr')).toHaveCount(2);
  // Newest first: option 1 is the second solve, option 2 "Defaults" (option 0 is the prompt).
  await page.getByLabel('First solve').selectOption({ index: 2 });
  await page.getByLabel('Second solve').selectOption({ index: 1 });
  await expect(page.getByTestId('compare-summary')).toContainText('Both solves read the same archive files.');
  await expect(page.getByTestId('compare-summary')).toContainText('Temperature coefficients: "free" → "absent"');
  await expect(page.getByTestId('compare-summary')).toContainText('Catalogue precision: none → 5 mas and 0.7 mas/yr');
  await expect(page.getByTestId('compare-table').locator('tbody tr')).toHaveCount(32);

  // Night theme, for a person to look at.
  await page.getByRole('button', { name: 'Night (red)' }).click();
  // The palette check of theme.spec.ts, here over the results, the saved list and the comparison.
  expect(await findNonRedColours(page, 0), 'computed colours in the Solve view with results').toEqual([]);
  expect((await scanScreenshot(page, await page.screenshot({ fullPage: true }), 4)).offending, 'pixels with green or blue').toBe(0);
  await page.screenshot({ path: 'e2e-output/screenshots/night-3-solve-compare.png', fullPage: true });
  await page.getByTestId('compare-table').screenshot({ path: 'e2e-output/screenshots/night-3-solve-compare-table.png' });
  await page.getByTestId('solve-star-table').screenshot({ path: 'e2e-output/screenshots/night-3-solve-star-table.png' });
});
