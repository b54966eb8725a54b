import { expect, test } from './fixtures.ts';

// The demo archive (assets/demo/, an invented observatory made by the simulator) is restored on
// the very first start of an empty archive and can be removed in one action.
test('a first start restores the demo archive; removing it takes one action and it stays removed', async ({ page }) => {
  await page.goto('./#/exchange');
  const counts = page.getByTestId('archive-counts');
  await expect(counts).toContainText('1 site · 2 instruments · 32 stars · 920 nights · 7558 transits', { timeout: 20_000 });
  const panel = page.getByTestId('demo-panel');
  await expect(panel).toContainText('Bramblecote Hill Observatory (which does not exist)');
  await page.screenshot({ path: 'e2e-output/screenshots/day-exchange-demo.png', fullPage: true });

  await panel.getByRole('button', { name: 'Remove the demo archive…' }).click();
  await panel.getByRole('button', { name: 'Yes, remove the demo' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Removed the demo archive' })).toBeVisible();
  await expect(counts).toContainText('0 sites · 0 instruments · 0 stars · 0 nights · 0 transits');

  await page.reload();
  await expect(page.getByTestId('archive-counts')).toContainText('0 stars · 0 nights · 0 transits');
  await expect(page.getByTestId('demo-panel')).toHaveCount(0);
});
