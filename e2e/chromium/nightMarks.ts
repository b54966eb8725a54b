import type { Locator, Page } from '@playwright/test';

// The Archive's nights overview paints every night on a canvas and offers one focusable night,
// the cursor (a button named "Night of DATE, N transits with INSTRUMENT, …"), moved by the keys.

/** The overview's one focusable night. */
export const nightCursor = (page: Page): Locator => page.locator('figure.overview button.cursor');

/** How many nights the overview lays out (its data-night-count). */
export async function overviewNightCount(page: Page): Promise<number> {
  return Number(await page.locator('figure.overview').getAttribute('data-night-count'));
}

/**
 * Puts the cursor on the night at `index` (date order, then instrument) by keyboard as a user
 * would: Home, then Page Down (100), Arrow Down (10) and Arrow Right (1); leaves it focused.
 */
export async function moveCursorTo(page: Page, index: number): Promise<Locator> {
  const cursor = nightCursor(page);
  await cursor.focus();
  await page.keyboard.press('Home');
  for (let k = 0; k < Math.floor(index / 100); k++) await page.keyboard.press('PageDown');
  for (let k = 0; k < Math.floor((index % 100) / 10); k++) await page.keyboard.press('ArrowDown');
  for (let k = 0; k < index % 10; k++) await page.keyboard.press('ArrowRight');
  return cursor;
}

/** One night as the cursor names it: its record id and its accessible name. */
export interface NightMarkName {
  readonly id: string;
  readonly label: string;
}

/**
 * Every night's name in keyboard order, read by walking the cursor from Home to End with the
 * arrow keys (dispatched in the page, so that a thousand nights take a second, not a minute).
 */
export async function allNightNames(page: Page): Promise<NightMarkName[]> {
  await nightCursor(page).focus();
  return page.evaluate(async () => {
    const cursor = () => document.querySelector('figure.overview button.cursor') as HTMLButtonElement;
    const press = async (key: string) => {
      cursor().dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true }));
      await new Promise((resolve) => setTimeout(resolve, 0));
    };
    await press('Home');
    const names: { id: string; label: string }[] = [];
    for (;;) {
      names.push({ id: cursor().dataset.nightId ?? '', label: cursor().getAttribute('aria-label') ?? '' });
      const before = cursor().dataset.index;
      await press('ArrowRight');
      if (cursor().dataset.index === before) return names;
    }
  });
}
