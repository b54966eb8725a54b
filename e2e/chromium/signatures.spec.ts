import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from '@playwright/test';
import { expect, openApp, test } from './fixtures.ts';
import { findNonRedColours, scanScreenshot } from './nightColours.ts';

/** A real solve: `simulate --seed 3 --years 3 --stars 10` then `solve --json --residuals` through the bin. */
function solveResults(): Record<string, unknown> {
  const dir = mkdtempSync(join(tmpdir(), 'signatures-e2e-'));
  try {
    const run = (args: string[]) => {
      const result = spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
      if (result.status !== 0) throw new Error(`meridian-ledger ${args.join(' ')} failed: ${result.stderr}`);
      return result.stdout;
    };
    run(['simulate', '--seed', '3', '--years', '3', '--stars', '10', '--out', join(dir, 'archive')]);
    return JSON.parse(run(['solve', join(dir, 'archive'), '--json', '--residuals'])) as Record<string, unknown>;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const results = solveResults();
const starCount = (results.stars as unknown[]).length;
const residualCount = (results.residuals as unknown[]).length;
const nightCount = (results.instrumentSeries as unknown[]).length;
const parameterCount = (results.correlation as { names: unknown[] }).names.length;

/** Writes the solve into the `reductions` table of the open archive (schema v2) as the Solve view saves it. */
async function seedReduction(page: Page): Promise<void> {
  await page.evaluate(async (saved) => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const request = indexedDB.open('meridian-ledger-archive');
      request.onsuccess = () => resolve(request.result);
      request.onerror = () => reject(request.error);
    });
    await new Promise<void>((resolve, reject) => {
      const transaction = db.transaction('reductions', 'readwrite');
      const now = '2026-11-30T21:00:00.000Z';
      transaction.objectStore('reductions').put({
        id: 'reduction-seed-3', label: 'Seed 3, three years', createdUtc: now, updatedUtc: now, modelConfiguration: {},
        inputFingerprint: 'seed-3', codeVersion: 'e2e', results: saved, residuals: [],
      });
      transaction.oncomplete = () => resolve();
      transaction.onerror = () => reject(transaction.error);
    });
    db.close();
  }, results);
}

async function openSignatures(page: Page): Promise<void> {
  await page.setViewportSize({ width: 1400, height: 900 });
  await openApp(page, './#/archive');
  await seedReduction(page);
  await page.keyboard.press('Alt+Digit4');
  await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText('Signatures');
  await expect(page.getByLabel('Saved reduction (newest first)')).toContainText('Seed 3, three years');
}

test('every plot of a seeded reduction renders the expected number of marks', async ({ page }) => {
  await openSignatures(page);
  await expect(page.getByTestId('plot-annual-dial')).toHaveAttribute('data-points', String(starCount));
  await expect(page.getByTestId('plot-annual-dial')).toHaveAttribute('data-lines', '2'); // the axes through the origin
  await expect(page.getByTestId('plot-residuals-time')).toHaveAttribute('data-points', String(residualCount));
  await expect(page.getByTestId('plot-residuals-season')).toHaveAttribute('data-points', String(residualCount));
  await expect(page.getByTestId('plot-common-mode-time')).toHaveAttribute('data-points', String(nightCount));
  await expect(page.getByTestId('plot-common-mode-temperature')).toHaveAttribute('data-points', String(nightCount));
  await expect(page.getByTestId('plot-parallax-ellipses')).toHaveAttribute('data-lines', String(starCount));
  await expect(page.getByTestId('plot-periodogram')).toHaveAttribute('data-lines', '1');
  await expect(page.getByTestId('plot-periodogram')).toContainText(/annual peak/);
  await expect(page.getByTestId('plot-correlation')).toHaveAttribute('data-cells', String(parameterCount ** 2));
  await expect(page.getByTestId('plot-residual-periodogram')).toHaveAttribute('data-lines', '1');
  await expect(page.getByTestId('plot-residual-periodogram')).toContainText(/annual peak/);
  // Zooming in time (the wheel over the plot) leaves fewer residuals in view; Reset zoom brings them back.
  const timePlot = page.getByTestId('plot-residuals-time');
  await timePlot.scrollIntoViewIfNeeded();
  const stageBox = await timePlot.getByRole('slider').boundingBox();
  if (stageBox === null) throw new Error('the residual plot has no box');
  await page.mouse.move(stageBox.x + stageBox.width / 2, stageBox.y + stageBox.height / 2);
  for (let i = 0; i < 5; i++) await page.mouse.wheel(0, -300);
  await expect.poll(async () => Number(await timePlot.getAttribute('data-points'))).toBeLessThan(residualCount);
  await timePlot.getByRole('button', { name: 'Reset zoom' }).click();
  await expect(timePlot).toHaveAttribute('data-points', String(residualCount));
  // One star only: its own residuals.
  await page.getByLabel('Residuals of').selectOption('ML-001');
  const own = (results.residuals as { starId: string }[]).filter((r) => r.starId === 'ML-001').length;
  await expect(page.getByTestId('plot-residuals-time')).toHaveAttribute('data-points', String(own));
  // The heat map reads by keyboard too: focus, then the arrow keys move between cells.
  const names = (results.correlation as { names: string[]; matrix: number[][] });
  const heat = page.getByTestId('plot-correlation');
  await heat.getByRole('slider').focus();
  await page.keyboard.press('ArrowRight');
  await page.keyboard.press('ArrowRight');
  await expect(heat).toContainText(`${names.names[0]} × ${names.names[1]}: ${names.matrix[0][1].toFixed(3)}`);
});

test('hovering a residual identifies the observation and clicking opens its night in the Archive', async ({ page }) => {
  await openSignatures(page);
  await page.getByLabel('Residuals of').selectOption('ML-001');
  const first = (results.residuals as { starId: string; nightId: string }[]).find((r) => r.starId === 'ML-001');
  if (first === undefined) throw new Error('the seeded solve has no residual of ML-001');
  // Keyboard: focus the plot, step to the first point.
  const stage = page.getByTestId('plot-residuals-time').getByRole('slider');
  await stage.focus();
  await page.keyboard.press('ArrowRight');
  await expect(page.getByTestId('readout-residuals-time')).toContainText(`ML-001 · ${first.nightId}`);
  // Pointer: sweep the plot until a point is under the mouse.
  const box = await stage.boundingBox();
  if (box === null) throw new Error('the residual plot has no box');
  let found = false;
  for (let x = box.x + 75; x < box.x + box.width - 20 && !found; x += 3) {
    await page.mouse.move(x, box.y + box.height / 2 - 40 + ((x * 7) % 80));
    found = /ML-001 · night-/.test((await page.getByTestId('readout-residuals-time').textContent()) ?? '');
  }
  for (let y = box.y + 15; y < box.y + box.height - 45 && !found; y += 2) {
    for (let x = box.x + 75; x < box.x + box.width - 20 && !found; x += 12) {
      await page.mouse.move(x, y);
      found = /ML-001 · night-/.test((await page.getByTestId('readout-residuals-time').textContent()) ?? '');
    }
  }
  expect(found, 'hovering shows an observation').toBe(true);
  const label = (await page.getByTestId('readout-residuals-time').textContent()) ?? '';
  const night = /(night-[\d-]+)/.exec(label)?.[1];
  await page.mouse.down();
  await page.mouse.up();
  await expect(page).toHaveURL(new RegExp(`#/archive\\?night=${night}`));
  await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText('Archive');
});

test('Export SVG downloads a file containing the plot', async ({ page }) => {
  await openSignatures(page);
  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Export Annual signal of each star: parallax phase against aberration phase as SVG' }).click();
  const file = await (await download).path();
  const text = readFileSync(file, 'utf8');
  expect(text).toContain('<svg');
  expect(text.match(/<circle /g)?.length).toBe(starCount);
  const heat = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Export the correlation matrix as PNG' }).click();
  expect((await heat).suggestedFilename()).toBe('correlation-matrix.png');
});

test('the Signatures view in the night theme shows only reds, canvas included; screenshots day and night', async ({ page }) => {
  await openSignatures(page);
  await page.getByRole('button', { name: 'Day' }).click();
  await page.screenshot({ path: 'e2e-output/screenshots/signatures-day.png', fullPage: true });
  await page.getByRole('button', { name: 'Night (red)' }).click();
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'night');
  await page.mouse.move(0, 0);
  expect(await findNonRedColours(page, 0)).toEqual([]);
  const png = await page.screenshot({ path: 'e2e-output/screenshots/signatures-night.png', fullPage: true });
  const scan = await scanScreenshot(page, png, 4);
  expect(scan.offending, 'pixels with green or blue above 4/255').toBe(0);
  expect(scan.maxRed).toBeLessThanOrEqual(0xd0);
});
