import type { Page } from '@playwright/test';
import { expect, test } from './fixtures.ts';
import { findNonRedColours } from './nightColours.ts';

// Opens WITH the demo archive (invented observatory: 658 nights, 5599 transits, 24 stars).
async function openArchiveWithDemo(page: Page): Promise<void> {
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.goto('./#/archive');
  await expect(page.getByRole('heading', { name: 'Nights (658)' })).toBeVisible({ timeout: 30_000 });
}

const marks = (page: Page) => page.getByRole('button', { name: /^Night of \d{4}-\d{2}-\d{2}, \d+ transits$/ });

test('the overview shows one mark per demo night and opens a night by keyboard and by click', async ({ page }) => {
  await openArchiveWithDemo(page);
  await expect(marks(page)).toHaveCount(658);
  await expect(page.getByText('Colour: transits in the night')).toBeVisible();

  // Keyboard: the first mark is in the tab order; ArrowRight moves to the second night; Enter opens it.
  await marks(page).first().focus();
  await page.keyboard.press('ArrowRight');
  const second = await marks(page).nth(1).getAttribute('aria-label');
  await expect(marks(page).nth(1)).toBeFocused();
  await page.keyboard.press('Enter');
  const date = /Night of (\S+),/.exec(second ?? '')?.[1] ?? 'no date';
  await expect(page.getByRole('heading', { name: new RegExp(`^Night of ${date}`) })).toBeVisible();
  const count = Number(/(\d+) transits$/.exec(second ?? '')?.[1]);
  await expect(page.getByText(`${count} transits, in time order`)).toBeVisible();
  await expect(page.locator('section[aria-labelledby="night-heading"] tbody tr')).toHaveCount(count);

  // Click: a later night.
  const target = marks(page).nth(400);
  const label = await target.getAttribute('aria-label');
  await target.click();
  const clickedDate = /Night of (\S+),/.exec(label ?? '')?.[1] ?? 'no date';
  await expect(page.getByRole('heading', { name: new RegExp(`^Night of ${clickedDate}`) })).toBeVisible();
});

test('reject a transit and undo it; the audit trail names the editor', async ({ page }) => {
  await openArchiveWithDemo(page);
  await marks(page).nth(10).click();
  const firstReject = page.getByRole('button', { name: /^Reject / }).first();
  const name = (await firstReject.getAttribute('aria-label')) ?? '';
  // Without a name the edit is refused with a message.
  await firstReject.click();
  await expect(page.getByRole('status').filter({ hasText: 'Not changed: no editor name' })).toBeVisible();

  await page.getByLabel('Edits recorded as').fill('R. Vance');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Edits are now recorded as R. Vance.' })).toBeVisible();
  await page.getByRole('button', { name }).click();
  const restoreName = name.replace(/^Reject/, 'Restore');
  await expect(page.getByRole('button', { name: restoreName })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: /^Rejected the upper transit|^Rejected the lower transit/ })).toBeVisible();

  await page.getByRole('button', { name: /^Undo: rejected/ }).click();
  await expect(page.getByRole('button', { name })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Undo', exact: true })).toBeDisabled();
  await page.getByText(/^Audit trail/).click();
  const trail = page.getByRole('list', { name: 'Audit trail, newest first' });
  await expect(trail.getByRole('listitem')).toHaveCount(2);
  await expect(trail.getByRole('listitem').first()).toContainText('R. Vance · undid: rejected');

  // The name and the trail are stored in the archive: they survive a reload.
  await page.reload();
  await expect(page.getByLabel('Edits recorded as')).toHaveValue('R. Vance', { timeout: 30_000 });
  await page.getByText(/^Audit trail/).click();
  await expect(trail.getByRole('listitem')).toHaveCount(2);
});

test('add an instrument event (validated) and see it in the list; star list shows counts', async ({ page }) => {
  await openArchiveWithDemo(page);
  await page.getByLabel('Edits recorded as').fill('R. Vance');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  const caption = page.getByText(/^\d+ events \(segment boundaries/);
  const before = Number(/^(\d+)/.exec((await caption.textContent()) ?? '')?.[1]);

  await page.getByLabel('Event date (UTC)').fill('2025-02-30');
  await page.getByRole('button', { name: 'Add event' }).click();
  await expect(page.getByText('2025-02-30 is not a calendar date')).toBeVisible();

  await page.getByLabel('Event date (UTC)').fill('2025-03-14');
  await page.getByLabel('Event time (UTC)').fill('09:30');
  await page.getByLabel('What was done').selectOption('recollimation');
  await page.getByLabel('Event note').fill('collimator re-set after pier work');
  await page.getByRole('button', { name: 'Add event' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'segment boundary there' })).toBeVisible();
  await expect(caption).toHaveText(`${before + 1} events (segment boundaries of the drift model)`);
  await expect(page.getByRole('row', { name: /2025-03-14 09:30 Recollimation collimator re-set/ })).toBeVisible();

  const counts = page.getByTestId('star-transit-count');
  await expect(counts).toHaveCount(24);
  const total = (await counts.allTextContents()).map(Number).reduce((sum, value) => sum + value, 0);
  expect(total).toBe(5599);
});

test('screenshots of the Archive with the demo, day and night; night shows no green or blue', async ({ page }) => {
  await openArchiveWithDemo(page);
  await marks(page).nth(200).click();
  await page.screenshot({ path: 'e2e-output/screenshots/day-archive-demo.png', fullPage: true });
  await page.getByRole('button', { name: 'Night (red)' }).click();
  await marks(page).nth(201).focus();
  await page.screenshot({ path: 'e2e-output/screenshots/night-archive-demo.png', fullPage: true });
  expect(await findNonRedColours(page, 0)).toEqual([]);
});

test('an address #/archive?night=ID (a plot click-through) opens that night', async ({ page }) => {
  await page.goto('./#/archive?night=night-2020-11-03');
  await expect(page.getByRole('heading', { name: /^Night of 2020-11-03/ })).toBeVisible({ timeout: 20_000 });
  await page.evaluate(() => (window.location.hash = '#/archive?night=night-2022-01-12'));
  await expect(page.getByRole('heading', { name: /^Night of 2022-01-12/ })).toBeVisible();
});
