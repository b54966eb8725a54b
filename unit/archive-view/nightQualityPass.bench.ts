// Cost of the overview's unchanged UWE pass before its reductions: building every night's change
// key. "before" reads every transit body (the former nightQualityKey path); "after" reads each
// night's tally (nightTallies) and reads the audit trail and imports (nightQualityStamps.ts).
// Runs in Node on fake-indexeddb, on the shipped demo (invented, assets/demo) and on a generated
// archive of 100,000 transits. Prints medians of 3 and os.loadavg(); asserts nothing.
// `npx tsx unit/archive-view/nightQualityPass.bench.ts [transits]`
import 'fake-indexeddb/auto';
import { readFile } from 'node:fs/promises';
import { loadavg } from 'node:os';
import { pathToFileURL } from 'node:url';
import type { TransitRecord } from '../../core/archive/records.ts';
import { archiveContextKey, nightQualityKey } from '../../renderer/archive/nightQualityKey.ts';
import { NightChangeLedger, nightStampKey, readNightStamps } from '../../renderer/archive/nightQualityStamps.ts';
import { loadDemoIfFirstStart } from '../../renderer/demo/demoArchive.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { rebuildNightTallies } from '../../renderer/store/nightTallies.ts';
import { nightRow, siteRow, transitRow, uniqueDatabaseName } from '../store/rowFactories.ts';
import { putTransitRows, storedTransitCount } from '../store/transitRows.ts';
import { allTransits } from '../../renderer/store/transitGroups.ts';

async function keysBefore(database: ArchiveDatabase): Promise<number> {
  const [sites, nights, transits] = await Promise.all([database.sites.toArray(), database.nights.toArray(), allTransits(database)]);
  const byNight = new Map<string, TransitRecord[]>();
  for (const t of transits) {
    const list = byNight.get(t.nightId);
    if (list === undefined) byNight.set(t.nightId, [t]);
    else list.push(t);
  }
  const context = archiveContextKey(sites[0], [], []);
  return new Map(nights.map((n) => [n.id, nightQualityKey(context, n, byNight.get(n.id) ?? [])])).size;
}

async function keysAfter(database: ArchiveDatabase, ledger: NightChangeLedger): Promise<number> {
  const [sites, nights] = await Promise.all([database.sites.toArray(), database.nights.toArray()]);
  const { tallies } = await readNightStamps(database, nights, ledger);
  const context = archiveContextKey(sites[0], [], []);
  return new Map(nights.map((n) => [n.id, nightStampKey(context, n, tallies.get(n.id) ?? 'n=0', ledger.touched.get(n.id) ?? '')])).size;
}

async function median(times: number, body: () => Promise<unknown>): Promise<number> {
  const ms: number[] = [];
  for (let i = 0; i < times; i++) {
    const start = performance.now();
    await body();
    ms.push(performance.now() - start);
  }
  return ms.sort((a, b) => a - b)[Math.floor(times / 2)];
}

async function measure(label: string, database: ArchiveDatabase): Promise<void> {
  const transits = await storedTransitCount(database);
  const nights = await database.nights.count();
  const ledger = new NightChangeLedger();
  await keysAfter(database, ledger); // the first pass of a session starts the ledger
  const before = await median(3, () => keysBefore(database));
  const after = await median(3, () => keysAfter(database, ledger));
  console.log(`   ${label}: ${nights} nights, ${transits} transits — unchanged key pass before ${before.toFixed(0)} ms, after ${after.toFixed(0)} ms (×${(before / after).toFixed(1)}); loadavg ${loadavg().map((v) => v.toFixed(2)).join(' ')}`);
}

async function generated(transitCount: number): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(uniqueDatabaseName('bench-pass'));
  const perNight = 33;
  const nightCount = Math.ceil(transitCount / perNight);
  await database.sites.add(siteRow('site-1'));
  const nights = Array.from({ length: nightCount }, (_, i) => nightRow(`n-${i}`, { localDate: new Date(Date.UTC(2000, 0, 1 + i)).toISOString().slice(0, 10) }));
  await database.nights.bulkAdd(nights);
  for (let start = 0; start < transitCount; start += 10_000) {
    const rows = Array.from({ length: Math.min(10_000, transitCount - start) }, (_, k) => {
      const i = start + k;
      return transitRow(`t-${i}`, { nightId: `n-${Math.floor(i / perNight)}`, starId: `s-${i % 60}`, utcMjd: 51_544 + i / perNight });
    });
    await putTransitRows(database, rows);
  }
  await rebuildNightTallies(database); // written straight into the tables: the tallies as the app keeps them
  return database;
}

export async function run(): Promise<void> {
  const demo = new ArchiveDatabase(uniqueDatabaseName('bench-demo'));
  await loadDemoIfFirstStart(demo, async () => new Uint8Array(await readFile('assets/demo/demo-archive.mlbundle')), '2026-12-01T00:00:00.000Z');
  await measure('demo archive', demo);
  const size = Number(process.argv[2] ?? 100_000);
  await measure(`generated archive`, await generated(size));
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await run();
