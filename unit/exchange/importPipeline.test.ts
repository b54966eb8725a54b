import { describe, expect, test } from 'vitest';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import { Dexie } from 'dexie';
import { UNCONTROLLED, type TaskControl } from '../../core/task/task-control.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { sweepInterruptedImports } from '../../renderer/store/importStaging.ts';
import { planImport, type ImportFileRequest } from '../../renderer/exchange/importPlan.ts';
import { beginImport, writeImport } from '../../renderer/exchange/stagedWriter.ts';
import type { ImportFileKind } from '../../renderer/exchange/importReport.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';
import { NOW, SITE_JSON, STAR_LIST_CSV, transitLine, transitLog } from './exchangeFixtures.ts';
import { storedTransitCount } from '../store/transitRows.ts';
import { allTransits } from '../../renderer/store/transitGroups.ts';

function request(kind: ImportFileKind, bytes: Uint8Array, fileName = `file-${kind}`): ImportFileRequest {
  return { kind, bytes, fileName, defaultInstrumentId: null, columnMapping: {} };
}

async function importWhole(database: ArchiveDatabase, req: ImportFileRequest) {
  const plan = await planImport(database, req, NOW);
  const id = await beginImport(database, req.fileName, req.kind, NOW);
  await writeImport(database, id, plan.writes, UNCONTROLLED, () => NOW);
  return plan.report;
}

async function withPrerequisites(name = uniqueDatabaseName('exchange')): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(name);
  await importWhole(database, request('site-description', encodeUtf8(SITE_JSON), 'site.json'));
  await importWhole(database, request('star-list', encodeUtf8(STAR_LIST_CSV), 'stars.csv'));
  return database;
}

/** Rows per chunk in these tests: small, so that a few hundred rows make several chunks. */
const CHUNK = 100;

/** A control that calls `onProgress(done)` at every progress report and cancels when told. */
function progressControl(onProgress: (done: number) => void): TaskControl & { cancelled: boolean } {
  const control = {
    cancelled: false,
    cancellation: { get isCancelled() { return control.cancelled; } },
    reportProgress: (done: number) => onProgress(done),
    yieldToHost: () => Promise.resolve(),
  };
  return control;
}

const visibleCount = async (database: ArchiveDatabase) => (await allTransits(database)).filter((t) => t.visibility === 'visible').length;

describe('import pipeline (site, stars, transits) in fake-indexeddb', () => {
  test('valid + rejected = total for each file, and the counts land in the tables', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('exchange'));
    const site = await importWhole(database, request('site-description', encodeUtf8(SITE_JSON), 'site.json'));
    expect(site.validRows + site.rejectedRowCount).toBe(site.totalRows);
    expect(await database.instruments.get('qt-2')).toMatchObject({ siteId: 'quarry-hill', effectiveWavelengthNm: 600, readingUnit: 'micrometer-turn' });
    const stars = await importWhole(database, request('star-list', encodeUtf8(STAR_LIST_CSV), 'stars.csv'));
    expect(stars).toMatchObject({ totalRows: 3, validRows: 2, rejectedRowCount: 1 });
    expect(stars.rejected[0]).toMatchObject({ row: 3, column: 'raDeg' });
    // Unknown proper motion is stored as unknown (NaN), never as zero (FORMATS.md).
    const two = await database.stars.where('catalogueId').equals('QX-2').first();
    expect(Number.isNaN(two?.pmRaMasYr)).toBe(true);
    const log = transitLog([transitLine('QX-1', 0), transitLine('QX-2', 0), transitLine('QX-9', 1), 'QX-1,sideways,,,,,,,,,,,,']);
    const transits = await importWhole(database, request('transit-log', log, 'log.csv'));
    expect(transits).toMatchObject({ totalRows: 4, validRows: 2, rejectedRowCount: 2 });
    expect(transits.validRows + transits.rejectedRowCount).toBe(transits.totalRows);
    expect(await visibleCount(database)).toBe(2);
    expect(await database.nights.count()).toBe(1);
    database.close();
  });

  test('a transit log before its star list and site is refused with what to import first', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('exchange'));
    const plan = await planImport(database, request('transit-log', transitLog([transitLine('QX-1', 0)])), NOW);
    expect(plan.report.validRows).toBe(0);
    expect(plan.report.missingPrerequisites.join(' ')).toMatch(/star list.*first/);
    expect(plan.report.missingPrerequisites.join(' ')).toMatch(/site description.*first/);
    expect(plan.report.rejectedRowCount).toBe(1);
    database.close();
  });

  test('writeImport(db, id, writes, control) shows no row to another connection before the commit, and a cancel leaves nothing', async () => {
    const name = uniqueDatabaseName('exchange');
    const database = await withPrerequisites(name);
    const lines = Array.from({ length: CHUNK * 2 + 10 }, (_, day) => transitLine('QX-1', day));
    const plan = await planImport(database, request('transit-log', transitLog(lines)), NOW);
    expect(plan.report.validRows).toBe(lines.length);
    const importId = await beginImport(database, 'big.csv', 'transit-log', NOW);
    // A second connection, like the main thread while the worker imports: it reads what is committed.
    const reader = new ArchiveDatabase(name);
    const progress: number[] = [];
    const readsDuringWrite: Promise<number>[] = [];
    const control = progressControl((done) => {
      progress.push(done);
      readsDuringWrite.push(storedTransitCount(reader));
      if (progress.length === 4) control.cancelled = true;
    });
    await expect(writeImport(database, importId, plan.writes, control, () => NOW, { chunkRows: CHUNK })).rejects.toThrow(/cancelled/);
    // 2·CHUNK+10 nights then transits, CHUNK rows per report: the cancel lands before the 5th chunk.
    expect(progress).toEqual([CHUNK, 2 * CHUNK, 2 * CHUNK + 10, 3 * CHUNK + 10]);
    expect(await Promise.all(readsDuringWrite)).toEqual([0, 0, 0, 0]);
    expect(await storedTransitCount(database)).toBe(0);
    expect(await database.nights.count()).toBe(0);
    expect((await database.imports.get(importId))?.status).toBe('abandoned');
    reader.close();
    database.close();
  });

  test('an import whose transaction is lost mid-write (the page died) leaves no row, and the sweep at next start closes its journal', async () => {
    const name = uniqueDatabaseName('exchange-crash');
    const database = await withPrerequisites(name);
    const lines = Array.from({ length: CHUNK + 5 }, (_, day) => transitLine('QX-2', day));
    const plan = await planImport(database, request('transit-log', transitLog(lines)), NOW);
    const importId = await beginImport(database, 'crash.csv', 'transit-log', NOW);
    // What a dying page does to an unfinished transaction: IndexedDB discards it. No catch block of
    // ours runs then, so the journal entry is put back to what a crash leaves: still staging.
    const control = progressControl(() => Dexie.currentTransaction?.abort());
    await expect(writeImport(database, importId, plan.writes, control, () => NOW, { chunkRows: CHUNK })).rejects.toThrow();
    await database.imports.update(importId, { status: 'staging', finishedUtc: null });
    database.close();
    const reopened = new ArchiveDatabase(name);
    expect(await sweepInterruptedImports(reopened, NOW)).toBe(1);
    expect((await reopened.imports.get(importId))?.status).toBe('abandoned');
    expect(await storedTransitCount(reopened)).toBe(0);
    expect(await reopened.nights.count()).toBe(0);
    expect(await reopened.stars.count()).toBe(2);
    reopened.close();
  });

  test('importing the same log twice reports the duplicates and does not double them', async () => {
    const database = await withPrerequisites();
    const log = transitLog([transitLine('QX-1', 0), transitLine('QX-1', 1), transitLine('QX-2', 1)]);
    await importWhole(database, request('transit-log', log));
    const again = await importWhole(database, request('transit-log', log));
    expect(again).toMatchObject({ totalRows: 3, validRows: 0, duplicateCount: 3, rejectedRowCount: 3 });
    expect(again.rejected[0].reason).toMatch(/already in the archive/);
    expect(await storedTransitCount(database)).toBe(3);
    // The same star list again updates the stars in place (same ids), never doubles them.
    const before = await database.stars.orderBy('id').primaryKeys();
    await importWhole(database, request('star-list', encodeUtf8(STAR_LIST_CSV)));
    expect(await database.stars.orderBy('id').primaryKeys()).toEqual(before);
    database.close();
  });

  test('a quota error during staging leaves the earlier data unchanged', async () => {
    const database = await withPrerequisites();
    await importWhole(database, request('transit-log', transitLog([transitLine('QX-1', 0)])));
    const before = await allTransits(database);
    const lines = Array.from({ length: CHUNK + 20 }, (_, day) => transitLine('QX-2', day));
    const plan = await planImport(database, request('transit-log', transitLog(lines)), NOW);
    // New transits are written as groups (renderer/store/transitGroups.ts): the second group write fails.
    const original = database.transitGroups.bulkAdd.bind(database.transitGroups);
    let calls = 0;
    database.transitGroups.bulkAdd = ((...args: Parameters<typeof original>) => {
      calls++;
      if (calls === 2) throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
      return original(...args);
    }) as typeof original;
    const importId = await beginImport(database, 'quota.csv', 'transit-log', NOW);
    await expect(writeImport(database, importId, plan.writes, UNCONTROLLED, () => NOW, { chunkRows: CHUNK })).rejects.toMatchObject({ name: 'QuotaExceededError' });
    database.transitGroups.bulkAdd = original;
    expect(await allTransits(database)).toEqual(before);
    expect((await database.imports.get(importId))?.status).toBe('abandoned');
    database.close();
  });
});
