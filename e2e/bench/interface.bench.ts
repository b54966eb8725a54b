// `npm run bench:interface`: how the interface responds with a large archive, in headless Chromium,
// through the built app. Prints figures (median, p95) against the targets with the machine's load;
// asserts none. BENCH_TRANSITS sets the archive size (default 1,000,000), BENCH_RESIDUALS the
// residual plot's size (default 200,000), BENCH_PORT the preview port (default 4435), BENCH_PARTS
// the timed parts (first-view, zoom, typing; all by default), BENCH_PROFILE a browser profile folder
// to keep and reuse (filled once per archive size; a later run on it skips the set-up).
// The archive is written straight into IndexedDB (the app's own schema, records cloned from one
// the app imported itself), outside every timed part. Invented scenario: no real site or star.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from '@playwright/test';
import { preview } from 'vite';
import { CHROMIUM_ARGS, CHROMIUM_EXECUTABLE } from '../../playwright.config.ts';
import { fillArchive, seedReduction } from './interfaceArchive.ts';

const TRANSITS = Number(process.env.BENCH_TRANSITS ?? 1_000_000);
const RESIDUALS = Number(process.env.BENCH_RESIDUALS ?? 200_000);
const PORT = Number(process.env.BENCH_PORT ?? 4435);
// renderer/tonight/programmeSnapshot.ts's localStorage key (the bench may not import the renderer's DOM code).
const PROGRAMME_COPY_KEY = 'meridian-ledger:tonight-programme-inputs';
// renderer/archive/overviewSnapshot.ts's key.
const OVERVIEW_COPY_KEY = 'meridian-ledger:archive-overview';
const BASE = `http://127.0.0.1:${PORT}/`;
const LAUNCHES = 5;
const ZOOMS = 30;
const KEYSTROKES = 30;
// BENCH_PARTS picks the timed parts (comma-separated: first-view, zoom, typing); all by default.
const PARTS = new Set((process.env.BENCH_PARTS ?? 'first-view,zoom,typing').split(',').map((p) => p.trim()));

interface Summary { median: number; p95: number; min: number; max: number; n: number }
function summary(values: readonly number[]): Summary {
  const sorted = [...values].sort((a, b) => a - b);
  const at = (q: number) => sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)];
  return { median: sorted[Math.floor((sorted.length - 1) / 2)], p95: at(0.95), min: sorted[0], max: sorted[sorted.length - 1], n: sorted.length };
}
const ms = (s: Summary) => `median ${s.median.toFixed(1)} ms, p95 ${s.p95.toFixed(1)} ms (min ${s.min.toFixed(1)}, max ${s.max.toFixed(1)}, n ${s.n})`;
const load = () => os.loadavg().map((v) => v.toFixed(2)).join(' ');

/** One real solve's results (`simulate` then `solve --json --residuals` through the bin) to grow into a large residual set. */
function smallSolve(): Record<string, unknown> {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'ml-interface-'));
  try {
    const run = (args: string[]) => {
      const out = spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
      if (out.status !== 0) throw new Error(`meridian-ledger ${args.join(' ')} failed: ${out.stderr}`);
      return out.stdout;
    };
    run(['simulate', '--seed', '3', '--years', '3', '--stars', '10', '--out', path.join(dir, 'archive')]);
    return JSON.parse(run(['solve', path.join(dir, 'archive'), '--json', '--residuals'])) as Record<string, unknown>;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** A browser on the benchmark's own profile folder, so each launch is a cold start on the same archive. */
async function launch(profile: string): Promise<BrowserContext> {
  const context = await chromium.launchPersistentContext(profile, { executablePath: CHROMIUM_EXECUTABLE, args: CHROMIUM_ARGS, viewport: { width: 1400, height: 1000 } });
  // tsx compiles this file keeping function names (a call to __name around each named arrow),
  // and the functions sent to page.evaluate carry those calls into the page: give it the helper.
  await context.addInitScript({ content: 'globalThis.__name = globalThis.__name ?? ((fn) => fn);' });
  return context;
}

/**
 * Navigation start → the view's control answered, per launch of the browser (closed and started
 * again on the same profile, so no earlier page's work is still running): waits (every frame) for
 * the control, uses it, and waits (every frame) for its answer; both times are the page's own
 * clock (performance.now(), whose zero is the navigation start).
 */
async function firstViewInteractive(profile: string, hash: string, use: (page: Page) => Promise<number>, beforeLaunch = ''): Promise<{ ready: number; answered: number; domContentLoaded: number }[]> {
  const runs = [];
  for (let k = 0; k < LAUNCHES; k++) {
    const context = await launch(profile);
    if (beforeLaunch !== '') await context.addInitScript({ content: beforeLaunch });
    const page = context.pages()[0] ?? (await context.newPage());
    await page.goto(`${BASE}?no-demo${hash}`, { waitUntil: 'commit' });
    const answered = await use(page);
    const domContentLoaded = await page.evaluate(() => (performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming).domContentLoadedEventEnd);
    runs.push({ ready: Number(await page.evaluate(() => (window as unknown as { __ready?: number }).__ready ?? NaN)), answered, domContentLoaded });
    console.log(`   (${hash} launch ${k + 1} of ${LAUNCHES}: answered at ${answered.toFixed(0)} ms)`);
    await context.close();
  }
  return runs;
}

async function tonightAnswers(page: Page): Promise<number> {
  await page.waitForFunction(() => {
    const field = document.querySelector<HTMLInputElement>('#log-star');
    if (field === null || field.disabled) return false;
    (window as unknown as { __ready: number }).__ready = performance.now();
    return true;
  }, null, { polling: 'raf', timeout: 120_000 });
  await page.locator('#log-star').fill('ZZ-0');
  return Number(await (await page.waitForFunction(() => /not in tonight/.test(document.querySelector('#log-star-hint')?.textContent ?? '') && performance.now(), null, { polling: 'raf', timeout: 120_000 })).jsonValue());
}

/** Navigation start → the archive's own overview shown (the copy of the last launch replaced), per Archive launch. */
const archiveRead: number[] = [];

async function archiveAnswers(page: Page): Promise<number> {
  const button = page.getByRole('button', { name: 'Transit count' });
  await page.waitForFunction(() => {
    const shown = [...document.querySelectorAll('button')].some((e) => e.textContent === 'Transit count') && document.querySelector('[aria-label^="Night of "]') !== null;
    if (shown) (window as unknown as { __ready: number }).__ready = performance.now();
    return shown;
  }, null, { polling: 'raf', timeout: 120_000 });
  await button.click();
  const answered = Number(await (await page.waitForFunction(() => [...document.querySelectorAll('button')].find((e) => e.textContent === 'Transit count')?.getAttribute('aria-pressed') === 'true' && performance.now(), null, { polling: 'raf', timeout: 120_000 })).jsonValue());
  archiveRead.push(Number(await (await page.waitForFunction(() => document.querySelector('[data-testid="overview-copy-note"]') === null && document.querySelector('.quality-bar') !== null && performance.now(), null, { polling: 'raf', timeout: 120_000 })).jsonValue()));
  return answered;
}

/** Wheel zooms over the residual plot, alternately in and out: the plot's own draw measure and wheel → next frame painted. */
async function zoomTimes(page: Page): Promise<{ draw: number[]; frame: number[]; points: number[]; plots: string[] }> {
  const plot = page.getByTestId('plot-residuals-time');
  await plot.scrollIntoViewIfNeeded();
  await page.waitForFunction((n) => Number(document.querySelector('[data-testid="plot-residuals-time"]')?.getAttribute('data-points')) >= n, RESIDUALS, { timeout: 120_000 });
  return page.evaluate(async (zooms) => {
    const stage = document.querySelector('[data-testid="plot-residuals-time"] [role="slider"]') as HTMLElement;
    const box = stage.getBoundingClientRect();
    const draws: { duration: number; points: number; plot: string }[] = [];
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) draws.push({ duration: e.duration, ...((e as PerformanceMeasure).detail as { points: number; plot: string }) });
    }).observe({ type: 'measure' });
    const painted = () => new Promise<number>((resolve) => requestAnimationFrame(() => setTimeout(() => resolve(performance.now()), 0)));
    await painted();
    const frame: number[] = [];
    for (let k = 0; k < zooms; k++) {
      const t0 = performance.now();
      stage.dispatchEvent(new WheelEvent('wheel', { deltaY: k % 2 === 0 ? -120 : 120, deltaMode: 0, clientX: box.x + box.width / 2, clientY: box.y + box.height / 2, bubbles: true, cancelable: true }));
      frame.push((await painted()) - t0);
      await new Promise((resolve) => setTimeout(resolve, 30));
    }
    await new Promise((resolve) => setTimeout(resolve, 50));
    return { draw: draws.map((d) => d.duration), frame, points: draws.map((d) => d.points), plots: draws.map((d) => d.plot) };
  }, ZOOMS);
}

/** Keystroke (a digit replacing the last wire's tenths) → the O−C text changed, and → the next frame painted. */
async function typingTimes(page: Page): Promise<{ toText: number[]; toFrame: number[] }> {
  await page.locator('#log-star').fill('');
  await page.locator('#log-star').press('Enter');
  const wires = ((await page.getByTestId('expected-wires').textContent()) ?? '').trim();
  if (wires === '') throw new Error('Tonight shows no expected wire times for the next star; the bench needs a programme star tonight');
  await page.locator('#log-wires').fill(wires);
  await page.getByTestId('o-minus-c').waitFor();
  await page.evaluate(() => {
    const record: { key: number; text: number; frame: number }[] = [];
    (window as unknown as { __typing: typeof record }).__typing = record;
    const field = document.querySelector('#log-wires') as HTMLInputElement;
    const omc = document.querySelector('[data-testid="o-minus-c"]') as HTMLElement;
    let pending: { key: number; text: number; frame: number } | null = null;
    field.addEventListener('keydown', (event) => {
      if (/^\d$/.test(event.key)) pending = { key: event.timeStamp, text: NaN, frame: NaN };
    }, { capture: true });
    new MutationObserver(() => {
      const entry = pending;
      if (entry === null || !Number.isNaN(entry.text)) return;
      entry.text = performance.now();
      requestAnimationFrame(() => setTimeout(() => {
        entry.frame = performance.now();
        record.push(entry);
      }, 0));
    }).observe(omc, { subtree: true, childList: true, characterData: true, attributes: true });
  });
  await page.locator('#log-wires').focus();
  await page.keyboard.press('End');
  for (let k = 0; k < KEYSTROKES; k++) {
    await page.keyboard.press('Shift+ArrowLeft');
    const current = await page.locator('#log-wires').inputValue();
    const last = Number(current.at(-1));
    await page.keyboard.press(String((last + 1 + (k % 8)) % 10));
    await page.waitForFunction((n) => ((window as unknown as { __typing: unknown[] }).__typing.length >= n), k + 1, { timeout: 10_000 });
  }
  const record = await page.evaluate(() => (window as unknown as { __typing: { key: number; text: number; frame: number }[] }).__typing);
  return { toText: record.map((r) => r.text - r.key), toFrame: record.map((r) => r.frame - r.key) };
}

async function main(): Promise<void> {
  const server = await preview({ configFile: 'renderer/vite.config.ts', preview: { host: '127.0.0.1', port: PORT, strictPort: true, open: false } });
  const kept = process.env.BENCH_PROFILE;
  const profile = kept ?? mkdtempSync(path.join(os.tmpdir(), 'ml-interface-profile-'));
  // The marker says that a kept profile already holds an archive of these sizes.
  const marker = path.join(profile, `meridian-ledger-bench-${TRANSITS}-${RESIDUALS}`);
  if (kept !== undefined) mkdirSync(kept, { recursive: true });
  let context = await launch(profile);
  try {
    console.log(`Meridian Ledger interface benchmark — headless Chromium, ${os.cpus().length} cores, load average at start ${load()}`);
    if (existsSync(marker)) {
      console.log(`reusing the archive already written into ${profile} (BENCH_PROFILE)`);
    } else {
      const page = await context.newPage();
      page.setDefaultTimeout(600_000);
      const fillStart = performance.now();
      const filled = await fillArchive(page, BASE, TRANSITS);
      console.log(`archive written into IndexedDB (untimed set-up): ${filled.nights.toLocaleString('en')} nights, ${filled.transits.toLocaleString('en')} transits, ${filled.stars} stars in ${((performance.now() - fillStart) / 1000).toFixed(1)} s`);
      const solve = smallSolve();
      const seeded = await seedReduction(page, solve, RESIDUALS);
      console.log(`saved reduction with ${seeded.toLocaleString('en')} residuals seeded (untimed set-up)`);
      if (kept !== undefined) writeFileSync(marker, `${new Date().toISOString()}\n`);
    }
    await context.close();

    if (PARTS.has('first-view')) {
      // One untimed launch first, as by someone who has used the app before: any schema upgrade
      // has run, Tonight has kept its copy of the programme's inputs (renderer/tonight/programmeSnapshot.ts)
      // and the Archive its copy of the overview.
      const warmStart = performance.now();
      const warm = await launch(profile);
      const warmPage = warm.pages()[0] ?? (await warm.newPage());
      await warmPage.goto(`${BASE}?no-demo#/tonight`, { waitUntil: 'commit' });
      await tonightAnswers(warmPage);
      await warmPage.waitForFunction(() => !/still opening/.test(document.body.textContent ?? ''), null, { timeout: 600_000 });
      // The Archive keeps its copy of the overview (renderer/archive/overviewSnapshot.ts) once it has read its nights.
      await warmPage.goto(`${BASE}?no-demo#/archive`);
      await warmPage.waitForFunction((key) => localStorage.getItem(key) !== null, OVERVIEW_COPY_KEY, { timeout: 600_000 });
      await warm.close();
      console.log(`untimed warm-up launch (Tonight, then Archive, archive opened): ${((performance.now() - warmStart) / 1000).toFixed(1)} s`);
      const tonight = await firstViewInteractive(profile, '#/tonight', tonightAnswers);
      const noCopy = await firstViewInteractive(profile, '#/tonight', tonightAnswers, `localStorage.removeItem('${PROGRAMME_COPY_KEY}');`);
      const archive = await firstViewInteractive(profile, '#/archive', archiveAnswers);
      console.log(`\nload average after the first views: ${load()}`);
      const report = (name: string, runs: { ready: number; answered: number; domContentLoaded: number }[]) => {
        console.log(`first view ${name}, navigation start → control answered: ${ms(summary(runs.map((r) => r.answered)))}   target < 1500 ms`);
        console.log(`   of which: DOMContentLoaded ${ms(summary(runs.map((r) => r.domContentLoaded)))}; control present ${ms(summary(runs.map((r) => r.ready)))}`);
      };
      report('Tonight (the default view)', tonight);
      report('Tonight without the copy of the last session (as on the very first launch)', noCopy);
      report('Archive (every night marked)', archive);
      console.log(`   the archive's own overview (nights open from here; the copy of the last launch replaced): ${ms(summary(archiveRead))}`);
    }
    context = await launch(profile);
    if (PARTS.has('zoom')) {
      const signatures = await context.newPage();
      signatures.setDefaultTimeout(600_000);
      await signatures.goto(`${BASE}?no-demo#/signatures`);
      const zoom = await zoomTimes(signatures);
      console.log(`residual plot of ${RESIDUALS.toLocaleString('en')} points, wheel zoom (in and out, ${ZOOMS} times), load ${load()}:`);
      console.log(`   the plot's draw (performance measure 'signature-plot-draw'): ${ms(summary(zoom.draw))}   target < 50 ms; points drawn ${summary(zoom.points).min}…${summary(zoom.points).max}`);
      const perPlot = [...new Set(zoom.plots)].map((id) => `${id} ×${zoom.plots.filter((p) => p === id).length}`).join(', ');
      console.log(`   redraws during the ${ZOOMS} zooms: ${perPlot}`);
      console.log(`   wheel event → next frame painted:                            ${ms(summary(zoom.frame))}   target < 50 ms (frames every ~16.7 ms)`);
      await signatures.close();
    }
    if (PARTS.has('typing')) {
      const log = await context.newPage();
      log.setDefaultTimeout(600_000);
      await log.goto(`${BASE}?no-demo#/tonight`);
      const typing = await typingTimes(log);
      console.log(`Tonight, typing a wire time (${KEYSTROKES} keystrokes), load ${load()}:`);
      console.log(`   keydown → O−C text changed:     ${ms(summary(typing.toText))}   target < 50 ms`);
      console.log(`   keydown → next frame painted:    ${ms(summary(typing.toFrame))}`);
      await log.close();
    }
    console.log(`\nload average at the end: ${load()}`);
    if (TRANSITS < 1_000_000) console.log(`(BENCH_TRANSITS=${TRANSITS}: a smaller archive than the 1,000,000 of the targets)`);
  } finally {
    await context.close();
    if (kept === undefined) rmSync(profile, { recursive: true, force: true });
    await new Promise<void>((resolve) => server.httpServer.close(() => resolve()));
  }
}

await main();
