import type { Locator, Page } from '@playwright/test';
import { expect, test } from './fixtures.ts';
import { findNonRedColours, scanScreenshot } from './nightColours.ts';

// Opens WITH the demo archive (an invented observatory: one site, one seven-wire transit
// instrument, 24 stars) at a fixed evening, so the programme and the next star are the same on
// every run; the clock keeps flowing from there so the countdown ticks.
const EVENING = new Date('2026-12-01T17:00:00Z');

/** Tonight at EVENING on a 1400 × 1000 window, once its programme lists the demo's stars; the programme's rows. */
async function openTonightAtEvening(page: Page): Promise<Locator> {
  await page.setViewportSize({ width: 1400, height: 1000 });
  await page.clock.install({ time: EVENING });
  await page.goto('./#/tonight');
  const rows = page.getByTestId('programme').locator('tbody tr');
  await expect.poll(() => rows.count(), { timeout: 30_000 }).toBeGreaterThan(20);
  return rows;
}

test('the Tonight view lists the programme in time order, logs a transit by keyboard, flags a wrong wire, and keeps both across a reload', async ({ page }) => {
  test.setTimeout(90_000);
  const rows = await openTonightAtEvening(page);

  const times = (await rows.evaluateAll((trs) => trs.map((tr) => Number(tr.getAttribute('data-utc-mjd')))));
  expect(times).toEqual([...times].sort((a, b) => a - b));
  const countdown = page.getByTestId('countdown');
  await expect(countdown).toHaveText(/^\d+:\d{2}:\d{2}$/);
  const before = await countdown.textContent();
  await expect(countdown).not.toHaveText(before ?? '', { timeout: 5000 });
  const next = page.getByTestId('next-transit');
  const firstStar = (await next.locator('strong').textContent()) ?? '';

  // Keyboard only: the star field left empty means the next star; Enter moves on, Enter on the reading logs.
  await page.getByLabel('Star id').focus();
  await page.keyboard.press('Enter');
  await expect(page.getByLabel(/^Wire times/)).toBeFocused();
  const expected = ((await page.getByTestId('expected-wires').textContent()) ?? '').split(' ');
  expect(expected.length).toBe(7);
  await page.keyboard.type(expected.join(' '));
  await page.keyboard.press('Enter');
  await expect(page.getByLabel(/^Zenith-distance reading/)).toBeFocused();
  const setAt = ((await page.locator('#log-reading-hint').textContent()) ?? '').replace('set at', '').trim();
  await page.keyboard.type(setAt);
  const omc = page.getByTestId('o-minus-c');
  await expect(omc).toHaveAttribute('data-flagged', 'false');
  const timeOmc = Number(/O−C time ([+−][\d.]+) s/.exec((await omc.textContent()) ?? '')?.[1].replace('−', '-'));
  expect(Math.abs(timeOmc)).toBeLessThan(0.05); // wire times typed to 0.1 s
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('log-status')).toContainText(`Logged ${firstStar}`);
  const logged = page.getByTestId('logged-transits').locator('tbody tr');
  await expect(logged).toHaveCount(1);
  await expect(logged.first()).toContainText(firstStar);

  // The next star: one wire entered against its neighbour (wire 2 gets wire 3's time).
  await expect(next.locator('strong')).not.toHaveText(firstStar);
  await expect(page.getByLabel(/^Wire times/)).toBeFocused();
  const secondExpected = ((await page.getByTestId('expected-wires').textContent()) ?? '').split(' ');
  const planted = [...secondExpected];
  planted[1] = secondExpected[2];
  await page.keyboard.type(planted.join(' '));
  await expect(omc).toHaveAttribute('data-flagged', 'true');
  await expect(page.getByTestId('probable-cause')).toContainText('neighbouring wire');

  // A refused entry says why at the field and is not coerced.
  await page.getByLabel('Star id').fill('ML-99');
  await expect(page.locator('#log-star-hint')).toHaveText('star "ML-99" is not in tonight\'s programme; pick one of the listed ids');
  await page.getByLabel('Star id').fill('');

  // Close and reopen: the logged transit is in the archive and the half-typed entry comes back.
  await page.reload();
  await expect(page.getByTestId('logged-transits').locator('tbody tr')).toHaveCount(1, { timeout: 30_000 });
  await expect(page.getByLabel(/^Wire times/)).toHaveValue(planted.join(' '));
  await expect(page.getByTestId('probable-cause')).toContainText('neighbouring wire');

  // Night mode: the filled view shows no green or blue.
  await page.keyboard.press('Alt+KeyN');
  await page.screenshot({ path: 'e2e-output/screenshots/night-tonight.png', fullPage: true });
  expect(await findNonRedColours(page, 0)).toEqual([]);
  const scan = await scanScreenshot(page, await page.screenshot({ fullPage: false }), 4);
  expect(scan.offending, 'pixels with green or blue above 4/255 in Tonight').toBe(0);
});

test('on a later launch Tonight shows the programme from the last session\'s copy while the archive is still opening, and entries wait for it', async ({ page }) => {
  test.setTimeout(90_000);
  const rows = await openTonightAtEvening(page);
  const shown = await rows.count();
  await expect(page.getByText(/^Tables: /)).not.toContainText('still opening');

  // The next launch: the archive's store takes 4 s to answer (as a million-transit archive may,
  // 1–3 s on 2 cores): openArchive's first IndexedDB call is held back that long.
  await page.addInitScript(() => {
    const original = IDBFactory.prototype.databases;
    IDBFactory.prototype.databases = function (this: IDBFactory) {
      return new Promise((resolve) => setTimeout(resolve, 4000)).then(() => original.call(this));
    };
  });
  await page.reload();
  await expect(page.getByText(/^Tables: .*the archive is still opening/)).toBeVisible({ timeout: 3_000 });
  await expect(rows).toHaveCount(shown);
  // A wrong star is refused at once from the copy; a transit typed now is written once the archive is open.
  await page.getByLabel('Star id').fill('ZZ-0');
  await expect(page.locator('#log-star-hint')).toContainText('is not in tonight\'s programme');
  await page.getByLabel('Star id').fill('');
  await page.getByLabel('Star id').press('Enter');
  await page.keyboard.type(((await page.getByTestId('expected-wires').textContent()) ?? '').trim());
  await page.keyboard.press('Enter');
  await page.keyboard.type(((await page.locator('#log-reading-hint').textContent()) ?? '').replace('set at', '').trim());
  await page.keyboard.press('Enter');
  await expect(page.getByText(/^Tables: .*the archive is still opening/)).toBeVisible(); // typed and accepted before the archive opened
  await expect(page.getByText(/^Logged \S+ and saved to the archive\.$/)).toBeVisible({ timeout: 15_000 });
  await expect(page.getByText(/^Tables: /)).not.toContainText('still opening');
  await expect(rows).toHaveCount(shown);
  await expect(page.getByTestId('logged-transits').locator('tbody tr')).toHaveCount(1);
});
