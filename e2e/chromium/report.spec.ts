import type { Page } from '@playwright/test';
import { expect, test } from './fixtures.ts';

// The printable solve report in Chromium: solve the demo archive (invented observatory)
// with the default model, press "Print report…" in the Solve results and in the Signatures view,
// and read what the print frame holds. The frame's window.print is replaced before the app runs,
// so nothing is printed; the stand-in keeps the frame's document for the checks.
async function capturePrintFrames(page: Page): Promise<void> {
  await page.addInitScript(() => {
    const own = Object.getOwnPropertyDescriptor(HTMLIFrameElement.prototype, 'contentWindow');
    if (own?.get === undefined) throw new Error('HTMLIFrameElement.contentWindow has no getter to wrap');
    const getter = own.get;
    Object.defineProperty(HTMLIFrameElement.prototype, 'contentWindow', {
      configurable: true,
      get(this: HTMLIFrameElement) {
        const frameWindow = getter.call(this) as Window | null;
        if (frameWindow !== null) {
          frameWindow.print = () => {
            const printed = (window as unknown as { printedReports?: unknown[] });
            printed.printedReports = [...(printed.printedReports ?? []), {
              html: frameWindow.document.documentElement.outerHTML,
              css: [...frameWindow.document.adoptedStyleSheets].flatMap((sheet) => [...sheet.cssRules].map((rule) => rule.cssText)).join('\n'),
            }];
          };
        }
        return frameWindow;
      },
    });
  });
}

const printed = (page: Page) => page.evaluate(() => (window as unknown as { printedReports?: { html: string; css: string }[] }).printedReports ?? []);

test('Print report… puts the whole report into the print frame, from the Solve results and from Signatures', async ({ page }) => {
  test.setTimeout(240_000);
  await capturePrintFrames(page);
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.goto('./#/solve');
  await page.getByLabel('Label for this solve').fill('Report <check> & co', { timeout: 30_000 });
  await page.getByRole('button', { name: 'Run solve', exact: true }).click();
  await expect(page.getByTestId('solve-status')).toHaveAttribute('data-phase', 'finished', { timeout: 180_000 });
  const starRows = await page.getByTestId('solve-star-table').locator('tbody tr').count();
  expect(starRows).toBeGreaterThanOrEqual(24); // the demo's programme

  await page.getByTestId('solve-results').getByRole('button', { name: 'Print report…' }).click();
  await expect(page.getByTestId('solve-results').getByRole('status')).toContainText('Report sent to print', { timeout: 30_000 });
  const [fromSolve] = await printed(page);
  expect(fromSolve, 'the print frame was printed').toBeDefined();
  expect(fromSolve.html).toContain('<h1>Joint solve: Report &lt;check&gt; &amp; co</h1>');
  expect((fromSolve.html.match(/<tr data-star-id=/g) ?? []).length).toBe(starRows);
  expect(fromSolve.html).toContain('<code>deltaKappa</code>');
  expect(fromSolve.html).toMatch(/Δκ \(″\): correction to the constant of aberration/);
  expect((fromSolve.html.match(/<svg /g) ?? []).length).toBeGreaterThanOrEqual(6);
  expect(fromSolve.html).not.toMatch(/<script|https?:\/\//i);
  // The print styles reached the frame through its adopted sheet (the app's CSP refuses <style>).
  expect(fromSolve.css).toMatch(/@page/);

  // Look at it: the report on its own page, as printed.
  const view = await page.context().newPage();
  await view.setContent(fromSolve.html.replace('</head>', `<style>${fromSolve.css}</style></head>`));
  await view.screenshot({ path: 'e2e-output/screenshots/solve-report.png', fullPage: true });
  await view.screenshot({ path: 'e2e-output/screenshots/solve-report-top.png', fullPage: true, clip: { x: 0, y: 0, width: 1280, height: 1600 } });
  await view.emulateMedia({ media: 'print' });
  await view.screenshot({ path: 'e2e-output/screenshots/solve-report-print-top.png', fullPage: true, clip: { x: 0, y: 1400, width: 1280, height: 1600 } });
  await view.close();

  // The same report from the Signatures view.
  await page.getByRole('tab', { name: 'Signatures' }).click();
  await expect(page.getByLabel('Saved reduction (newest first)')).toContainText('Report <check> & co');
  await page.getByRole('button', { name: 'Print report…' }).click();
  await expect.poll(async () => (await printed(page)).length, { timeout: 30_000 }).toBe(2);
  const fromSignatures = (await printed(page))[1];
  expect((fromSignatures.html.match(/<tr data-star-id=/g) ?? []).length).toBe(starRows);
  expect(fromSignatures.html).toContain('Joint solve: Report &lt;check&gt; &amp; co');
});
