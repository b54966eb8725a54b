import { expect, test } from './fixtures.ts';

// An archive left by the schema before this one (version 3: one record per transit) is opened by
// the app: the upgrade runs in the worker (the window only waits), and every row comes back
// unchanged, the transits now in groups. The archive is the app's own demo (invented scenario),
// rewritten into a version 3 database by hand below.

/** The shipped version 3 stores (renderer/store/schemaV3.ts; a shipped schema never changes). */
const SCHEMA_V3: Record<string, string> = {
  sites: 'id, label, importId',
  instruments: 'id, siteId, label, importId',
  instrumentEvents: 'id, [instrumentId+utcMjd], importId',
  stars: 'id, catalogueId, label, *programmes, importId',
  nights: 'id, [instrumentId+localDate], [siteId+localDate], localDate, importId',
  transits: 'id, nightId, [starId+utcMjd], importId',
  earthOrientation: 'mjd',
  leapSeconds: 'mjd',
  reductions: 'id, createdUtc, inputFingerprint',
  imports: 'id, status, startedUtc',
  settings: 'key',
  nightTallies: 'nightId, [instrumentId+localDate]',
};

test('an archive of schema version 3 is upgraded in the worker on first open and keeps every row', async ({ page }) => {
  test.setTimeout(120_000);
  const workerLines: string[] = [];
  page.on('worker', (worker) => worker.on('console', (message) => workerLines.push(message.text())));
  // 1. The demo archive, loaded by the app at schema 4.
  await page.goto('./#/archive');
  await expect(page.getByRole('tabpanel')).toBeVisible();
  await expect(page.getByText('Opening the archive…')).toHaveCount(0);
  // Once the demo is in (the heading shows "Nights (0)" while it loads).
  const filled = page.getByRole('heading', { name: /^Nights \([1-9]\d*\)$/ });
  await expect(filled).toBeVisible({ timeout: 30_000 });
  const nightsHeading = await filled.innerText();
  // 2. On a page of the same origin that does not run the app, the same rows written into a version 3 database.
  await page.route('**/upgrade-blank.html', (route) => route.fulfill({ contentType: 'text/html', body: '<!doctype html><title>blank</title>' }));
  await page.goto('./upgrade-blank.html');
  const before = await page.evaluate(async (schema) => {
    const done = <T>(request: IDBRequest<T>) => new Promise<T>((resolve, reject) => { request.onsuccess = () => resolve(request.result); request.onerror = () => reject(request.error); });
    const name = 'meridian-ledger-archive';
    const current = await done(indexedDB.open(name));
    const rows: Record<string, unknown[]> = {};
    for (const store of [...current.objectStoreNames]) rows[store] = await done(current.transaction(store).objectStore(store).getAll());
    current.close();
    const groups = (rows.transitGroups ?? []) as { transits: { id: string }[] }[];
    delete rows.transitGroups;
    rows.transits = groups.flatMap((g) => g.transits).sort((a, b) => (a.id < b.id ? -1 : 1));
    await done(indexedDB.deleteDatabase(name));
    const open = indexedDB.open(name, 30); // Dexie keeps schema v as IndexedDB version 10·v
    open.onupgradeneeded = () => {
      for (const [table, spec] of Object.entries(schema)) {
        const [primary, ...indexes] = spec.split(',').map((part) => part.trim());
        const store = open.result.createObjectStore(table, { keyPath: primary });
        for (const index of indexes) {
          const multiEntry = index.startsWith('*');
          const bare = index.replace(/^[*&]/, '');
          const keyPath = bare.startsWith('[') ? bare.slice(1, -1).split('+') : bare;
          store.createIndex(bare, keyPath, { multiEntry });
        }
      }
    };
    const old = await done(open);
    for (const [table, list] of Object.entries(rows)) {
      if (!(table in schema)) continue;
      const tx = old.transaction(table, 'readwrite');
      for (const row of list) tx.objectStore(table).put(row);
      await new Promise<void>((resolve, reject) => { tx.oncomplete = () => resolve(); tx.onerror = () => reject(tx.error); });
    }
    old.close();
    return { transits: JSON.stringify(rows.transits), count: rows.transits.length, nights: rows.nights.length };
  }, SCHEMA_V3);
  expect(before.count).toBeGreaterThan(5_000);
  // 3. The app opens it: the worker upgrades, the window waits, every transit is kept.
  await page.goto('./#/archive');
  await expect(page.getByText('Opening the archive…')).toHaveCount(0, { timeout: 60_000 });
  await expect(page.getByRole('heading', { name: nightsHeading })).toBeVisible({ timeout: 30_000 });
  // The worker's stage report (renderer/exchange/stageClock.ts) names the upgrade.
  await expect.poll(() => workerLines.find((line) => line.includes('schema upgrade')) ?? workerLines.join(' | '), { timeout: 10_000 })
    .toMatch(/schema upgrade, stages in ms: open \(and upgrade\) to schema 4 \d+/);
  const after = await page.evaluate(async () => {
    const done = <T>(request: IDBRequest<T>) => new Promise<T>((resolve, reject) => { request.onsuccess = () => resolve(request.result); request.onerror = () => reject(request.error); });
    const db = await done(indexedDB.open('meridian-ledger-archive'));
    const stores = [...db.objectStoreNames];
    const groups = (await done(db.transaction('transitGroups').objectStore('transitGroups').getAll())) as { transits: { id: string }[] }[];
    db.close();
    return { version: db.version, stores, transits: JSON.stringify(groups.flatMap((g) => g.transits).sort((a, b) => (a.id < b.id ? -1 : 1))), groups: groups.length };
  });
  expect(after.version).toBe(40);
  expect(after.stores).not.toContain('transits');
  expect(after.transits).toBe(before.transits);
  // At most 64 transits a group: at least ⌈count / 64⌉ groups.
  expect(after.groups).toBeGreaterThanOrEqual(Math.ceil(before.count / 64));
});
