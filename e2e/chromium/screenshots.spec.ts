import { expect, openApp, test, VIEW_LABELS } from './fixtures.ts';

// Saves every view in each theme for a person to look at (e2e-output/screenshots/, not committed).
for (const themeLabel of ['Day', 'Dark', 'Night (red)'] as const) {
  test(`screenshots of every view in the ${themeLabel} theme`, async ({ page }) => {
    await page.setViewportSize({ width: 1280, height: 800 });
    await openApp(page, './#/archive');
    await page.getByRole('button', { name: themeLabel }).click();
    // Give the Archive and Solve views something to show.
    await page.getByLabel('Name').fill('Ridge pier');
    await page.getByLabel('Latitude (°, north +)').fill('46.5');
    await page.getByLabel('Longitude (°, east +)').fill('7.25');
    await page.getByLabel('Height (m)').fill('1020');
    await page.getByRole('button', { name: 'Save site' }).click();
    await page.getByLabel('Latitude (°, north +)').fill('95');
    await page.getByRole('button', { name: 'Save site' }).click();
    const slug = themeLabel.split(' ')[0].toLowerCase();
    for (const [index, label] of VIEW_LABELS.entries()) {
      await page.keyboard.press(`Alt+Digit${index + 1}`);
      await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText(label);
      if (label === 'Solve') {
        await page.getByLabel('Stars').fill('200000');
        await page.getByRole('button', { name: 'Run check' }).click();
        await expect(page.getByTestId('selftest-status')).toHaveAttribute('data-phase', 'finished');
      }
      await page.screenshot({ path: `e2e-output/screenshots/${slug}-${index + 1}-${label.toLowerCase()}.png`, fullPage: true });
    }
  });
}
