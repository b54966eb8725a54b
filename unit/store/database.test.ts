import { describe, expect, test } from 'vitest';
import { Dexie } from 'dexie';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { SCHEMA_V1 } from '../../renderer/store/schemaV1.ts';
import { nightRow, siteRow, starRow, transitRow, uniqueDatabaseName } from './rowFactories.ts';
import { putTransitRows } from './transitRows.ts';
import { transitsOfNight, transitsOfStar } from '../../renderer/store/transitGroups.ts';

describe('ArchiveDatabase schema version 1', () => {
  test('SCHEMA_V1 is unchanged since it shipped (add a version 2 instead of editing it)', () => {
    // Tripwire: this literal is the shipped schema. If this fails, revert schemaV1.ts and add
    // schemaV2.ts with an upgrade function (renderer/store/database.ts explains how).
    expect(SCHEMA_V1).toEqual({
      sites: 'id, label, importId',
      instruments: 'id, siteId, label, importId',
      instrumentEvents: 'id, [instrumentId+utcMjd], importId',
      stars: 'id, catalogueId, label, *programmes, importId',
      nights: 'id, [instrumentId+localDate], [siteId+localDate], localDate, importId',
      transits: 'id, nightId, [starId+utcMjd], [instrumentId+utcMjd], utcMjd, importId',
      earthOrientation: 'mjd',
      leapSeconds: 'mjd',
      reductions: 'id, createdUtc, inputFingerprint',
      imports: 'id, status, startedUtc',
    });
  });

  test('opens with every table DESIGN.md §3 names (since version 2 settings, since version 3 nightTallies, since version 4 transits in groups)', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('tables'));
    await database.open();
    expect(database.verno).toBe(4);
    expect(database.tables.map((table) => table.name).sort()).toEqual(
      ['earthOrientation', 'imports', 'instrumentEvents', 'instruments', 'leapSeconds', 'nightTallies', 'nights',
        'reductions', 'settings', 'sites', 'stars', 'transitGroups'],
    );
    database.close();
  });

  test('transitsOfStar returns one star in a time range, in time order', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('by-star'));
    await putTransitRows(database, [
      transitRow('t3', { starId: 'star-a', utcMjd: 61_003.9 }),
      transitRow('t1', { starId: 'star-a', utcMjd: 61_001.9 }),
      transitRow('t2', { starId: 'star-b', utcMjd: 61_002.9 }),
      transitRow('t4', { starId: 'star-a', utcMjd: 61_010.9 }),
    ]);
    const found = await transitsOfStar(database, 'star-a', 61_000, 61_005);
    expect(found.map((row) => row.id)).toEqual(['t1', 't3']);
    database.close();
  });

  test('transits by night; version 4 stores them in groups indexed by star and time, nights and imports', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('by-night'));
    await putTransitRows(database, [
      transitRow('t1', { nightId: 'n1', instrumentId: 'i1', utcMjd: 61_001.8 }),
      transitRow('t2', { nightId: 'n1', instrumentId: 'i1', utcMjd: 61_001.7 }),
      transitRow('t3', { nightId: 'n2', instrumentId: 'i2', utcMjd: 61_001.75 }),
    ]);
    expect((await transitsOfNight(database, 'n1')).map((t) => t.id)).toEqual(['t2', 't1']);
    expect(database.transitGroups.schema.indexes.map((index) => index.name).sort()).toEqual(['[starId+firstUtcMjd]', '[starId+transitCount]', 'importIds', 'nightIds']);
    database.close();
  });

  test('nights by [instrumentId+localDate] and stars by multi-entry programmes', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('nights'));
    await database.nights.bulkPut([
      nightRow('n2', { instrumentId: 'i1', localDate: '2026-02-03' }),
      nightRow('n1', { instrumentId: 'i1', localDate: '2026-01-30' }),
      nightRow('n3', { instrumentId: 'i2', localDate: '2026-02-01' }),
    ]);
    const nights = await database.nights
      .where('[instrumentId+localDate]')
      .between(['i1', '2026-01-01'], ['i1', '2026-12-31'])
      .toArray();
    expect(nights.map((row) => row.id)).toEqual(['n1', 'n2']);
    await database.stars.bulkPut([
      starRow('s1', { programmes: ['north', 'clock'] }),
      starRow('s2', { programmes: ['south'] }),
    ]);
    expect(await database.stars.where('programmes').equals('clock').primaryKeys()).toEqual(['s1']);
    database.close();
  });

  test('rows written by a version-1 database are read back unchanged by the current code', async () => {
    // The template for every later upgrade test: write with the shipped schema, reopen with the
    // current class, compare. With only version 1 shipped it proves the class declares v1 as is.
    const name = uniqueDatabaseName('upgrade-from-v1');
    const shipped = new Dexie(name);
    shipped.version(1).stores(SCHEMA_V1);
    await shipped.table('sites').put(siteRow('s1', { heightM: 1234.5 }));
    shipped.close();
    const current = new ArchiveDatabase(name);
    expect(await current.sites.get('s1')).toEqual(siteRow('s1', { heightM: 1234.5 }));
    current.close();
  });
});
