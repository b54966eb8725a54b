// `npm run bench:import`: the archive at scale in headless Chromium, through the real app (the
// Exchange view's import, export and restore, each a worker task). Prints figures; asserts none.
// BENCH_TRANSITS sets the size (default 1,000,000); below 1,000,000 the extrapolated figures are
// printed and labelled as such. Builds nothing: run `npm run build:renderer` first (the script does).
// Invented scenario: no real site, instrument or star.
import { mkdtemp, rm } from 'node:fs/promises';
import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import os from 'node:os';
import path from 'node:path';
import { chromium, type Page } from '@playwright/test';
import { preview } from 'vite';
import { CHROMIUM_ARGS, CHROMIUM_EXECUTABLE } from '../../playwright.config.ts';

const TARGET = 1_000_000;
const TRANSITS = Number(process.env.BENCH_TRANSITS ?? TARGET);
// 100 stars: each has 10,000 transits (the range query's size) at 1,000,000, fewer at a smaller BENCH_TRANSITS.
const STARS = 100;
const NIGHTS = Math.ceil(TRANSITS / STARS);
const PORT = Number(process.env.BENCH_PORT ?? 4397);
const QUERY_REPEATS = 20;

const SITE = JSON.stringify({
  formatVersion: 1,
  site: { id: 'bench-hill', label: 'Bench Hill pier (invented)', latitudeDeg: 47.5, longitudeDeg: 11.25, heightM: 700 },
  instruments: [{ id: 'bt-1', label: 'Bench transit 1', kind: 'transit', zenithScale: { unit: 'turn', arcsecPerUnit: 48.77, sense: -1 },
    wireIntervalsS: [15.2, 0, -15.1], effectiveWavelengthUm: 0.6, clockId: 'clock-b', clockTimeScale: 'sidereal', events: [] }],
});

function starList(): string {
  const lines = ['id,label,raDeg,decDeg,epochJyear,pmRaCosDecMasYr,pmDecMasYr,parallaxMas'];
  for (let s = 0; s < STARS; s++) lines.push(`B${String(s).padStart(3, '0')},Bench star ${s},${(s * 3.6).toFixed(1)},${(30 + (s % 40)).toFixed(1)},2016.0,1.5,-2.5,3.25`);
  return `${lines.join('\n')}\n`;
}

/** The transit log: STARS stars on each of NIGHTS nights, star s crossing at 18h + s·3 min (streamed to disk). */
async function writeTransitLog(file: string): Promise<void> {
  const out = createWriteStream(file);
  out.write('starId,culmination,nightDate,instrumentId,wire1Utc,wire2Utc,wire3Utc,micrometerTurns\n');
  let written = 0;
  for (let night = 0; night < NIGHTS && written < TRANSITS; night++) {
    const iso = new Date(Date.UTC(2000, 0, 1 + night)).toISOString().slice(0, 10);
    const chunk: string[] = [];
    for (let s = 0; s < STARS && written < TRANSITS; s++, written++) {
      const minute = 18 * 60 + s * 3; // ≤ 22:57 for 100 stars
      const hhmm = `${String(Math.floor(minute / 60)).padStart(2, '0')}:${String(minute % 60).padStart(2, '0')}`;
      chunk.push(`B${String(s).padStart(3, '0')},upper,${iso},bt-1,${iso}T${hhmm}:10.10Z,${iso}T${hhmm}:25.30Z,${iso}T${hhmm}:40.40Z,${(12 + (s % 7) * 0.1).toFixed(3)}`);
    }
    if (!out.write(`${chunk.join('\n')}\n`)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
}

async function importFile(page: Page, file: string | { name: string; text: string }): Promise<{ ms: number; message: string }> {
  const chooser = page.waitForEvent('filechooser');
  await page.getByRole('button', { name: 'Choose a file to import…' }).click();
  await (await chooser).setFiles(typeof file === 'string' ? file : { name: file.name, mimeType: 'text/plain', buffer: Buffer.from(file.text) });
  const importButton = page.getByRole('button', { name: /^Import (all|only the)/ });
  await importButton.waitFor({ timeout: 3_600_000 });
  const rejected = await page.getByTestId('rejected-count').innerText();
  if (rejected !== '0') throw new Error(`${typeof file === 'string' ? file : file.name}: ${rejected} generated rows were rejected; fix the generator`);
  const started = performance.now();
  await importButton.click();
  const name = typeof file === 'string' ? path.basename(file) : file.name;
  const message = page.getByTestId('import-message').filter({ hasText: `Imported ${name}` });
  await message.waitFor({ timeout: 3_600_000 });
  return { ms: performance.now() - started, message: await message.innerText() };
}

const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;
const scaled = (ms: number) => (TRANSITS >= TARGET ? '' : `  → extrapolated to 1,000,000 (linear): ${seconds((ms * TARGET) / TRANSITS)}`);

const loadAverage = () => os.loadavg().map((x) => x.toFixed(2)).join(', ');

async function main(): Promise<void> {
  const loadAtStart = loadAverage();
  const folder = await mkdtemp(path.join(os.tmpdir(), 'ml-bench-'));
  const logFile = path.join(folder, 'transits.csv');
  const server = await preview({ configFile: 'renderer/vite.config.ts', preview: { host: '127.0.0.1', port: PORT, strictPort: true, open: false } });
  const browser = await chromium.launch({ executablePath: CHROMIUM_EXECUTABLE, args: CHROMIUM_ARGS });
  try {
    await writeTransitLog(logFile);
    const page = await (await browser.newContext({ acceptDownloads: true })).newPage();
    page.setDefaultTimeout(3_600_000);
    // The worker's stage times (renderer/exchange/stageClock.ts) arrive as console debug lines.
    const stageLines: string[] = [];
    const keepStageLine = (text: string) => {
      if (text.startsWith('[exchange]')) stageLines.push(text);
    };
    page.on('console', (message) => keepStageLine(message.text()));
    page.on('worker', (worker) => worker.on('console', (message) => keepStageLine(message.text())));
    await page.addInitScript(() => {
      const seen: { start: number; ms: number }[] = [];
      (window as unknown as { __longTasks: typeof seen }).__longTasks = seen;
      new PerformanceObserver((list) => {
        for (const entry of list.getEntries()) seen.push({ start: entry.startTime, ms: entry.duration });
      }).observe({ type: 'longtask', buffered: true });
      // Long animation frames name the scripts that ran in them (Chromium): what a long task was.
      const frames: { start: number; ms: number; scripts: string[] }[] = [];
      (window as unknown as { __longFrames: typeof frames }).__longFrames = frames;
      new PerformanceObserver((list) => {
        for (const entry of list.getEntries() as (PerformanceEntry & { scripts?: { duration: number; invoker: string; sourceFunctionName: string; sourceURL: string; sourceCharPosition: number }[] })[]) {
          frames.push({ start: entry.startTime, ms: entry.duration, scripts: (entry.scripts ?? []).filter((s) => s.duration > 20)
            .map((s) => `${s.duration.toFixed(0)} ms ${s.invoker} ${s.sourceFunctionName || '(anonymous)'} ${s.sourceURL.split('/').pop() ?? ''}:${s.sourceCharPosition}`) });
        }
      }).observe({ type: 'long-animation-frame', buffered: true });
    });
    await page.goto(`http://127.0.0.1:${PORT}/?no-demo#/exchange`);
    await page.getByRole('button', { name: 'Choose a file to import…' }).waitFor();
    await importFile(page, { name: 'site.json', text: SITE });
    await importFile(page, { name: 'stars.csv', text: starList() });
    // Long main-thread tasks (> 50 ms) per phase, between page clock marks taken at each phase's edges.
    const pageNow = () => page.evaluate(() => performance.now());
    const longTasks = async (from: number, to: number) => {
      const seen = await page.evaluate(() => (window as unknown as { __longTasks: { start: number; ms: number }[] }).__longTasks);
      const inPhase = seen.filter((t) => t.start >= from && t.start < to);
      return { ms: Math.max(0, ...inPhase.map((t) => t.ms)), count: inPhase.length };
    };
    const phase: Record<string, number> = { importStart: await pageNow() };
    const { ms: importMs, message: importMessage } = await importFile(page, logFile);
    phase.importEnd = await pageNow();

    const queryMs = await page.evaluate(async ({ repeats }) => {
      const db = await new Promise<IDBDatabase>((resolve, reject) => {
        const open = indexedDB.open('meridian-ledger-archive');
        open.onsuccess = () => resolve(open.result);
        open.onerror = () => reject(open.error);
      });
      const starId = await new Promise<string>((resolve) => {
        const r = db.transaction('stars').objectStore('stars').index('catalogueId').get('B007');
        r.onsuccess = () => resolve((r.result as { id: string }).id);
      });
      const times: number[] = [];
      let rows = 0;
      for (let k = 0; k < repeats; k++) {
        const t0 = performance.now();
        // The app's transitsOfStar (renderer/store/transitGroups.ts): the star's groups (schema v4)
        // over its whole time range, their transits flattened.
        rows = await new Promise<number>((resolve) => {
          const r = db.transaction('transitGroups').objectStore('transitGroups').index('[starId+firstUtcMjd]').getAll(IDBKeyRange.bound([starId, -Infinity], [starId, Infinity]));
          r.onsuccess = () => resolve((r.result as { transits: unknown[] }[]).flatMap((g) => g.transits).length);
        });
        times.push(performance.now() - t0);
      }
      db.close();
      times.sort((a, b) => a - b);
      return { p95: times[Math.ceil(0.95 * times.length) - 1], median: times[Math.floor(times.length / 2)], rows };
    }, { repeats: QUERY_REPEATS });

    phase.exportStart = await pageNow();
    const download = page.waitForEvent('download');
    const exportStart = performance.now();
    await page.getByRole('button', { name: 'Export the whole archive…' }).click();
    const bundle = await download;
    const bundleFile = path.join(folder, 'archive.mlbundle');
    await bundle.saveAs(bundleFile);
    const exportMs = performance.now() - exportStart;
    phase.exportEnd = await pageNow();

    const chooser = page.waitForEvent('filechooser');
    await page.getByRole('button', { name: 'Restore from a bundle…' }).click();
    await (await chooser).setFiles(bundleFile);
    await page.getByTestId('bundle-preview').waitFor();
    await page.getByLabel(/I have exported the current archive/).check();
    const restoreStart = performance.now();
    await page.getByRole('button', { name: 'Replace the archive' }).click();
    await page.getByTestId('bundle-message').waitFor();
    const restoreMs = performance.now() - restoreStart;
    phase.restoreEnd = await pageNow();
    const afterImport = await longTasks(phase.importStart, phase.importEnd);
    const duringQuery = await longTasks(phase.importEnd, phase.exportStart);
    const duringExport = await longTasks(phase.exportStart, phase.exportEnd);
    const duringRestore = await longTasks(phase.exportEnd, phase.restoreEnd);
    const atEnd = await longTasks(0, Infinity);

    console.log(`\nMeridian Ledger archive benchmark — ${TRANSITS.toLocaleString('en')} transits (${STARS} stars × ${NIGHTS} nights), headless Chromium, ${os.cpus().length} cores`);
    console.log(`load average (1, 5, 15 min) at start ${loadAtStart}, at end ${loadAverage()}: on a shared machine every figure scales with it`);
    console.log(`the app said: ${importMessage}`);
    console.log(`import of the transit log (click → committed):  ${seconds(importMs)}   target < 60 s${scaled(importMs)}`);
    console.log(`longest main-thread task during the import:      ${afterImport.ms.toFixed(0)} ms (${afterImport.count} long tasks; choose file → checked → committed)   target ≤ 200 ms`);
    console.log(`range query, ${queryMs.rows} transits of one star (read as its groups): p95 ${queryMs.p95.toFixed(1)} ms, median ${queryMs.median.toFixed(1)} ms over ${QUERY_REPEATS}   target p95 < 200 ms (for 10,000)${queryMs.rows < 10_000 ? '  (smaller than 10,000: not comparable)' : ''}`);
    console.log(`bundle export (click → download saved):          ${seconds(exportMs)}   target < 60 s${scaled(exportMs)}`);
    console.log(`bundle restore, replacing the archive:           ${seconds(restoreMs)}   target < 60 s${scaled(restoreMs)}`);
    console.log(`longest main-thread task during export / restore (choose file → done): ${duringExport.ms.toFixed(0)} ms (${duringExport.count}) / ${duringRestore.ms.toFixed(0)} ms (${duringRestore.count})`);
    console.log(`longest main-thread task during the range query: ${duringQuery.ms.toFixed(0)} ms (${duringQuery.count}; the bench's own raw getAll of groups on the page's thread, not the app's)`);
    console.log(`longest main-thread task over the whole run:     ${atEnd.ms.toFixed(0)} ms (${atEnd.count} long tasks)`);
    if (TRANSITS < TARGET) console.log('Figures marked "extrapolated" are a linear scaling of the measured size, not measurements at 1,000,000.');
    // The scripts behind the longest frames (over 150 ms), to say what a long main-thread task was.
    const frames = await page.evaluate(() => (window as unknown as { __longFrames: { start: number; ms: number; scripts: string[] }[] }).__longFrames);
    for (const frame of frames.filter((f) => f.ms > 150).sort((a, b) => b.ms - a.ms).slice(0, 6)) {
      console.log(`long frame ${frame.ms.toFixed(0)} ms at ${(frame.start / 1000).toFixed(1)} s: ${frame.scripts.join('; ') || 'no script over 20 ms (rendering, or the browser itself)'}`);
    }
    for (const line of [...new Set(stageLines)].filter((l) => !/site\.json|stars\.csv/.test(l))) console.log(line);
  } finally {
    await browser.close();
    await new Promise<void>((resolve) => server.httpServer.close(() => resolve()));
    await rm(folder, { recursive: true, force: true });
  }
}

await main();
