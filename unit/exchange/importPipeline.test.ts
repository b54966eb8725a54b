import { describe, expect, test } from 'vitest';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { sweepInterruptedImports } from '../../renderer/store/importStaging.ts';
import { planImport, type ImportFileRequest } from '../../renderer/exchange/importPlan.ts';
import { beginImport, writeImport, STAGE_CHUNK_ROWS } from '../../renderer/exchange/stagedWriter.ts';
import type { ImportFileKind } from '../../renderer/exchange/importReport.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';
import { NOW, SITE_JSON, STAR_LIST_CSV, transitLine, transitLog, watchingControl } from './exchangeFixtures.ts';

function request(kind: ImportFileKind, bytes: Uint8Array, fileName = `file-${kind}`): ImportFileRequest {
  return { kind, bytes, fileName, defaultInstrumentId: null, columnMapping: {} };
}

async function importWhole(database: ArchiveDatabase, req: ImportFileRequest) {
  const plan = await planImport(database, req, NOW);
  const id = await beginImport(database, req.fileName, req.kind, NOW);
  await writeImport(database, id, plan.writes, UNCONTROLLED, () => NOW);
  return plan.report;
}

async function withPrerequisites(): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(uniqueDatabaseName('exchange'));
  await importWhole(database, request('site-description', encodeUtf8(SITE_JSON), 'site.json'));
  await importWhole(database, request('star-list', encodeUtf8(STAR_LIST_CSV), 'stars.csv'));
  return database;
}

/** Rows of one import still staged, over every table an import writes. */
async function stagedCount(database: ArchiveDatabase, importId: string): Promise<number> {
  const counts = await Promise.all([database.nights, database.transits].map((t) => t.where('importId').equals(importId).and((r) => r.visibility === 'staged').count()));
  return counts[0] + counts[1];
}

const visibleCount = (database: ArchiveDatabase) => database.transits.filter((t) => t.visibility === 'visible').count();

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

  test('staged rows stay invisible until the commit, and a cancel leaves nothing', async () => {
    const database = await withPrerequisites();
    const lines = Array.from({ length: STAGE_CHUNK_ROWS * 2 + 10 }, (_, day) => transitLine('QX-1', day));
    const plan = await planImport(database, request('transit-log', transitLog(lines)), NOW);
    expect(plan.report.validRows).toBe(lines.length);
    const importId = await beginImport(database, 'big.csv', 'transit-log', NOW);
    const seen: { staged: number; visible: number }[] = [];
    const control = watchingControl(async (calls) => {
      seen.push({ staged: await stagedCount(database, importId), visible: await visibleCount(database) });
      if (calls === 2) control.cancelled = true;
    });
    await expect(writeImport(database, importId, plan.writes, control, () => NOW)).rejects.toThrow(/cancelled/);
    expect(seen).toEqual([{ staged: STAGE_CHUNK_ROWS, visible: 0 }, { staged: STAGE_CHUNK_ROWS * 2, visible: 0 }]);
    expect(await database.transits.count()).toBe(0);
    expect(await database.nights.count()).toBe(0);
    expect((await database.imports.get(importId))?.status).toBe('abandoned');
    database.close();
  });

  test('an import interrupted mid-write (the page died) is swept at the next start', async () => {
    const name = uniqueDatabaseName('exchange-crash');
    const database = new ArchiveDatabase(name);
    await importWhole(database, request('site-description', encodeUtf8(SITE_JSON), 'site.json'));
    await importWhole(database, request('star-list', encodeUtf8(STAR_LIST_CSV), 'stars.csv'));
    const lines = Array.from({ length: STAGE_CHUNK_ROWS + 5 }, (_, day) => transitLine('QX-2', day));
    const plan = await planImport(database, request('transit-log', transitLog(lines)), NOW);
    const importId = await beginImport(database, 'crash.csv', 'transit-log', NOW);
    // The host never comes back after the first chunk: as if the window closed there.
    void writeImport(database, importId, plan.writes, watchingControl(() => new Promise<void>(() => {})), () => NOW);
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(await stagedCount(database, importId)).toBe(STAGE_CHUNK_ROWS);
    database.close();
    const reopened = new ArchiveDatabase(name);
    expect(await sweepInterruptedImports(reopened, NOW)).toBe(1);
    expect(await reopened.transits.count()).toBe(0);
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
    expect(await database.transits.count()).toBe(3);
    // The same star list again updates the stars in place (same ids), never doubles them.
    const before = await database.stars.orderBy('id').primaryKeys();
    await importWhole(database, request('star-list', encodeUtf8(STAR_LIST_CSV)));
    expect(await database.stars.orderBy('id').primaryKeys()).toEqual(before);
    database.close();
  });

  test('a quota error during staging leaves the earlier data unchanged', async () => {
    const database = await withPrerequisites();
    await importWhole(database, request('transit-log', transitLog([transitLine('QX-1', 0)])));
    const before = await database.transits.toArray();
    const lines = Array.from({ length: STAGE_CHUNK_ROWS + 20 }, (_, day) => transitLine('QX-2', day));
    const plan = await planImport(database, request('transit-log', transitLog(lines)), NOW);
    const original = database.transits.bulkPut.bind(database.transits);
    let calls = 0;
    database.transits.bulkPut = ((...args: Parameters<typeof original>) => {
      calls++;
      if (calls === 2) throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
      return original(...args);
    }) as typeof original;
    const importId = await beginImport(database, 'quota.csv', 'transit-log', NOW);
    await expect(writeImport(database, importId, plan.writes, UNCONTROLLED, () => NOW)).rejects.toMatchObject({ name: 'QuotaExceededError' });
    database.transits.bulkPut = original;
    expect(await database.transits.toArray()).toEqual(before);
    expect((await database.imports.get(importId))?.status).toBe('abandoned');
    database.close();
  });
});
