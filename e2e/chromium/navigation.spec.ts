import { expect, openApp, test, VIEW_LABELS } from './fixtures.ts';

test('each view opens by mouse, shows its heading and puts its name in the address', async ({ page }) => {
  await openApp(page);
  for (const label of VIEW_LABELS) {
    await page.getByRole('tab', { name: new RegExp(`^${label}`) }).click();
    await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText(label);
    await expect(page.getByRole('tab', { name: new RegExp(`^${label}`) })).toHaveAttribute('aria-selected', 'true');
    expect(new URL(page.url()).hash).toBe(`#/${label.toLowerCase()}`);
  }
});

test('Alt+1 … Alt+5 open the views and a reload keeps the view', async ({ page }) => {
  await openApp(page);
  for (const [index, label] of VIEW_LABELS.entries()) {
    await page.keyboard.press(`Alt+Digit${index + 1}`);
    await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText(label);
  }
  await page.keyboard.press('Alt+Digit3');
  await page.reload();
  await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText('Solve');
});

test('arrow keys, Home and End move along the tab list with focus and selection', async ({ page }) => {
  await openApp(page, './#/archive');
  const archiveTab = page.getByRole('tab', { name: /^Archive/ });
  await archiveTab.focus();
  await page.keyboard.press('ArrowRight');
  await expect(page.getByRole('tab', { name: /^Solve/ })).toBeFocused();
  await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText('Solve');
  await page.keyboard.press('End');
  await expect(page.getByRole('tab', { name: /^Exchange/ })).toBeFocused();
  await page.keyboard.press('ArrowRight'); // wraps round
  await expect(page.getByRole('tab', { name: /^Tonight/ })).toBeFocused();
  await page.keyboard.press('ArrowLeft');
  await expect(page.getByRole('tab', { name: /^Exchange/ })).toBeFocused();
  await page.keyboard.press('Home');
  await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText('Tonight');
  // Only the selected tab is in the Tab order (roving tabindex).
  await expect(page.locator('[role="tab"][tabindex="0"]')).toHaveCount(1);
});

test('the skip link is the first Tab stop and moves focus to the view', async ({ page }) => {
  await openApp(page, './#/signatures');
  await page.keyboard.press('Tab');
  const skip = page.getByRole('link', { name: 'Skip to the current view' });
  await expect(skip).toBeFocused();
  await expect(skip).toBeInViewport();
  await page.keyboard.press('Enter');
  await expect(page.getByRole('tabpanel')).toBeFocused();
  expect(new URL(page.url()).hash).toBe('#/signatures');
});

test('an unknown address shows Tonight and corrects the address', async ({ page }) => {
  await openApp(page, './#/no-such-view');
  await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText('Tonight');
  expect(new URL(page.url()).hash).toBe('#/tonight');
});

test('every button and text field has an accessible name', async ({ page }) => {
  await openApp(page);
  for (const label of VIEW_LABELS) {
    await page.getByRole('tab', { name: new RegExp(`^${label}`) }).click();
    const unnamed = await page.evaluate(() =>
      Array.from(document.querySelectorAll('button, input, select, textarea'))
        .filter((element) => {
          const labelled = element.getAttribute('aria-label') || element.getAttribute('aria-labelledby');
          const input = element as HTMLInputElement;
          const hasLabel = input.labels !== null && input.labels !== undefined && input.labels.length > 0;
          return !labelled && !hasLabel && (element.textContent ?? '').trim() === '';
        })
        .map((element) => element.outerHTML.slice(0, 80)),
    );
    expect(unnamed, `unnamed controls in ${label}`).toEqual([]);
  }
});
