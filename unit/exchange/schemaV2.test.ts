import { Dexie } from 'dexie';
import { describe, expect, test } from 'vitest';
import { ArchiveDatabase, ARCHIVE_SCHEMA_VERSION } from '../../renderer/store/database.ts';
import { SCHEMA_V1 } from '../../renderer/store/schemaV1.ts';
import { siteRow, starRow, transitRow, uniqueDatabaseName } from '../store/rowFactories.ts';
import { transitById } from '../store/transitRows.ts';

describe('schema version 2 (settings table)', () => {
  test('a version-1 database with data opens with the current code: rows unchanged, settings usable', async () => {
    const name = uniqueDatabaseName('upgrade-v1-to-v2');
    const shipped = new Dexie(name);
    shipped.version(1).stores(SCHEMA_V1);
    const rows = { site: siteRow('s1', { heightM: 1234.5 }), star: starRow('x1', { parallaxMas: 0.1 + 0.2 }), transit: transitRow('t1', { utcMjd: 61_000.123456789 }) };
    await shipped.table('sites').put(rows.site);
    await shipped.table('stars').put(rows.star);
    await shipped.table('transits').put(rows.transit);
    shipped.close();
    const current = new ArchiveDatabase(name);
    await current.open();
    expect(ARCHIVE_SCHEMA_VERSION).toBeGreaterThanOrEqual(2);
    expect(current.verno).toBe(ARCHIVE_SCHEMA_VERSION);
    expect(await current.sites.get('s1')).toEqual(rows.site);
    expect(await current.stars.get('x1')).toEqual(rows.star);
    expect(Object.is((await transitById(current, 't1'))?.utcMjd, 61_000.123456789)).toBe(true);
    await current.settings.put({ key: 'lastExportedUtc', value: '2026-03-01T00:00:00.000Z' });
    expect(await current.settings.get('lastExportedUtc')).toEqual({ key: 'lastExportedUtc', value: '2026-03-01T00:00:00.000Z' });
    current.close();
  });
});
