import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Page } from '@playwright/test';
import { expect, openApp, test, withoutDemo } from './fixtures.ts';
import { findNonRedColours } from './nightColours.ts';
import { CHROMIUM_ARGS, CHROMIUM_EXECUTABLE, WEB_PORT } from '../../playwright.config.ts';

// Invented scenario: no real site, instrument or star.
const SITE = JSON.stringify({
  formatVersion: 1,
  site: { id: 'quarry-hill', label: 'Quarry Hill pier (invented)', latitudeDeg: 51.2031, longitudeDeg: 9.4417, heightM: 288.5 },
  instruments: [{ id: 'qt-2', label: 'Quarry transit 2', kind: 'transit', zenithScale: { unit: 'turn', arcsecPerUnit: 48.77, sense: -1 },
    wireIntervalsS: [15.2, 0, -15.1], effectiveWavelengthUm: 0.6, clockId: 'clock-q', clockTimeScale: 'sidereal', events: [] }],
});
const STARS = 'id,label,raDeg,decDeg,epochJyear,parallaxMas\nQX-1,Invented one,84.12,22.44,2016.0,4.1\nQX-2,Invented two,130.5,61.25,2016.0,\nQX-3,Bad,400,10,2016.0,\n';

function transitLog(rows: number, star = 'QX-1'): string {
  const lines = ['starId,culmination,nightDate,instrumentId,wire1Utc,wire2Utc,wire3Utc,micrometerTurns'];
  for (let day = 0; day < rows; day++) {
    const iso = new Date(Date.UTC(2026, 0, 1 + day)).toISOString().slice(0, 10);
    lines.push(`${star},upper,${iso},qt-2,${iso}T21:07:10.10Z,${iso}T21:07:25.30Z,${iso}T21:07:40.40Z,12.5`);
  }
  return `${lines.join('\n')}\n`;
}

async function importFile(page: Page, name: string, text: string, expectValid?: number): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await page.getByRole('button', { name: 'Choose a file to import…' }).click();
  await (await chooser).setFiles({ name, mimeType: 'text/plain', buffer: Buffer.from(text) });
  const summary = page.getByTestId('import-summary');
  await expect(summary).toContainText(name);
  if (expectValid !== undefined) await expect(page.getByTestId('valid-count')).toHaveText(String(expectValid));
}

async function importValidRows(page: Page): Promise<void> {
  await page.getByRole('button', { name: /^Import (all|only the)/ }).click();
}

async function setUp(page: Page, path = './#/exchange'): Promise<void> {
  await openApp(page, path);
  await importFile(page, 'site.json', SITE, 1);
  await importValidRows(page);
  await expect(page.getByTestId('import-message')).toContainText('Imported site.json');
  await importFile(page, 'stars.csv', STARS, 2);
  await expect(page.getByTestId('rejected-count')).toHaveText('1');
  await expect(page.getByTestId('rejects-table')).toContainText('raDeg');
  await importValidRows(page);
  await expect(page.getByTestId('import-message')).toContainText('2 stars');
}

test('a site, a star list and a transit log are imported through the file input, with counts and rejects', async ({ page }) => {
  await setUp(page);
  await importFile(page, 'log.csv', `${transitLog(3)}QX-9,upper,2026-02-01,qt-2,2026-02-01T21:07:10Z,,,1\n`, 3);
  await expect(page.getByTestId('rejects-table')).toContainText("unknown star id 'QX-9'");
  await importValidRows(page);
  await expect(page.getByTestId('archive-counts')).toContainText('1 site · 1 instrument · 2 stars · 3 nights · 3 transits');
  // The same log again: every row is a duplicate and nothing is doubled.
  await importFile(page, 'log.csv', transitLog(3), 0);
  await expect(page.getByTestId('import-summary')).toContainText('3 already in the archive');
});

test('a quota error during an import shows what to do and leaves the earlier data unchanged', async ({ page }) => {
  await setUp(page, './?test-hooks&quota-on-transit-write=1#/exchange');
  await importFile(page, 'log.csv', transitLog(600), 600);
  await importValidRows(page);
  await expect(page.getByTestId('import-failure')).toContainText('QuotaExceededError');
  await expect(page.getByTestId('import-failure')).toContainText('The data already in the archive is unchanged');
  await page.reload();
  await expect(page.getByTestId('archive-counts')).toContainText('1 site · 1 instrument · 2 stars · 0 nights · 0 transits');
});

for (const chunksBeforeKill of [1, 4, 6]) {
  test(`an import killed with the browser after ${chunksBeforeKill} chunk(s) leaves none or all of the file's rows`, async () => {
    const profile = await mkdtemp(join(tmpdir(), 'meridian-exchange-'));
    const launch = () => chromium.launchPersistentContext(profile, { executablePath: CHROMIUM_EXECUTABLE, args: CHROMIUM_ARGS });
    const base = `http://127.0.0.1:${WEB_PORT}/`;
    try {
      const first = await launch();
      const page = first.pages()[0] ?? (await first.newPage());
      await setUp(page, `${base}?test-hooks&chunk-delay-ms=600&chunk-rows=500#/exchange`);
      await importFile(page, 'big.csv', transitLog(1500), 1500);
      await importValidRows(page);
      // 1500 nights + 1500 transits are staged in chunks of 500 rows.
      await expect(page.getByTestId('exchange-progress')).toContainText(`Writing rows: ${chunksBeforeKill * 500} of 3000`, { timeout: 20_000 });
      await first.close();
      const second = await launch();
      const again = second.pages()[0] ?? (await second.newPage());
      await again.goto(withoutDemo(`${base}#/exchange`));
      const counts = again.getByTestId('archive-counts');
      await expect(counts).toContainText('2 stars');
      const text = (await counts.textContent()) ?? '';
      expect(text).toMatch(/ (0|1500) transits/);
      expect(text).toMatch(/ (0|1500) nights/);
      await second.close();
    } finally {
      await rm(profile, { recursive: true, force: true });
    }
  });
}

for (const theme of ['Day', 'Night (red)'] as const) {
  test(`screenshot of the Exchange view in the ${theme} theme${theme === 'Day' ? '' : ', with only red colours'}`, async ({ page }) => {
    await page.setViewportSize({ width: 1280, height: 900 });
    await setUp(page);
    await page.getByRole('button', { name: theme }).click();
    await importFile(page, 'stars.csv', STARS, 2);
    const slug = theme === 'Day' ? 'day' : 'night';
    await page.screenshot({ path: `e2e-output/screenshots/exchange-${slug}.png`, fullPage: true });
    if (theme !== 'Day') expect(await findNonRedColours(page, 0)).toEqual([]);
  });
}
