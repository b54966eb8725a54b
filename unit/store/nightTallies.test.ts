import { readFile } from 'node:fs/promises';
import { describe, expect, test } from 'vitest';
import { Dexie } from 'dexie';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import type { TransitRecord } from '../../core/archive/records.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { SCHEMA_V2 } from '../../renderer/store/schemaV2.ts';
import { commitImport, sweepInterruptedImports } from '../../renderer/store/importStaging.ts';
import { readNightTallies, talliesFromRows, type NightTallyRecord } from '../../renderer/store/nightTallies.ts';
import { beginImport, writeImport } from '../../renderer/exchange/stagedWriter.ts';
import { exportBundle } from '../../renderer/exchange/bundleExport.ts';
import { restoreBundle, verifyBundle } from '../../renderer/exchange/bundleRestore.ts';
import { addTransit } from '../../renderer/tonight/tonightStore.ts';
import { ArchiveEditor } from '../../renderer/archive/archiveEditor.ts';
import { DEMO_IMPORT_ID, loadDemoIfFirstStart, removeDemoArchive } from '../../renderer/demo/demoArchive.ts';
import { nightRow, transitRow, uniqueDatabaseName } from './rowFactories.ts';
import { putTransitRows, transitById } from './transitRows.ts';
import { allTransits } from '../../renderer/store/transitGroups.ts';
import { transitsOfImport } from '../../renderer/store/transitGroups.ts';

// Expected tallies are counted by hand from the invented rows each test writes, except where a
// test compares with talliesFromRows over the whole table (its own check on a large set), which
// the first test checks by hand.
const NOW = '2026-03-20T12:00:00.000Z';

function tally(nightId: string, transitCount: number, rejectedCount: number, firstUtcMjd: number, lastUtcMjd: number, localDate = '2026-01-01'): NightTallyRecord {
  return { nightId, instrumentId: 'instr-1', localDate, transitCount, rejectedCount, firstUtcMjd, lastUtcMjd };
}

async function archiveWith(nights: string[], transits: TransitRecord[]): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(uniqueDatabaseName('tallies'));
  await database.nights.bulkPut(nights.map((id, k) => nightRow(id, { localDate: `2026-01-0${k + 1}` })));
  await putTransitRows(database, transits);
  // Written around the app's paths, so the starting tallies are computed here.
  await database.nightTallies.bulkPut(talliesFromRows(await database.nights.toArray(), transits));
  return database;
}

/** What the tallies must be: recomputed from every stored night and transit. */
async function recomputed(database: ArchiveDatabase): Promise<NightTallyRecord[]> {
  const expected = talliesFromRows(await database.nights.toArray(), await allTransits(database));
  return expected.sort((a, b) => `${a.instrumentId} ${a.localDate}`.localeCompare(`${b.instrumentId} ${b.localDate}`));
}

describe('talliesFromRows (in memory)', () => {
  test('counts visible transits per night, rejected among them, first and last UTC; staged rows and empty nights give nothing', () => {
    const tallies = talliesFromRows([nightRow('n1'), nightRow('n2', { localDate: '2026-01-02' }), nightRow('n3')], [
      transitRow('a', { nightId: 'n1', utcMjd: 61_000.8 }),
      transitRow('b', { nightId: 'n1', utcMjd: 61_000.7, userRejected: true }),
      transitRow('c', { nightId: 'n1', utcMjd: 61_000.9 }),
      transitRow('d', { nightId: 'n2', utcMjd: 61_001.75 }),
      transitRow('e', { nightId: 'n2', utcMjd: 61_001.5, visibility: 'staged', importId: 'unfinished' }),
    ]);
    expect(tallies).toStrictEqual([tally('n1', 3, 1, 61_000.7, 61_000.9), tally('n2', 1, 0, 61_001.75, 61_001.75, '2026-01-02')]);
  });

  test('a transit of a night the archive does not hold is refused with its night id', () => {
    expect(() => talliesFromRows([], [transitRow('a', { nightId: 'lost' })])).toThrow(/night "lost"/);
  });
});

describe('every path that writes transits keeps nightTallies true', () => {
  test('the version 3 upgrade fills the tallies of a version 2 archive', async () => {
    const name = uniqueDatabaseName('tallies-upgrade');
    const old = new Dexie(name);
    old.version(2).stores(SCHEMA_V2);
    await old.table('nights').bulkPut([nightRow('n1'), nightRow('n2', { localDate: '2026-01-02' })]);
    await old.table('transits').bulkPut([
      transitRow('a', { nightId: 'n1', utcMjd: 61_000.8, userRejected: true }),
      transitRow('b', { nightId: 'n1', utcMjd: 61_000.6 }),
      transitRow('c', { nightId: 'n2', utcMjd: 61_001.7, visibility: 'staged', importId: 'x' }),
    ]);
    old.close();
    const database = new ArchiveDatabase(name);
    expect(await readNightTallies(database)).toStrictEqual([tally('n1', 2, 1, 61_000.6, 61_000.8)]);
    database.close();
  });

  test('an import adds to the tallies of existing nights and makes those of new ones; a failed import changes none', async () => {
    const database = await archiveWith(['n1'], [transitRow('a', { nightId: 'n1', utcMjd: 61_000.8 })]);
    const importId = await beginImport(database, 'log.csv', 'transit-log', NOW);
    await writeImport(database, importId, {
      created: {
        nights: [nightRow('n9', { localDate: '2026-01-09' })],
        transits: [transitRow('b', { nightId: 'n1', utcMjd: 61_000.95, userRejected: true }), transitRow('c', { nightId: 'n9', utcMjd: 61_008.8 }), transitRow('d', { nightId: 'n9', utcMjd: 61_008.7 })],
      },
      updated: {},
    }, UNCONTROLLED, () => NOW);
    const afterImport = [tally('n1', 2, 1, 61_000.8, 61_000.95), tally('n9', 2, 0, 61_008.7, 61_008.8, '2026-01-09')];
    expect(await readNightTallies(database)).toStrictEqual(afterImport);
    const failing = await beginImport(database, 'bad.csv', 'transit-log', NOW);
    // The second row names a night no one wrote: the tally refuses it inside the import's one transaction.
    await expect(writeImport(database, failing, { created: { transits: [transitRow('e', { nightId: 'n1', utcMjd: 61_000.99 }), transitRow('f', { nightId: 'nowhere' })] }, updated: {} }, UNCONTROLLED, () => NOW)).rejects.toThrow(/nowhere/);
    expect(await transitById(database, 'e')).toBeUndefined();
    expect(await readNightTallies(database)).toStrictEqual(afterImport);
    database.close();
  });

  test('the sweep of an interrupted (staged) import leaves the tallies alone; the old commit path counts the flipped rows', async () => {
    const database = await archiveWith(['n1'], [
      transitRow('a', { nightId: 'n1', utcMjd: 61_000.8 }),
      transitRow('s', { nightId: 'n1', utcMjd: 61_000.9, visibility: 'staged', importId: 'imp-old' }),
      transitRow('t', { nightId: 'n1', utcMjd: 61_000.95, visibility: 'staged', importId: 'imp-swept' }),
    ]);
    await database.imports.bulkPut([
      { id: 'imp-old', fileName: 'a.csv', format: 'transit-log', status: 'staging', startedUtc: NOW, finishedUtc: null, rowCounts: {}, rejectedRows: [] },
    ]);
    await commitImport(database, 'imp-old', NOW);
    expect(await readNightTallies(database)).toStrictEqual([tally('n1', 2, 0, 61_000.8, 61_000.9)]);
    await database.imports.put({ id: 'imp-swept', fileName: 'b.csv', format: 'transit-log', status: 'staging', startedUtc: NOW, finishedUtc: null, rowCounts: {}, rejectedRows: [] });
    expect(await sweepInterruptedImports(database, NOW)).toBe(1);
    expect(await transitById(database, 't')).toBeUndefined();
    expect(await readNightTallies(database)).toStrictEqual([tally('n1', 2, 0, 61_000.8, 61_000.9)]);
    database.close();
  });

  test("Tonight's live logging counts each accepted transit at once", async () => {
    const database = await archiveWith(['n1'], []);
    const night = nightRow('n1');
    const draft = { starId: 'star-1', culmination: 'upper' as const, clockMjd: 61_000.8, wireClockMjd: [], zenithReadings: [], note: '' };
    await addTransit(database, night, { ...draft, utcMjd: 61_000.8 });
    expect(await readNightTallies(database)).toStrictEqual([tally('n1', 1, 0, 61_000.8, 61_000.8)]);
    await addTransit(database, night, { ...draft, utcMjd: 61_000.75 });
    expect(await readNightTallies(database)).toStrictEqual([tally('n1', 2, 0, 61_000.75, 61_000.8)]);
    database.close();
  });

  test('archive edits: reject, restore and undo each move the rejected count', async () => {
    const database = await archiveWith(['n1'], [transitRow('a', { nightId: 'n1', utcMjd: 61_000.8 }), transitRow('b', { nightId: 'n1', utcMjd: 61_000.9 })]);
    const editor = new ArchiveEditor(database, () => 'T. Tester');
    await editor.setTransitRejected({ id: 'a', nightId: 'n1' }, true, 'transit a');
    expect(await readNightTallies(database)).toStrictEqual([tally('n1', 2, 1, 61_000.8, 61_000.9)]);
    await editor.setTransitRejected({ id: 'b', nightId: 'n1' }, true, 'transit b');
    expect((await readNightTallies(database))[0].rejectedCount).toBe(2);
    await editor.undo();
    expect((await readNightTallies(database))[0].rejectedCount).toBe(1);
    await editor.setTransitRejected({ id: 'a', nightId: 'n1' }, false, 'transit a');
    expect(await readNightTallies(database)).toStrictEqual([tally('n1', 2, 0, 61_000.8, 61_000.9)]);
    database.close();
  });

  test('a replace restore swaps the tallies for those of the bundle; export leaves them out', async () => {
    const source = await archiveWith(['n1', 'n2'], [transitRow('a', { nightId: 'n1', utcMjd: 61_000.8 }), transitRow('b', { nightId: 'n2', utcMjd: 61_001.8, userRejected: true })]);
    const exported = await exportBundle(source, UNCONTROLLED, NOW, 'test');
    expect(Object.keys(exported.rowCounts)).not.toContain('nightTallies');
    const target = await archiveWith(['m1'], [transitRow('z', { nightId: 'm1', utcMjd: 60_000.5 })]);
    await restoreBundle(target, await verifyBundle(target, exported.bytes, UNCONTROLLED), 'replace');
    expect(await readNightTallies(target)).toStrictEqual([tally('n1', 1, 0, 61_000.8, 61_000.8), tally('n2', 1, 1, 61_001.8, 61_001.8, '2026-01-02')]);
    source.close();
    target.close();
  });

  test('a restore keeps a transit whose night the bundle lacks, and tallies the others', async () => {
    const source = await archiveWith(['n1'], [transitRow('a', { nightId: 'n1', utcMjd: 61_000.8 })]);
    await putTransitRows(source, [transitRow('orphan', { nightId: 'not-in-bundle', utcMjd: 61_005.5 })]);
    const exported = await exportBundle(source, UNCONTROLLED, NOW, 'test');
    const target = new ArchiveDatabase(uniqueDatabaseName('tallies-orphan'));
    await restoreBundle(target, await verifyBundle(target, exported.bytes, UNCONTROLLED), 'into-empty');
    expect(await transitById(target, 'orphan')).toBeDefined();
    expect(await readNightTallies(target)).toStrictEqual([tally('n1', 1, 0, 61_000.8, 61_000.8)]);
    source.close();
    target.close();
  });

  test('the demo load fills the tallies and its removal takes them all away', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('tallies-demo'));
    const counts = await loadDemoIfFirstStart(database, async () => new Uint8Array(await readFile('assets/demo/demo-archive.mlbundle')), NOW);
    const tallies = await readNightTallies(database);
    expect(tallies.reduce((sum, t) => sum + t.transitCount, 0)).toBe(counts?.transits);
    expect(tallies).toStrictEqual(await recomputed(database));
    expect(tallies.length).toBeGreaterThan(100);
    expect((await transitsOfImport(database, DEMO_IMPORT_ID)).length).toBe(counts?.transits);
    await removeDemoArchive(database, NOW);
    expect(await readNightTallies(database)).toStrictEqual([]);
    database.close();
  });
});

describe('the version 3 upgrade at more than one page of transits', () => {
  test('5,001 transits over three nights (pages of 2,000) are all counted, a transit of a missing night is skipped', async () => {
    const name = uniqueDatabaseName('tallies-upgrade-pages');
    const old = new Dexie(name);
    old.version(2).stores(SCHEMA_V2);
    await old.table('nights').bulkPut([nightRow('n1'), nightRow('n2', { localDate: '2026-01-02' }), nightRow('n3', { localDate: '2026-01-03' })]);
    // Transit k goes to night n(1 + k mod 3) at 61000 + k/10000; every seventh is rejected.
    const rows = Array.from({ length: 5_001 }, (_, k) => transitRow(`t${String(k).padStart(5, '0')}`, { nightId: `n${1 + (k % 3)}`, utcMjd: 61_000 + k / 10_000, userRejected: k % 7 === 0 }));
    await old.table('transits').bulkPut([...rows, transitRow('orphan', { nightId: 'gone' })]);
    old.close();
    const database = new ArchiveDatabase(name);
    const tallies = await readNightTallies(database);
    // By hand: k ≡ 0 (mod 3) for k = 0…5000 gives 1,667 transits (first k 0, last 4998); k ≡ 1: 1,667 (1 … 4999); k ≡ 2: 1,667 (2 … 5000).
    // Rejected: k ≡ 0 (mod 21) within each class; k = 0, 21, …, 4998 gives 239 for n1; k ≡ 7 (mod 21) for n2 (k = 7 … 4999): 238; k ≡ 14 (mod 21) for n3 (14 … 4991): 238.
    expect(tallies).toStrictEqual([
      tally('n1', 1_667, 239, 61_000, 61_000 + 4_998 / 10_000),
      tally('n2', 1_667, 238, 61_000 + 1 / 10_000, 61_000 + 4_999 / 10_000, '2026-01-02'),
      tally('n3', 1_667, 238, 61_000 + 2 / 10_000, 61_000 + 5_000 / 10_000, '2026-01-03'),
    ]);
    database.close();
  });
});
