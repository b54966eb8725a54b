import { test as base, expect, type Page } from '@playwright/test';

/**
 * A page that fails its test on any console error or uncaught exception — in particular a
 * Content-Security-Policy refusal, which Chromium reports as a console error.
 */
export const test = base.extend<{ page: Page }>({
  page: async ({ page }, use) => {
    const problems: string[] = [];
    page.on('console', (message) => {
      if (message.type() === 'error') problems.push(`console error: ${message.text()}`);
    });
    page.on('pageerror', (error) => problems.push(`uncaught: ${error.message}`));
    await use(page);
    expect(problems, 'the page reported errors').toEqual([]);
  },
});

export { expect };

export const VIEW_LABELS = ['Tonight', 'Archive', 'Solve', 'Signatures', 'Exchange'] as const;

/**
 * The address with `no-demo` added to its query, so the app opens an empty archive instead of
 * restoring the demo on first start (the demo's own spec opens without it).
 */
export function withoutDemo(path: string): string {
  const [beforeHash, hash = ''] = path.split('#');
  const joined = beforeHash.includes('?') ? `${beforeHash}&no-demo` : `${beforeHash}?no-demo`;
  return hash === '' && !path.includes('#') ? joined : `${joined}#${hash}`;
}

/** Loads the app on an empty archive and waits until it is open and a view is showing. */
export async function openApp(page: Page, path = './'): Promise<void> {
  await page.goto(withoutDemo(path));
  await expect(page.getByRole('tabpanel')).toBeVisible();
  await expect(page.getByText('Opening the archive…')).toHaveCount(0);
}
