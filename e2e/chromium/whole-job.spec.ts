import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gunzipSync } from 'node:zlib';
import type { Download, Page } from '@playwright/test';
import { expect, openApp, test } from './fixtures.ts';
import { moveCursorTo } from './nightMarks.ts';

// The whole job from an empty profile, as a user does it: import what the simulator wrote (an
// invented observatory, instrument and eight invented stars), look at the nights, log a new night
// by keyboard, solve, look at the signatures, export. One fresh browser context, serial steps.
// Screenshots of each view at each step go to e2e-output/screenshots/whole-job-*.png.

const SEED = '11';
const shots = 'e2e-output/screenshots';
// A fixed evening for Tonight (the programme depends on the clock): 16:00 UTC is after sunset at
// the simulated site (about 16° E, 49° N) in early December.
const EVENING = new Date('2026-12-01T16:00:00Z');

let folder = '';
let simulated = { nights: 0, transits: 0, stars: 0, transitFiles: [] as string[] };

function meridianLedger(args: string[]): string {
  const run = spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  if (run.status !== 0) throw new Error(`meridian-ledger ${args.join(' ')} failed (${run.status}): ${run.stderr}`);
  return run.stdout;
}

/** Data rows of a CSV file written by the simulator (LF line ends, header line, no quoted newlines). */
function csvRows(file: string): string[] {
  return readFileSync(file, 'utf8').split('\n').slice(1).filter((line) => line !== '');
}

test.beforeAll(() => {
  folder = mkdtempSync(join(tmpdir(), 'whole-job-'));
  meridianLedger(['simulate', '--seed', SEED, '--years', '2', '--stars', '8', '--out', join(folder, 'archive')]);
  const archive = join(folder, 'archive');
  const transitFiles = readdirSync(join(archive, 'transits')).filter((f) => f.endsWith('.csv')).sort().map((f) => join(archive, 'transits', f));
  // Nights without a transit are not created by the transit-log import, so count the nights the transits name.
  const nightDates = new Set(transitFiles.flatMap((f) => csvRows(f).map((line) => line.split(',')[3])));
  simulated = { nights: nightDates.size, transits: transitFiles.reduce((n, f) => n + csvRows(f).length, 0), stars: csvRows(join(archive, 'stars.csv')).length, transitFiles };
});

test.afterAll(() => {
  if (folder !== '') rmSync(folder, { recursive: true, force: true });
});

async function importFile(page: Page, file: string): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await page.getByRole('button', { name: 'Choose a file to import…' }).click();
  await (await chooser).setFiles(file);
  // The simulator's transit files carry archive-folder columns the general importer does not map.
  const mapping = page.getByTestId('column-mapping');
  const importButton = page.getByRole('button', { name: /^Import (all|only the)/ });
  await expect(mapping.or(importButton)).toBeVisible({ timeout: 20_000 });
  if (await mapping.isVisible()) await page.getByRole('button', { name: 'Check the file with this mapping' }).click();
  await expect(page.getByTestId('rejected-count')).toHaveText('0', { timeout: 20_000 });
  await importButton.click();
  const name = file.split('/').pop() ?? file;
  await expect(page.getByTestId('import-message')).toContainText(`Imported ${name}`, { timeout: 30_000 });
}

async function view(page: Page, index: number, label: string): Promise<void> {
  await page.keyboard.press(`Alt+Digit${index}`);
  await expect(page.getByRole('tabpanel').getByRole('heading', { level: 2 })).toHaveText(label);
}

const shoot = (page: Page, name: string) => page.screenshot({ path: `${shots}/whole-job-${name}.png`, fullPage: true });
const readDownload = async (download: Download) => readFileSync(await download.path());
const signedNumber = (text: string) => Number(text.replace('−', '-'));

test.describe.configure({ mode: 'serial' });

test('the whole job from an empty profile: import, archive, tonight, solve, signatures, export', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1400, height: 1000 });
  await page.clock.install({ time: EVENING });

  await test.step('import the site, the star list and the transit logs through Exchange', async () => {
    await openApp(page, './#/exchange');
    await expect(page.getByTestId('archive-counts')).toContainText('0 sites · 0 instruments · 0 stars · 0 nights · 0 transits');
    await shoot(page, '1-exchange-empty');
    await importFile(page, join(folder, 'archive', 'site.json'));
    await importFile(page, join(folder, 'archive', 'stars.csv'));
    for (const file of simulated.transitFiles) await importFile(page, file);
    await expect(page.getByTestId('archive-counts')).toContainText(
      `1 site · 1 instrument · ${simulated.stars} stars · ${simulated.nights} nights · ${simulated.transits} transits`);
    await shoot(page, '2-exchange-imported');
  });

  await test.step('see the nights in the Archive and open one night', async () => {
    await view(page, 2, 'Archive');
    await expect(page.getByRole('heading', { name: `Nights (${simulated.nights})` })).toBeVisible();
    await expect(page.locator('figure.overview')).toHaveAttribute('data-night-count', String(simulated.nights));
    const target = await moveCursorTo(page, Math.floor(simulated.nights / 2));
    const label = (await target.getAttribute('aria-label')) ?? '';
    const [, date, count] = /Night of (\S+), (\d+) transits/.exec(label) ?? [];
    await page.keyboard.press('Enter');
    await expect(page.getByRole('heading', { name: new RegExp(`^Night of ${date}`) })).toBeVisible();
    await expect(page.locator('section[aria-labelledby="night-heading"] tbody tr')).toHaveCount(Number(count));
    await shoot(page, '3-archive-night');
  });

  await test.step('in Tonight, pick the site and instrument and log a night by keyboard', async () => {
    await view(page, 1, 'Tonight');
    await page.getByRole('combobox', { name: /^Site/ }).selectOption({ index: 0 });
    await page.getByRole('combobox', { name: /^Instrument/ }).selectOption({ index: 0 });
    const rows = page.getByTestId('programme').locator('tbody tr');
    await expect.poll(() => rows.count(), { timeout: 30_000 }).toBeGreaterThan(0);
    await shoot(page, '4-tonight-programme');

    // Weather, keyboard only: focus the first field, then type, Tab, and Enter submits the form.
    await page.getByLabel('Temperature (°C)').focus();
    await page.keyboard.type('-3.5');
    await page.keyboard.press('Tab');
    await page.keyboard.type('941.2');
    await page.keyboard.press('Tab');
    await page.keyboard.type('81');
    await page.keyboard.press('Enter');
    await expect(page.getByText('Weather saved; the programme is recomputed with refraction.')).toBeVisible();

    // A clock comparison: clock − UTC = +1.25 s.
    await page.getByLabel('Clock − UTC (s)', { exact: true }).last().focus();
    await page.keyboard.type('1.25');
    await page.keyboard.press('Enter');
    await expect(page.getByText('Clock comparison saved; clock times now use it.')).toBeVisible();
    await expect(page.getByText('from tonight’s clock comparison')).toBeVisible();

    // The next programme star: Enter on the empty star field picks it.
    await page.getByLabel('Star id').focus();
    await page.keyboard.press('Enter');
    await expect(page.getByLabel(/^Wire times/)).toBeFocused();
    const star = (await page.getByTestId('next-transit').locator('strong').textContent()) ?? '';
    const expected = ((await page.getByTestId('expected-wires').textContent()) ?? '').split(' ');
    expect(expected.length, 'the simulated instrument has seven wires').toBe(7);
    // Every wire typed 0.5 s late: the time O−C shows +0.5 s as typed.
    const late = expected.map((hms) => {
      const [h, m, s] = hms.split(':').map(Number);
      const t = h * 3600 + m * 60 + s + 0.5;
      return `${String(Math.floor(t / 3600)).padStart(2, '0')}:${String(Math.floor((t % 3600) / 60)).padStart(2, '0')}:${(t % 60).toFixed(1).padStart(4, '0')}`;
    });
    await page.keyboard.type(late.join(' '));
    const omc = page.getByTestId('o-minus-c');
    await expect(omc).toContainText(/O−C time \+0\.[45]\d\d s/);
    const timeOmc = signedNumber(/O−C time ([+−][\d.]+) s/.exec((await omc.textContent()) ?? '')?.[1] ?? 'NaN');
    expect(Math.abs(timeOmc - 0.5), 'time O−C of wires typed 0.5 s late (typed to 0.1 s)').toBeLessThan(0.06);
    await page.keyboard.press('Enter');
    await expect(page.getByLabel(/^Zenith-distance reading/)).toBeFocused();
    const setAt = Number(((await page.locator('#log-reading-hint').textContent()) ?? '').replace('set at', '').trim());
    // The reading at the setting, then 0.010 turn more: the zenith O−C moves by 0.010 × the scale.
    await page.keyboard.type(setAt.toFixed(3));
    const zenithOf = async () => signedNumber(/O−C zenith ([+−][\d.]+)″/.exec((await omc.textContent()) ?? '')?.[1] ?? 'NaN');
    await expect.poll(zenithOf).not.toBeNaN();
    const atSetting = await zenithOf();
    await page.keyboard.press('Control+A');
    await page.keyboard.type((setAt + 0.01).toFixed(3));
    await expect.poll(zenithOf).not.toBe(atSetting);
    const site = JSON.parse(readFileSync(join(folder, 'archive', 'site.json'), 'utf8')) as { instruments: { zenithScale: { arcsecPerUnit: number } }[] };
    const scale = site.instruments[0].zenithScale.arcsecPerUnit;
    // Tolerance: the O−C is shown to 0.01″ (two roundings).
    expect(Math.abs(Math.abs((await zenithOf()) - atSetting) - 0.01 * scale), 'zenith O−C change for 0.010 turn').toBeLessThan(0.021);
    await shoot(page, '5-tonight-typed');
    await page.keyboard.press('Enter');
    await expect(page.getByTestId('log-status')).toContainText(`Logged ${star}`);
    await expect(page.getByTestId('logged-transits').locator('tbody tr')).toHaveCount(1);
    await expect(page.getByTestId('logged-transits')).toContainText(star);
    await shoot(page, '6-tonight-logged');
  });

  await test.step('the logged night is in the archive', async () => {
    await view(page, 2, 'Archive');
    await expect(page.getByRole('heading', { name: `Nights (${simulated.nights + 1})` })).toBeVisible();
    await view(page, 5, 'Exchange');
    await expect(page.getByTestId('archive-counts')).toContainText(`${simulated.nights + 1} nights · ${simulated.transits + 1} transits`);
  });

  await test.step('run a solve in the Solve view', async () => {
    await view(page, 3, 'Solve');
    await page.getByLabel('Label for this solve').fill('Whole job');
    // The imported nights have no clock comparisons (Exchange imports none), and without catalogue
    // priors the default model's sum-zero constraints are then refused as linearly dependent.
    await page.getByLabel('Catalogue precision as priors').check();
    await page.getByRole('button', { name: 'Run solve', exact: true }).click();
    const status = page.getByTestId('solve-status');
    await expect(status).toHaveAttribute('data-phase', 'running');
    await expect(page.getByRole('progressbar', { name: 'Solve progress' })).toBeVisible();
    await expect(status).toHaveAttribute('data-phase', 'finished', { timeout: 90_000 });
    await expect(page.getByTestId('solve-star-table').locator('tbody tr')).toHaveCount(simulated.stars);
    await expect(page.getByTestId('saved-solves').locator('tbody tr')).toHaveCount(1);
    await shoot(page, '7-solve-finished');
  });

  await test.step('open each plot of the Signatures view', async () => {
    await view(page, 4, 'Signatures');
    await expect(page.getByLabel('Saved reduction (newest first)')).toContainText('Whole job');
    const plots = page.locator('figure[data-testid^="plot-"]');
    await expect.poll(() => plots.count()).toBeGreaterThanOrEqual(8);
    const ids = await plots.evaluateAll((figures) => figures.map((f) => f.getAttribute('data-testid') ?? ''));
    for (const id of ['plot-annual-dial', 'plot-residuals-time', 'plot-residuals-season', 'plot-parallax-ellipses']) expect(ids).toContain(id);
    for (const id of ids) {
      const plot = page.getByTestId(id);
      await plot.scrollIntoViewIfNeeded();
      const marks = Number(await plot.getAttribute('data-points')) + Number(await plot.getAttribute('data-lines')) + Number((await plot.getAttribute('data-cells')) ?? 0);
      expect(marks, `${id} draws something`).toBeGreaterThan(0);
      await plot.screenshot({ path: `${shots}/whole-job-8-${id}.png` });
    }
    await expect(page.getByTestId('plot-annual-dial')).toHaveAttribute('data-points', String(simulated.stars));
    await shoot(page, '8-signatures');
  });

  await test.step('export CSV, VOTable and a bundle and read the files back', async () => {
    await view(page, 5, 'Exchange');
    const csvDownload = page.waitForEvent('download');
    await page.getByTestId('export-csv-transits').click();
    const csv = (await readDownload(await csvDownload)).toString('utf8').split('\r\n').filter((l) => l !== '');
    expect(csv[0]).toMatch(/^id,|,starId,|,nightId,/);
    expect(csv.length - 1, 'transit rows in the CSV').toBe(simulated.transits + 1);

    const starsCsv = page.waitForEvent('download');
    await page.getByTestId('export-solve-csv').click();
    const solveRows = (await readDownload(await starsCsv)).toString('utf8').split(/\r?\n/).filter((l) => l !== '');
    expect(solveRows.length - 1, 'star rows in the solve CSV').toBe(simulated.stars);

    const votDownload = page.waitForEvent('download');
    await page.getByTestId('export-solve-votable').click();
    const vot = await votDownload;
    expect(vot.suggestedFilename()).toBe('meridian-ledger-solve-Whole-job-stars.vot');
    const xml = (await readDownload(vot)).toString('utf8');
    expect(xml).toMatch(/^<\?xml version="1\.0"/);
    expect(xml).toContain('<VOTABLE');
    expect(xml.match(/<TR>/g)?.length, 'star rows in the VOTable').toBe(simulated.stars);

    const bundleDownload = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Export the whole archive…' }).click();
    const lines = gunzipSync(await readDownload(await bundleDownload)).toString('utf8').split('\n').filter((l) => l !== '');
    const header = JSON.parse(lines[0]) as { format: string; formatVersion: number };
    expect(header.format).toBe('meridian-ledger-bundle');
    const manifest = (JSON.parse(lines[lines.length - 1]) as { $manifest: { tables: { name: string; rows: number }[]; lines: number } }).$manifest;
    expect(manifest.lines).toBe(lines.length);
    const rowsOf = (name: string) => manifest.tables.find((t) => t.name === name)?.rows;
    expect(rowsOf('transits')).toBe(simulated.transits + 1);
    expect(rowsOf('nights')).toBe(simulated.nights + 1);
    expect(rowsOf('stars')).toBe(simulated.stars);
    expect(rowsOf('reductions')).toBe(1);
    await expect(page.getByTestId('bundle-message')).toContainText('Exported');
    await shoot(page, '9-exchange-exported');
  });
});
