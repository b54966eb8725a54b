import type { Page } from '@playwright/test';
import { expect, openApp, test, VIEW_LABELS } from './fixtures.ts';
import { findNonRedColours, scanScreenshot } from './nightColours.ts';

const theme = (page: Page) => page.locator('html').getAttribute('data-theme');

test('Alt+N toggles night mode, returns to the daytime theme chosen, and the choice survives a reload', async ({ page }) => {
  await openApp(page);
  await page.getByRole('button', { name: 'Dark' }).click();
  expect(await theme(page)).toBe('dark');
  await page.keyboard.press('Alt+KeyN');
  expect(await theme(page)).toBe('night');
  await expect(page.getByRole('button', { name: 'Night (red)' })).toHaveAttribute('aria-pressed', 'true');
  await page.reload();
  await expect(page.getByRole('tabpanel')).toBeVisible();
  expect(await theme(page)).toBe('night');
  await page.keyboard.press('Alt+KeyN');
  expect(await theme(page)).toBe('dark');
});

test('night mode applies before the app script runs (no white flash on a reload)', async ({ page }) => {
  await openApp(page);
  await page.getByRole('button', { name: 'Night (red)' }).click();
  // Hold back the app bundle so that only the boot script and the HTML have run.
  await page.route('**/assets/index-*.js', async (route) => {
    await new Promise((resolve) => setTimeout(resolve, 1500));
    await route.continue();
  });
  await page.reload({ waitUntil: 'commit' });
  await page.waitForSelector('html[data-theme]', { state: 'attached' });
  await page.waitForTimeout(300);
  expect(await page.locator('#app').evaluate((element) => element.childElementCount)).toBe(0);
  expect(await theme(page)).toBe('night');
  await page.unroute('**/assets/index-*.js');
});

test('in night mode no element, focus ring, selection or scrollbar shows green or blue', async ({ page }) => {
  await page.setViewportSize({ width: 1100, height: 500 }); // short, so the page scrolls
  await openApp(page, './#/archive');
  // Control: the same checks find plenty in the day theme, so they can fail.
  expect((await findNonRedColours(page, 0)).length).toBeGreaterThan(10);
  expect((await scanScreenshot(page, await page.screenshot(), 4)).offending).toBeGreaterThan(1000);
  await page.keyboard.press('Alt+KeyN');
  for (const [index, label] of VIEW_LABELS.entries()) {
    await page.keyboard.press(`Alt+Digit${index + 1}`); // also leaves a focus ring on the tab
    await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText(label);
    await page.getByRole('tabpanel').evaluate(() => {
      const range = document.createRange();
      range.selectNodeContents(document.querySelector('[role="tabpanel"] h2') as Node);
      getSelection()?.removeAllRanges();
      getSelection()?.addRange(range);
    });
    expect(await findNonRedColours(page, 0), `computed colours in ${label}`).toEqual([]);
    const scan = await scanScreenshot(page, await page.screenshot({ fullPage: false }), 4);
    expect(scan.offending, `pixels with green or blue above 4/255 in ${label}`).toBe(0);
    expect(scan.maxRed, `brightest red in ${label}`).toBeLessThanOrEqual(0xd0);
  }
});
