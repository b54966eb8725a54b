import { expect, test, VIEW_LABELS } from './fixtures.ts';
import { findNonRedColours } from './nightColours.ts';
import { moveCursorTo } from './nightMarks.ts';

// Saves every view in each theme for a person to look at (e2e-output/screenshots/, not committed),
// with the demo archive (an invented observatory: one site, a transit instrument and a zenith camera, 32 stars) so
// that each view has something to show, a night open in the Archive and a refused site entry.
// Tonight is shown at a fixed evening so the programme is the same on every run.
const EVENING = new Date('2026-12-01T17:00:00Z');

for (const themeLabel of ['Day', 'Dark', 'Night (red)'] as const) {
  test(`screenshots of every view in the ${themeLabel} theme, with the demo archive`, async ({ page }) => {
    test.setTimeout(90_000);
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.clock.install({ time: EVENING });
    await page.goto('./#/archive');
    await expect(page.getByRole('heading', { name: 'Nights (920)' })).toBeVisible({ timeout: 30_000 });
    await page.getByRole('button', { name: themeLabel }).click();
    // A night open, and a site entry refused with its reason (nothing is saved: the demo keeps one site).
    await moveCursorTo(page, 300);
    await page.keyboard.press('Enter');
    await expect(page.getByRole('heading', { name: /^Night of \d{4}-\d{2}-\d{2}/ })).toBeVisible();
    await page.getByLabel('Name').fill('Ridge pier');
    await page.getByLabel('Latitude (°, north +)').fill('95');
    await page.getByRole('button', { name: 'Save site' }).click();
    await expect(page.getByRole('heading', { name: 'Sites (1)' })).toBeVisible();
    const slug = themeLabel.split(' ')[0].toLowerCase();
    for (const [index, label] of VIEW_LABELS.entries()) {
      await page.keyboard.press(`Alt+Digit${index + 1}`);
      await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText(label);
      if (label === 'Tonight') await expect.poll(() => page.getByTestId('programme').locator('tbody tr').count(), { timeout: 30_000 }).toBeGreaterThan(20);
      if (label === 'Solve') {
        await page.getByLabel('Stars').fill('200000');
        await page.getByRole('button', { name: 'Run check' }).click();
        await expect(page.getByTestId('selftest-status')).toHaveAttribute('data-phase', 'finished');
      }
      if (label === 'Exchange') await expect(page.getByTestId('archive-counts')).toContainText('32 stars · 920 nights · 7558 transits');
      await page.screenshot({ path: `e2e-output/screenshots/${slug}-${index + 1}-${label.toLowerCase()}.png`, fullPage: true });
      if (themeLabel === 'Night (red)') expect(await findNonRedColours(page, 0), `colours with green or blue in ${label}`).toEqual([]);
    }
  });
}
