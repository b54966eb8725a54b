import { describe, expect, test } from 'vitest';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { commitImport, sweepInterruptedImports } from '../../renderer/store/importStaging.ts';
import type { ImportRecord } from '../../core/archive/records.ts';
import { siteRow, starRow, transitRow, uniqueDatabaseName } from './rowFactories.ts';
import { putTransitRows, storedTransitCount, transitById } from './transitRows.ts';

const START = '2026-03-01T20:00:00.000Z';
const END = '2026-03-01T20:00:05.000Z';

function journal(id: string, status: ImportRecord['status']): ImportRecord {
  return {
    id, fileName: `${id}.csv`, format: 'test', status, startedUtc: START, finishedUtc: null,
    rowCounts: {}, rejectedRows: [],
  };
}

async function stagedArchive(): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(uniqueDatabaseName('staging'));
  await database.imports.bulkPut([journal('imp-a', 'staging'), journal('imp-b', 'committed')]);
  await database.stars.bulkPut([
    starRow('hand'), // entered by hand, no importId
    starRow('a1', { visibility: 'staged', importId: 'imp-a' }),
    starRow('b1', { visibility: 'visible', importId: 'imp-b' }),
  ]);
  await putTransitRows(database, [transitRow('a2', { visibility: 'staged', importId: 'imp-a' })]);
  return database;
}

describe('import staging', () => {
  test('commitImport(db, id) makes every staged row of that import visible at once', async () => {
    const database = await stagedArchive();
    await commitImport(database, 'imp-a', END);
    expect((await database.stars.get('a1'))?.visibility).toBe('visible');
    expect((await transitById(database, 'a2'))?.visibility).toBe('visible');
    expect(await database.imports.get('imp-a')).toMatchObject({ status: 'committed', finishedUtc: END });
    database.close();
  });

  test('commitImport of an import that is not staging fails and changes nothing', async () => {
    const database = await stagedArchive();
    await expect(commitImport(database, 'imp-b', END)).rejects.toThrow(/is committed, not staging/);
    await expect(commitImport(database, 'missing', END)).rejects.toThrow(/no import with id "missing"/);
    expect((await database.stars.get('a1'))?.visibility).toBe('staged');
    database.close();
  });

  test('sweepInterruptedImports(db) deletes only staged rows of imports still staging', async () => {
    const database = await stagedArchive();
    await database.sites.put(siteRow('site-hand'));
    expect(await sweepInterruptedImports(database, END)).toBe(1);
    expect((await database.stars.toCollection().primaryKeys()).sort()).toEqual(['b1', 'hand']);
    expect(await storedTransitCount(database)).toBe(0);
    expect(await database.sites.count()).toBe(1);
    expect((await database.imports.get('imp-a'))?.status).toBe('abandoned');
    expect(await sweepInterruptedImports(database, END)).toBe(0);
    database.close();
  });
});
