import { expect, openApp, test } from './fixtures.ts';

test('the worker check reports progress and finishes with the expected share near the ecliptic', async ({ page }) => {
  await openApp(page, './#/solve');
  await page.getByLabel('Stars').fill('3000000');
  await page.getByRole('button', { name: 'Run check' }).click();
  const status = page.getByTestId('selftest-status');
  await expect(status).toHaveAttribute('data-phase', 'running');
  await expect(status).toHaveAttribute('data-phase', 'finished', { timeout: 30_000 });
  await expect(status).toContainText('Done: 3,000,000 stars');
  // sin 5° = 0.0872 of a uniform sky lies within 5° of the ecliptic: about 261 500 of 3 000 000.
  const near = Number((await status.textContent())?.match(/stars, ([\d,]+) within/)?.[1].replace(/,/g, ''));
  expect(Math.abs(near / 3_000_000 - Math.sin((5 * Math.PI) / 180))).toBeLessThan(0.001);
  await expect(page.getByRole('progressbar', { name: 'Worker check progress' })).toHaveAttribute('value', '100');
});

test('the worker check can be cancelled while it runs, and run again', async ({ page }) => {
  await openApp(page, './#/solve');
  await page.getByLabel('Stars').fill('500000000');
  await page.getByRole('button', { name: 'Run check' }).click();
  const status = page.getByTestId('selftest-status');
  await expect(status).toContainText(/Running: [1-9][\d,]* of 500,000,000/);
  await page.getByRole('button', { name: 'Cancel' }).click();
  await expect(status).toHaveAttribute('data-phase', 'cancelled', { timeout: 10_000 });
  const done = Number((await status.textContent())?.match(/after ([\d,]+) of/)?.[1].replace(/,/g, ''));
  expect(done).toBeGreaterThan(0);
  expect(done).toBeLessThan(500_000_000);
  await expect(page.getByRole('button', { name: 'Cancel' })).toBeDisabled();
  await page.getByLabel('Stars').fill('40000');
  await page.getByRole('button', { name: 'Run check' }).click();
  await expect(status).toHaveAttribute('data-phase', 'finished');
});
