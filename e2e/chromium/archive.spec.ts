import { readFileSync } from 'node:fs';
import type { Page } from '@playwright/test';
import { expect, test } from './fixtures.ts';
import { findNonRedColours } from './nightColours.ts';
import { allNightNames, moveCursorTo, nightCursor } from './nightMarks.ts';

// Opens WITH the demo archive (invented observatory, assets/demo); returns its number of nights.
async function openArchiveWithDemo(page: Page): Promise<number> {
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.goto('./#/archive');
  const heading = page.getByRole('heading', { name: /^Nights \([1-9]\d*\)$/ });
  await expect(heading).toBeVisible({ timeout: 30_000 });
  const count = Number(/\d+/.exec((await heading.textContent()) ?? '')?.[0]);
  expect(count).toBeGreaterThan(500);
  return count;
}

// The cursor's name: "Night of DATE, N transits with INSTRUMENT, <unit-weight error or why there is none>".
const escaped = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const NAME = /^Night of \d{4}-\d{2}-\d{2}, \d+ transits with [^,]+, /;
const parse = (text: string) => /^Night of (\S+), \d+ transits with ([^,]+),/.exec(text)?.slice(1) ?? ['', ''];

/** Opens the night at `index` of the overview by keyboard (cursor there, Enter). */
async function openNightAt(page: Page, index: number): Promise<void> {
  await moveCursorTo(page, index);
  await page.keyboard.press('Enter');
}

test('the overview shows one mark per demo night and opens a night by keyboard and by click', async ({ page }) => {
  const nights = await openArchiveWithDemo(page);
  await expect(page.locator('figure.overview')).toHaveAttribute('data-night-count', String(nights));
  await expect(page.getByText(/^Colour: unit-weight error of the night/)).toBeVisible();
  // Every night is reached by keyboard, once, under its own name.
  const names = await allNightNames(page);
  expect(names).toHaveLength(nights);
  for (const { label } of names) expect(label).toMatch(NAME);
  expect(new Set(names.map((n) => n.id)).size).toBe(nights);

  // Keyboard: Tab reaches the cursor; Home puts it on the first night, ArrowRight on the second; Enter opens it.
  // (The names end with the unit-weight error, which the pass running meanwhile may fill in: compare the start.)
  const start = (label: string) => new RegExp(`^${escaped(label.slice(0, label.lastIndexOf(',')))},`);
  await page.getByRole('button', { name: 'Transit count', exact: true }).focus();
  await page.keyboard.press('Tab');
  await expect(nightCursor(page)).toBeFocused();
  await page.keyboard.press('Home');
  await expect(nightCursor(page)).toHaveAttribute('aria-label', start(names[0].label));
  await page.keyboard.press('ArrowRight');
  const second = names[1].label;
  await expect(page.getByRole('button', { name: start(second) })).toBeFocused();
  await page.keyboard.press('Enter');
  const date = /Night of (\S+),/.exec(second)?.[1] ?? 'no date';
  await expect(page.getByRole('heading', { name: new RegExp(`^Night of ${date}`) })).toBeVisible();
  const count = Number(/(\d+) transits with /.exec(second)?.[1]);
  await expect(page.getByText(`${count} transits, in time order`)).toBeVisible();
  await expect(page.locator('section[aria-labelledby="night-heading"] tbody tr')).toHaveCount(count);

  // Click: a date both instruments observed; each instrument's mark has its own band and opens its
  // own night when clicked on the canvas (the point found with the cursor, which is then moved away).
  const byDate = new Map<string, string[]>();
  for (const [date, instrument] of names.map((n) => parse(n.label))) byDate.set(date, [...(byDate.get(date) ?? []), instrument]);
  const shared = [...byDate].filter(([, instruments]) => new Set(instruments).size >= 2);
  expect(shared.length, 'dates observed with both instruments').toBeGreaterThan(10);
  const [sharedDate, instruments] = shared[Math.floor(shared.length / 2)];
  for (const instrument of instruments) {
    const index = names.findIndex((n) => new RegExp(`^Night of ${sharedDate}, \\d+ transits with ${escaped(instrument)},`).test(n.label));
    const box = await (await moveCursorTo(page, index)).boundingBox();
    if (box === null) throw new Error('the cursor has no box on the page');
    await page.keyboard.press('Home');
    await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
    await expect(page.getByRole('heading', { name: new RegExp(`^Night of ${sharedDate} · ${escaped(instrument)}`) })).toBeVisible();
    await expect(nightCursor(page)).toHaveAttribute('aria-label', start(names[index].label));
    await expect(nightCursor(page)).toHaveClass(/selected/);
  }
  // Keyboard order: date order, then instrument (band) order, through every mark.
  const dates = names.map((n) => parse(n.label)[0]);
  expect(dates).toEqual([...dates].sort());
  // The bands are named: in full above the chart, in short at the left of every year row.
  for (const instrument of new Set(instruments)) await expect(page.locator('figure.overview p.bands')).toContainText(instrument);
  const bandLabels = await page.locator('figure.overview text.band-label').evaluateAll((ts) => ts.map((t) => t.firstChild?.textContent ?? ''));
  expect(new Set(bandLabels).size).toBe(new Set(instruments).size);
});

test('reject a transit and undo it; the audit trail names the editor', async ({ page }) => {
  await openArchiveWithDemo(page);
  await openNightAt(page, 10);
  const firstReject = page.getByRole('button', { name: /^Reject / }).first();
  const name = (await firstReject.getAttribute('aria-label')) ?? '';
  // Without a name the edit is refused with a message.
  await firstReject.click();
  await expect(page.getByRole('status').filter({ hasText: 'Not changed: no editor name' })).toBeVisible();

  await page.getByLabel('Edits recorded as').fill('R. Vance');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Edits are now recorded as R. Vance.' })).toBeVisible();
  await page.getByRole('button', { name }).click();
  const restoreName = name.replace(/^Reject/, 'Restore');
  await expect(page.getByRole('button', { name: restoreName })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: /^Rejected the upper transit|^Rejected the lower transit/ })).toBeVisible();

  await page.getByRole('button', { name: /^Undo: rejected/ }).click();
  await expect(page.getByRole('button', { name })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Undo', exact: true })).toBeDisabled();
  await page.getByText(/^Audit trail/).click();
  const trail = page.getByRole('list', { name: 'Audit trail, newest first' });
  await expect(trail.getByRole('listitem')).toHaveCount(2);
  await expect(trail.getByRole('listitem').first()).toContainText('R. Vance · undid: rejected');

  // The name and the trail are stored in the archive: they survive a reload.
  await page.reload();
  await expect(page.getByLabel('Edits recorded as')).toHaveValue('R. Vance', { timeout: 30_000 });
  await page.getByText(/^Audit trail/).click();
  await expect(trail.getByRole('listitem')).toHaveCount(2);
});

test('add an instrument event (validated) and see it in the list; star list shows counts', async ({ page }) => {
  await openArchiveWithDemo(page);
  await page.getByLabel('Edits recorded as').fill('R. Vance');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  // The first instrument's panel (the demo may hold more than one instrument).
  const panel = page.locator('section[aria-labelledby="instruments-heading"] article').first();
  const caption = panel.getByText(/^\d+ events \(segment boundaries/);
  const before = Number(/^(\d+)/.exec((await caption.textContent()) ?? '')?.[1]);

  await panel.getByLabel('Event date (UTC)').fill('2025-02-30');
  await panel.getByRole('button', { name: 'Add event' }).click();
  await expect(panel.getByText('2025-02-30 is not a calendar date')).toBeVisible();

  await panel.getByLabel('Event date (UTC)').fill('2025-03-14');
  await panel.getByLabel('Event time (UTC)').fill('09:30');
  await panel.getByLabel('What was done').selectOption('recollimation');
  await panel.getByLabel('Event note').fill('collimator re-set after pier work');
  await panel.getByRole('button', { name: 'Add event' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'segment boundary there' })).toBeVisible();
  await expect(caption).toHaveText(`${before + 1} events (segment boundaries of the drift model)`);
  await expect(panel.getByRole('row', { name: /2025-03-14 09:30 Recollimation collimator re-set/ })).toBeVisible();

  // The star list's counts add up to the transits of all nights (as the overview's marks count them).
  const counts = page.getByTestId('star-transit-count');
  await expect(counts).not.toHaveCount(0);
  const total = (await counts.allTextContents()).map(Number).reduce((sum, value) => sum + value, 0);
  const perNight = (await allNightNames(page)).map((n) => n.label)
    .map((label) => Number(/, (\d+) transits with /.exec(label)?.[1])).reduce((sum, value) => sum + value, 0);
  expect(total).toBe(perNight);
  expect(total).toBeGreaterThan(5000);
});

// The planted blunders of the demo (the simulator's truth beside the bundle), by night id.
const truth = JSON.parse(readFileSync('assets/demo/demo-truth.json', 'utf8')) as { blunders: { transitId: string }[] };
const BLUNDER_NIGHTS = new Set(truth.blunders.map((b) => b.transitId.split('/')[0]));

test('the overview colours the demo nights by unit-weight error; a blunder night stands out; an edit reduces only its night', async ({ page }) => {
  test.setTimeout(300_000);
  const nights = await openArchiveWithDemo(page);
  // The first pass reduces every night in the worker, with progress the page stays usable during.
  await expect(page.getByText(/^Reducing nights for the overview/)).toBeVisible();
  await openNightAt(page, 5);
  await expect(page.getByRole('heading', { name: /^Night of \d{4}-/ })).toBeVisible({ timeout: 5_000 });
  await expect(page.getByText(`Reduced ${nights} nights; 0 unchanged from the last pass.`)).toBeVisible({ timeout: 240_000 });
  // An unchanged pass (cheap stamps, no transit body read): printed, not asserted as a timing.
  const passStart = Date.now();
  await page.getByRole('button', { name: 'Reduce changed nights' }).click();
  await expect(page.getByText(`Unit-weight errors of ${nights} nights, unchanged since their last reduction.`)).toBeVisible({ timeout: 60_000 });
  console.log(`unchanged UWE pass on the demo (${nights} nights): ${Date.now() - passStart} ms from the click to the status`);
  // Each night's class from its name, by the legend's limits (below 1.2, 1.2 to 2, 2 to 5, 5 and above).
  const classOf = (label: string) => {
    const uwe = /unit-weight error (\d+\.\d\d)$/.exec(label)?.[1];
    return uwe === undefined ? 'not-reduced' : String([1.2, 2, 5].filter((limit) => Number(uwe) >= limit).length);
  };
  const classes = (await allNightNames(page)).map(({ id, label }) => [id, classOf(label)] as const);
  expect(classes).toHaveLength(nights);
  // The canvas painted as many marks of each class as the names say, but for names whose
  // two-decimal value sits on a class limit (1.20 may be 1.196, class 0): those may go either way.
  const perClass = new Map<string, number>();
  for (const [, c] of classes) perClass.set(c, (perClass.get(c) ?? 0) + 1);
  const onLimit = (await allNightNames(page)).filter(({ label }) => /unit-weight error (1\.20|2\.00|5\.00)$/.test(label)).length;
  const paintedNow = async () => new Map(((await page.locator('figure.overview canvas').getAttribute('data-painted')) ?? '').split(' ').map((p) => [p.split(':')[0], Number(p.split(':')[1])]));
  const differences = (seen: Map<string, number>) => [...new Set([...seen.keys(), ...perClass.keys()])].reduce((sum, c) => sum + Math.abs((seen.get(c) ?? 0) - (perClass.get(c) ?? 0)), 0);
  const painted = await paintedNow();
  expect(differences(painted), `painted ${JSON.stringify([...painted])}, named ${JSON.stringify([...perClass])}`).toBeLessThanOrEqual(2 * onLimit);
  const clean = classes.filter(([id]) => !BLUNDER_NIGHTS.has(id)).map(([, c]) => c);
  const planted = classes.filter(([id]) => BLUNDER_NIGHTS.has(id));
  expect(planted.length, 'planted-blunder nights found among the marks').toBeGreaterThanOrEqual(5);
  const histogram = new Map<string, number>();
  for (const c of clean) histogram.set(c, (histogram.get(c) ?? 0) + 1);
  expect(histogram.size, `classes seen: ${JSON.stringify([...histogram])}`).toBeGreaterThanOrEqual(3);
  const [commonest] = [...histogram].sort((a, b) => b[1] - a[1])[0];
  // The worst class holds a larger share of the planted-blunder nights than of the clean ones.
  const share = (list: readonly string[]) => list.filter((c) => c === '3').length / list.length;
  expect(share(planted.map(([, c]) => c))).toBeGreaterThan(share(clean));
  const [worstId, worstClass] = planted.filter(([, c]) => c !== 'not-reduced').sort((a, b) => Number(b[1]) - Number(a[1]))[0];
  expect(Number(worstClass)).toBeGreaterThan(Number(commonest));
  const worstIndex = classes.findIndex(([id]) => id === worstId);
  const blunder = await moveCursorTo(page, worstIndex);
  await expect(blunder).toHaveAttribute('data-night-id', worstId);
  await expect(blunder).toHaveAttribute('aria-label', /^Night of \d{4}-\d\d-\d\d, \d+ transits with [^,]+, unit-weight error \d+\.\d\d$/);
  for (const label of ['below 1.2', '1.2 to 2', '2 to 5', '5 and above', 'not reduced']) await expect(page.locator('figcaption.legend')).toContainText(label);

  // The night detail repeats it; day and night screenshots; the red theme shows no green or blue.
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('night-quality')).toContainText(/unit-weight error \d+\.\d\d \(right ascension/);
  await page.screenshot({ path: 'e2e-output/screenshots/day-archive-uwe.png', fullPage: true });
  await page.locator('figure.overview').screenshot({ path: 'e2e-output/screenshots/day-archive-uwe-overview.png' });
  await page.getByRole('button', { name: 'Night (red)' }).click();
  await moveCursorTo(page, 201);
  await page.screenshot({ path: 'e2e-output/screenshots/night-archive-uwe.png', fullPage: true });
  await page.locator('figure.overview').screenshot({ path: 'e2e-output/screenshots/night-archive-uwe-overview.png' });
  expect(await findNonRedColours(page, 0)).toEqual([]);
  await page.getByRole('button', { name: 'Day' }).click();

  // Back to transit counts and again, by keyboard.
  await page.getByRole('button', { name: 'Transit count', exact: true }).press('Enter');
  await expect(page.getByText('Colour: transits in the night')).toBeVisible();
  const canvas = page.locator('figure.overview canvas');
  await expect(canvas).toHaveAttribute('data-colour-by', 'count');
  // By count, every mark is painted in one of the count steps.
  const steps = ((await canvas.getAttribute('data-painted')) ?? '').split(' ').map((part) => part.split(':'));
  expect(steps.every(([key]) => /^step-[0-4]$/.test(key))).toBe(true);
  expect(steps.reduce((sum, [, n]) => sum + Number(n), 0)).toBe(nights);
  await page.getByRole('button', { name: 'Unit-weight error', exact: true }).press('Enter');
  await expect(canvas).toHaveAttribute('data-colour-by', 'uwe');
  expect(await paintedNow()).toEqual(painted);

  // Rejecting a transit reduces that night only (the others come from the worker's cache).
  await page.getByLabel('Edits recorded as').fill('R. Vance');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await page.getByRole('button', { name: /^Reject / }).first().click();
  await expect(page.getByText(`Reduced 1 night; ${nights - 1} unchanged from the last pass.`)).toBeVisible({ timeout: 60_000 });
  await expect(page.getByTestId('night-quality')).toContainText('1 rejected by hand');
});

test('screenshots of the Archive with the demo, day and night; night shows no green or blue', async ({ page }) => {
  await openArchiveWithDemo(page);
  await openNightAt(page, 200);
  await page.screenshot({ path: 'e2e-output/screenshots/day-archive-demo.png', fullPage: true });
  await page.getByRole('button', { name: 'Night (red)' }).click();
  await moveCursorTo(page, 201);
  await page.screenshot({ path: 'e2e-output/screenshots/night-archive-demo.png', fullPage: true });
  expect(await findNonRedColours(page, 0)).toEqual([]);
});

test('an address #/archive?night=ID (a plot click-through) opens that night', async ({ page }) => {
  await page.goto('./#/archive?night=night-2020-11-03');
  await expect(page.getByRole('heading', { name: /^Night of 2020-11-03/ })).toBeVisible({ timeout: 20_000 });
  await page.evaluate(() => (window.location.hash = '#/archive?night=night-2022-01-12'));
  await expect(page.getByRole('heading', { name: /^Night of 2022-01-12/ })).toBeVisible();
});

// Figures for a big archive (printed, never asserted as timings): ~10,000 nights and ~100,000
// transits made by copying demo rows into 1990–2018 (invented, like the demo), then the
// overview's first paint, its longest main-thread task, a re-colour, and the key stage's reads.
test('a 10,000-night archive: overview render and key-stage figures', async ({ page }) => {
  test.setTimeout(600_000);
  const demoNights = await openArchiveWithDemo(page);
  const added = await page.evaluate(async (target) => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => { const r = indexedDB.open('meridian-ledger-archive'); r.onsuccess = () => resolve(r.result); r.onerror = () => reject(r.error); });
    const read = <T,>(store: string) => new Promise<T[]>((resolve) => { const r = db.transaction(store).objectStore(store).getAll(); r.onsuccess = () => resolve(r.result as T[]); });
    const nights = await read<{ id: string; localDate: string; instrumentId: string }>('nights');
    // Transits are stored in groups (schema v4, renderer/store/transitGroups.ts): the template is a stored transit.
    type Transit = { id: string; nightId: string; starId: string; utcMjd: number; importId?: string };
    const [firstGroup] = await read<{ transits: Transit[] }>('transitGroups');
    const transit = firstGroup.transits[0];
    const extra = target - nights.length;
    const added: Transit[] = [];
    // The derived per-night tallies (schema v3) written beside, as the app's own writers keep them.
    const tx = db.transaction(['nights', 'transitGroups', 'nightTallies'], 'readwrite');
    for (let i = 0; i < extra; i++) {
      const model = nights[i % nights.length];
      const date = new Date(Date.UTC(1990, 0, 1) + Math.floor(i / 2) * 86_400_000 * (10_585 / (extra / 2))).toISOString().slice(0, 10);
      const id = `bench-night-${i}`;
      const instrumentId = nights[i % 2 === 0 ? 0 : nights.findIndex((n) => n.instrumentId !== nights[0].instrumentId)].instrumentId;
      tx.objectStore('nights').put({ ...model, id, localDate: date, instrumentId, importId: undefined });
      tx.objectStore('nightTallies').put({ nightId: id, instrumentId, localDate: date, transitCount: 10, rejectedCount: 0, firstUtcMjd: transit.utcMjd, lastUtcMjd: transit.utcMjd });
      for (let k = 0; k < 10; k++) added.push({ ...transit, id: `${id}/${k}`, nightId: id, starId: 'bench-no-such-star', importId: undefined });
    }
    // Their groups as the app cuts them (groupTransits): one star, ascending utcMjd then id, 64 at most
    // (all share one utcMjd, so the 400-day span never cuts).
    added.sort((a, b) => a.utcMjd - b.utcMjd || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
    for (let start = 0; start < added.length; start += 64) {
      const transits = added.slice(start, start + 64);
      tx.objectStore('transitGroups').put({ id: `bench-group-${start / 64}`, starId: transits[0].starId, firstUtcMjd: transits[0].utcMjd,
        lastUtcMjd: transits[transits.length - 1].utcMjd, nightIds: [...new Set(transits.map((t) => t.nightId))], importIds: [], transitCount: transits.length, transits });
    }
    await new Promise((resolve) => (tx.oncomplete = resolve));
    db.close();
    return extra;
  }, 10_000);
  await page.addInitScript(() => {
    const longest: number[] = [];
    (window as unknown as { longTasks: number[] }).longTasks = longest;
    new PerformanceObserver((list) => { for (const e of list.getEntries()) longest.push(e.duration, e.startTime); }).observe({ type: 'longtask', buffered: true });
  });
  await page.reload();
  const total = demoNights + added;
  // The canvas says what it painted (class:count pairs): the sum reaching every night is the whole overview drawn.
  const painted = (page: Page, atLeast: 'one' | 'all') => page.waitForFunction((wanted) => {
    const sum = ((document.querySelector('figure.overview canvas')?.getAttribute('data-painted') ?? '').match(/:\d+/g) ?? [])
      .reduce((total, part) => total + Number(part.slice(1)), 0);
    const all = Number(document.querySelector('figure.overview')?.getAttribute('data-night-count'));
    // 'all': the archive's own overview (not the copy of the last launch shown while it opens) wholly painted.
    const own = document.querySelector('[data-testid="overview-copy-note"]') === null;
    return (wanted === 'one' ? sum > 0 : own && sum >= all) && performance.now();
  }, atLeast, { timeout: 120_000, polling: 10 });
  const headingMs = Number(await (await painted(page, 'one')).jsonValue());
  await painted(page, 'all');
  const paintMs = await page.evaluate(() => new Promise<number>((resolve) => requestAnimationFrame(() => setTimeout(() => resolve(performance.now())))));
  await expect(page.locator('figure.overview')).toHaveAttribute('data-night-count', String(total));
  // Let the unit-weight-error pass colour the marks for a while (its updates repaint the canvas).
  await page.waitForTimeout(5_000);
  const longTasks = await page.evaluate(() => (window as unknown as { longTasks: number[] }).longTasks.slice());
  const recolourMs = await page.evaluate(async () => {
    const button = [...document.querySelectorAll('button')].find((b) => b.textContent === 'Transit count');
    const start = performance.now();
    button?.click();
    await new Promise((resolve) => requestAnimationFrame(() => setTimeout(resolve)));
    return performance.now() - start;
  });
  await expect(page.getByText('Colour: transits in the night')).toBeVisible();
  const reads = await page.evaluate(async () => {
    const db = await new Promise<IDBDatabase>((resolve) => { const r = indexedDB.open('meridian-ledger-archive'); r.onsuccess = () => resolve(r.result); });
    const done = (r: IDBRequest) => new Promise<unknown>((resolve) => { r.onsuccess = () => resolve(r.result); });
    type Group = { transits: { nightId: string }[] };
    let start = performance.now();
    const all = ((await done(db.transaction('transitGroups').objectStore('transitGroups').getAll())) as Group[]).flatMap((g) => g.transits);
    const bodiesMs = performance.now() - start;
    const ids = (await done(db.transaction('nights').objectStore('nights').getAllKeys())) as string[];
    start = performance.now();
    // A night's count: its groups through the multi-entry index 'nightIds', then its transits inside them.
    const tx = db.transaction('transitGroups');
    await Promise.all(ids.map(async (id) => ((await done(tx.objectStore('transitGroups').index('nightIds').getAll(IDBKeyRange.only(id)))) as Group[])
      .reduce((sum, g) => sum + g.transits.filter((t) => t.nightId === id).length, 0)));
    const countsMs = performance.now() - start;
    db.close();
    return { transits: all.length, nights: ids.length, bodiesMs, countsMs };
  });
  const load = await page.evaluate(() => navigator.hardwareConcurrency);
  console.log(`big archive: ${total} nights; first mark seen ${headingMs.toFixed(0)} ms (the last launch's copy or the archive's), all the archive's marks painted ${paintMs.toFixed(0)} ms after navigation start; long tasks (ms long @ ms after start) ${longTasks.flatMap((t, i) => (i % 2 === 0 ? [`${t.toFixed(0)} @ ${longTasks[i + 1].toFixed(0)}`] : [])).join(', ')}; re-colour ${recolourMs.toFixed(0)} ms; ` +
    `key-stage reads: all ${reads.transits} transit bodies (every group) ${reads.bodiesMs.toFixed(0)} ms vs ${reads.nights} night counts (groups via index nightIds) ${reads.countsMs.toFixed(0)} ms; ${load} cores`);
  expect(reads.transits).toBeGreaterThan(90_000);
  // The figures above are printed, not asserted (a quiet machine may show no task over 50 ms at all);
  // what must hold is that this Chromium reports long tasks, so an empty list means none happened.
  expect(await page.evaluate(() => PerformanceObserver.supportedEntryTypes.includes('longtask'))).toBe(true);
  expect(longTasks.length % 2).toBe(0);
});

test('on a later launch the overview shows the last launch\'s nights while the archive is still opening, then the archive\'s', async ({ page }) => {
  const nights = await openArchiveWithDemo(page);
  await expect(page.locator('figure.overview')).toHaveAttribute('data-night-count', String(nights));
  // The next launch: openArchive's first IndexedDB call is held back 4 s (a million-transit archive's store may take 1–3 s on 2 cores).
  await page.addInitScript(() => {
    const original = IDBFactory.prototype.databases;
    IDBFactory.prototype.databases = function (this: IDBFactory) {
      return new Promise((resolve) => setTimeout(resolve, 4000)).then(() => original.call(this));
    };
  });
  await page.reload();
  await expect(page.getByTestId('overview-copy-note')).toBeVisible({ timeout: 3_000 });
  await expect(page.getByRole('heading', { name: `Nights (${nights})` })).toBeVisible();
  await expect(page.locator('figure.overview')).toHaveAttribute('data-night-count', String(nights));
  // Moving by keyboard works on the copy; opening a night says it must wait for the archive.
  await moveCursorTo(page, 3);
  await expect(nightCursor(page)).toHaveAttribute('aria-label', NAME);
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('overview-copy-note')).toHaveText(/still opening: open the night again/);
  // Then the archive's own overview replaces the copy, and a night opens.
  await expect(page.getByTestId('overview-copy-note')).toHaveCount(0, { timeout: 15_000 });
  await expect(page.getByText(/^Reducing nights for the overview|^Reduced|^Unit-weight errors/)).toBeVisible();
  await openNightAt(page, 3);
  await expect(page.getByRole('heading', { name: /^Night of \d{4}-\d{2}-\d{2}/ })).toBeVisible();
});
