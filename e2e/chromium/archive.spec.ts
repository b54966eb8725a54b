import type { Page } from '@playwright/test';
import { expect, test } from './fixtures.ts';
import { findNonRedColours } from './nightColours.ts';

// Opens WITH the demo archive (invented observatory: 658 nights, 5599 transits, 24 stars).
async function openArchiveWithDemo(page: Page): Promise<void> {
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.goto('./#/archive');
  await expect(page.getByRole('heading', { name: 'Nights (658)' })).toBeVisible({ timeout: 30_000 });
}

// Each mark's name: "Night of DATE, N transits, <unit-weight error or why there is none>".
const marks = (page: Page) => page.getByRole('button', { name: /^Night of \d{4}-\d{2}-\d{2}, \d+ transits, / });

test('the overview shows one mark per demo night and opens a night by keyboard and by click', async ({ page }) => {
  await openArchiveWithDemo(page);
  await expect(marks(page)).toHaveCount(658);
  await expect(page.getByText(/^Colour: unit-weight error of the night/)).toBeVisible();

  // Keyboard: the first mark is in the tab order; ArrowRight moves to the second night; Enter opens it.
  await marks(page).first().focus();
  await page.keyboard.press('ArrowRight');
  const second = await marks(page).nth(1).getAttribute('aria-label');
  await expect(marks(page).nth(1)).toBeFocused();
  await page.keyboard.press('Enter');
  const date = /Night of (\S+),/.exec(second ?? '')?.[1] ?? 'no date';
  await expect(page.getByRole('heading', { name: new RegExp(`^Night of ${date}`) })).toBeVisible();
  const count = Number(/(\d+) transits,/.exec(second ?? '')?.[1]);
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

// A night with a planted blunder (assets/demo/demo-truth.json: ML-010 observed, written as ML-012).
const BLUNDER_NIGHT = 'night-2019-12-08';

test('the overview colours the demo nights by unit-weight error; a blunder night stands out; an edit reduces only its night', async ({ page }) => {
  test.setTimeout(300_000);
  await openArchiveWithDemo(page);
  // The first pass reduces every night in the worker, with progress the page stays usable during.
  await expect(page.getByText(/^Reducing nights for the overview/)).toBeVisible();
  await marks(page).nth(5).click();
  await expect(page.getByRole('heading', { name: /^Night of \d{4}-/ })).toBeVisible({ timeout: 5_000 });
  await expect(page.getByText('Reduced 658 nights; 0 unchanged from the last pass.')).toBeVisible({ timeout: 240_000 });
  const classes = await page.locator('g.mark').evaluateAll((gs) => gs.map((g) => g.getAttribute('data-uwe-class')));
  expect(classes).toHaveLength(658);
  const histogram = new Map<string, number>();
  for (const c of classes) histogram.set(String(c), (histogram.get(String(c)) ?? 0) + 1);
  const [commonest] = [...histogram].sort((a, b) => b[1] - a[1])[0];
  expect(histogram.size, `classes seen: ${JSON.stringify([...histogram])}`).toBeGreaterThanOrEqual(3);
  const blunder = page.locator(`g.mark[data-night-id="${BLUNDER_NIGHT}"]`);
  const blunderClass = await blunder.getAttribute('data-uwe-class');
  expect(blunderClass).not.toBe(commonest);
  expect(Number(blunderClass)).toBeGreaterThan(Number(commonest));
  await expect(blunder).toHaveAttribute('aria-label', /^Night of 2019-12-08, \d+ transits, unit-weight error \d+\.\d\d$/);
  for (const label of ['below 1.2', '1.2 to 2', '2 to 5', '5 and above', 'not reduced']) await expect(page.locator('figcaption.legend')).toContainText(label);

  // The night detail repeats it; day and night screenshots; the red theme shows no green or blue.
  await blunder.click();
  await expect(page.getByTestId('night-quality')).toContainText(/unit-weight error \d+\.\d\d \(right ascension/);
  await page.screenshot({ path: 'e2e-output/screenshots/day-archive-uwe.png', fullPage: true });
  await page.locator('figure.overview').screenshot({ path: 'e2e-output/screenshots/day-archive-uwe-overview.png' });
  await page.getByRole('button', { name: 'Night (red)' }).click();
  await marks(page).nth(201).focus();
  await page.screenshot({ path: 'e2e-output/screenshots/night-archive-uwe.png', fullPage: true });
  await page.locator('figure.overview').screenshot({ path: 'e2e-output/screenshots/night-archive-uwe-overview.png' });
  expect(await findNonRedColours(page, 0)).toEqual([]);
  await page.getByRole('button', { name: 'Day' }).click();

  // Back to transit counts and again, by keyboard.
  await page.getByRole('button', { name: 'Transit count', exact: true }).press('Enter');
  await expect(page.getByText('Colour: transits in the night')).toBeVisible();
  await expect(page.locator('g.mark rect.uwe')).toHaveCount(0);
  await page.getByRole('button', { name: 'Unit-weight error', exact: true }).press('Enter');
  await expect(page.locator('g.mark rect.uwe')).not.toHaveCount(0);

  // Rejecting a transit reduces that night only (the others come from the worker's cache).
  await page.getByLabel('Edits recorded as').fill('R. Vance');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await page.getByRole('button', { name: /^Reject / }).first().click();
  await expect(page.getByText('Reduced 1 night; 657 unchanged from the last pass.')).toBeVisible({ timeout: 60_000 });
  await expect(page.getByTestId('night-quality')).toContainText('1 rejected by hand');
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
