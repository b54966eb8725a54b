import type { Page } from '@playwright/test';
import { expect, openApp, test } from './fixtures.ts';
import { allNightNames, moveCursorTo } from './nightMarks.ts';

// Invented scenario: the Kestrel Fell pier and its transit instrument, two invented stars, and a
// transit log written by the observatory's own logger with headers of its own.
const SITE = JSON.stringify({
  formatVersion: 1,
  site: { id: 'kestrel-fell', label: 'Kestrel Fell pier (invented)', latitudeDeg: 54.6012, longitudeDeg: -2.9581, heightM: 402.0 },
  instruments: [{ id: 'kf-transit', label: 'Kestrel transit', kind: 'transit', zenithScale: { unit: 'turn', arcsecPerUnit: 51.3, sense: 1 },
    wireIntervalsS: [14.8, 0, -14.9], effectiveWavelengthUm: 0.58, clockId: 'kf-clock', clockTimeScale: 'sidereal', events: [] }],
});
const STARS = 'id,label,raDeg,decDeg,epochJyear,parallaxMas\nKF-7,Kestrel seven,101.25,48.5,2016.0,3.2\nKF-9,Kestrel nine,140.75,60.1,2016.0,\n';

/** Their column → the field to pick; the zenith column's field carries the unit (micrometer turns). */
const THEIR_COLUMNS: readonly (readonly [string, string])[] = [
  ['Target', 'starId'],
  ['Side', 'culmination'],
  ['Obs date', 'nightDate'],
  ['T west (UTC)', 'wire1Utc'],
  ['T centre (UTC)', 'wire2Utc'],
  ['T east (UTC)', 'wire3Utc'],
  ['Screw [rev]', 'micrometerTurns'],
  ['Air °C', 'temperatureC'],
  ['Seeing', ''],
  ['Remarks', 'note'],
];

function theirLog(firstDay: number, days: number, star: string, screwRev: number): string {
  const lines = [THEIR_COLUMNS.map(([name]) => `"${name}"`).join(',')];
  for (let day = firstDay; day < firstDay + days; day++) {
    const date = new Date(Date.UTC(2026, 2, day)).toISOString().slice(0, 10);
    lines.push(`${star},upper,${date},${date}T22:14:05.20Z,${date}T22:14:20.05Z,${date}T22:14:34.95Z,${screwRev.toFixed(3)},3.5,3,logged on day ${day} ✓`);
  }
  return `${lines.join('\n')}\n`;
}

async function chooseFile(page: Page, name: string, text: string): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await page.getByRole('button', { name: 'Choose a file to import…' }).click();
  await (await chooser).setFiles({ name, mimeType: 'text/plain', buffer: Buffer.from(text) });
}

async function importPlainFile(page: Page, name: string, text: string, what: string): Promise<void> {
  await chooseFile(page, name, text);
  await expect(page.getByTestId('import-summary')).toContainText(name);
  await page.getByRole('button', { name: /^Import all/ }).click();
  await expect(page.getByTestId('import-message')).toContainText(what);
}

const fieldSelect = (page: Page, column: string) => page.getByLabel(`Field for column ${column}`, { exact: true });

/** Picks each field by typing its name into the focused list (type-ahead), moving on with Tab. */
async function mapByKeyboard(page: Page): Promise<void> {
  await fieldSelect(page, THEIR_COLUMNS[0][0]).focus();
  for (const [index, [column, field]] of THEIR_COLUMNS.entries()) {
    await expect(fieldSelect(page, column)).toBeFocused();
    // "ignore this column" is the list's first entry; Home selects it.
    if (field === '') await page.keyboard.press('Home');
    else await page.keyboard.type(field, { delay: 20 });
    await expect(fieldSelect(page, column)).toHaveValue(field);
    if (index < THEIR_COLUMNS.length - 1) await page.keyboard.press('Tab');
  }
}

test('a transit log with other headers is mapped by keyboard, imported, and its mapping offered for the next file', async ({ page }) => {
  await openApp(page, './#/exchange');
  await importPlainFile(page, 'kestrel-site.json', SITE, 'Imported kestrel-site.json');
  await importPlainFile(page, 'kestrel-stars.csv', STARS, '2 stars');

  await chooseFile(page, 'logger-march.csv', theirLog(2, 3, 'KF-7', 12.25));
  const step = page.getByTestId('column-mapping');
  await expect(step).toContainText('Columns of logger-march.csv');
  // No column of theirs is one of our names, so nothing is preselected.
  for (const [column] of THEIR_COLUMNS) await expect(fieldSelect(page, column)).toHaveValue('');
  await mapByKeyboard(page);
  await page.keyboard.press('Tab');
  await expect(page.getByRole('button', { name: 'Check the file with this mapping' })).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('valid-count')).toHaveText('3');
  await expect(page.getByTestId('rejected-count')).toHaveText('0');
  await page.getByRole('button', { name: 'Import all 3 rows' }).focus();
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('import-message')).toContainText('Imported logger-march.csv');
  await expect(page.getByTestId('archive-counts')).toContainText('1 site · 1 instrument · 2 stars · 3 nights · 3 transits');

  // The rows in the Archive: star, culmination, the micrometer reading in turns, the note.
  await page.goto('./?no-demo#/archive');
  await expect(page.locator('figure.overview')).toHaveAttribute('data-night-count', '3', { timeout: 30_000 });
  const index = (await allNightNames(page)).findIndex((n) => n.label.startsWith('Night of 2026-03-03, 1 transits'));
  expect(index, 'the night of 2026-03-03 among the marks').toBeGreaterThanOrEqual(0);
  await moveCursorTo(page, index);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { name: /^Night of 2026-03-03 · Kestrel transit/ })).toBeVisible();
  const row = page.locator('section[aria-labelledby="night-heading"] tbody tr');
  await expect(row).toHaveCount(1);
  await expect(row.getByRole('rowheader')).toHaveText('Kestrel seven');
  await expect(row).toContainText('upper');
  await expect(row).toContainText('12.250');
  await expect(row.getByRole('textbox')).toHaveValue('logged on day 3 ✓');

  // A second file with the same headers: the saved mapping is offered as it was chosen.
  await page.goto('./?no-demo#/exchange');
  await chooseFile(page, 'logger-april.csv', theirLog(32, 2, 'KF-9', 8.5));
  await expect(page.getByTestId('column-mapping')).toContainText('Columns of logger-april.csv');
  for (const [column, field] of THEIR_COLUMNS) await expect(fieldSelect(page, column)).toHaveValue(field);
  await page.getByRole('button', { name: 'Check the file with this mapping' }).click();
  await expect(page.getByTestId('valid-count')).toHaveText('2');
  await page.getByRole('button', { name: 'Import all 2 rows' }).click();
  await expect(page.getByTestId('archive-counts')).toContainText('1 site · 1 instrument · 2 stars · 5 nights · 5 transits');
});
