import { existsSync, readFileSync } from 'node:fs';
import { Dexie } from 'dexie';
import { describe, expect, test } from 'vitest';
import { ARCHIVE_SCHEMA_VERSION } from '../../renderer/store/database.ts';
import { openArchive } from '../../renderer/store/openArchive.ts';
import { loadShippedSchemas, storeFixturePath, type ShippedSchema } from '../fixtures/store/shippedSchemas.ts';
import { decodeStoreFixture } from '../fixtures/store/storeFixtureCodec.ts';
import type { StoreFixture } from '../fixtures/store/make-store-fixtures.ts';
import { derivedAfterUpgrade, expectedAfterUpgrade } from './migrationExpectations.ts';
import { uniqueDatabaseName } from './rowFactories.ts';
import { readTableRows, storedTable } from '../../renderer/store/archiveTables.ts';
import { transitsOfImport, transitsOfNight, transitsOfStar } from '../../renderer/store/transitGroups.ts';

// Source of the expected values: the committed fixtures unit/fixtures/store/archive-schema-v<N>.json,
// written by make-store-fixtures.ts from a database created at schema version N (the rows IndexedDB
// stored, not what this code would write). Every schema version below the current one is covered,
// found by listing renderer/store/schemaV*.ts.
const schemas = await loadShippedSchemas();
const earlier = schemas.filter((schema) => schema.version < ARCHIVE_SCHEMA_VERSION);
const current = schemas.find((schema) => schema.version === ARCHIVE_SCHEMA_VERSION);

function readFixture(version: number): StoreFixture {
  const path = storeFixturePath(version);
  if (!existsSync(path)) throw new Error(`Missing store fixture for schema version ${version} (${path}): run \`npm run fixtures:store\` and commit the file.`);
  return decodeStoreFixture(readFileSync(path, 'utf8')) as StoreFixture;
}

async function writeOldDatabase(name: string, schema: ShippedSchema, fixture: StoreFixture): Promise<void> {
  const old = new Dexie(name);
  old.version(schema.version).stores(schema.stores);
  await old.open();
  for (const [table, rows] of Object.entries(fixture.tables)) await old.table(table).bulkAdd([...rows]);
  old.close();
}

describe('the shipped schema versions', () => {
  test('renderer/store holds schemaV1 … schemaV<current> and the database class opens the newest', () => {
    expect(current, `renderer/store/schemaV${ARCHIVE_SCHEMA_VERSION}.ts must exist (ARCHIVE_SCHEMA_VERSION)`).toBeDefined();
    expect(schemas.at(-1)?.version).toBe(ARCHIVE_SCHEMA_VERSION);
    expect(earlier.length).toBe(ARCHIVE_SCHEMA_VERSION - 1);
  });
});

describe.each(earlier.map((schema) => [schema.version, schema] as const))('upgrade from schema version %i', (version, schema) => {
  const fixture = readFixture(version);

  test('the fixture was made by that schema and holds the awkward values it is meant to', () => {
    expect(fixture.schemaVersion).toBe(version);
    expect(fixture.stores, `schemaV${version}.ts differs from its fixture: a shipped schema is never edited`).toEqual(schema.stores);
    const numbers = JSON.stringify(fixture.tables, (_key, value: unknown) => (Object.is(value, -0) ? '«-0»' : Number.isNaN(value) ? '«NaN»' : value));
    expect(numbers).toContain('«-0»');
    expect(numbers).toContain('«NaN»');
    expect(numbers).toContain('5e-324');
    expect(Object.values(fixture.tables).every((rows) => rows.length > 0)).toBe(true);
  });

  test('the current code opens it, keeps every row and every value bit for bit', async () => {
    const name = uniqueDatabaseName(`migrate-v${version}`);
    await writeOldDatabase(name, schema, fixture);
    const hookVersions: number[] = [];
    const upgrades: [number, number][] = [];
    const opened = await openArchive(name, async (fromSchemaVersion) => {
      hookVersions.push(fromSchemaVersion);
      return null;
    }, (from, to) => upgrades.push([from, to]));
    if (opened.kind !== 'open') throw new Error(`openArchive failed on the v${version} fixture: ${JSON.stringify(opened.failure)}`);
    const database = opened.database;
    expect(hookVersions).toEqual([version]);
    // The app is told the upgrade starts (it says so in a banner while the rows are read).
    expect(upgrades).toEqual([[version, ARCHIVE_SCHEMA_VERSION]]);
    expect(database.verno).toBe(ARCHIVE_SCHEMA_VERSION);
    for (const [table, rows] of Object.entries(fixture.tables)) {
      const expected = rows.map((row) => expectedAfterUpgrade(version, ARCHIVE_SCHEMA_VERSION, table, row));
      // Read as the app reads the table (archiveTables.ts: transits out of their groups since v4).
      const stored = await readTableRows(database, table);
      expect(stored.length, `row count of ${table}`).toBe(expected.length);
      // toStrictEqual compares numbers with Object.is: −0 stays −0, NaN stays NaN.
      expect(stored, `rows of ${table}`).toStrictEqual(expected);
    }
    if ('transits' in fixture.tables) {
      // The v4 upgrade groups every transit row, staged or not, by star (transitGroups.ts).
      const groups = await database.transitGroups.toArray();
      expect(groups.map((g) => g.transits.map((t) => t.id)).sort(), 'transit groups after the v4 upgrade').toEqual(fixture.tables.transits.map((t) => [t.id]).sort());
    }
    const nightId = fixture.tables.nights[0].id as string;
    const derived = derivedAfterUpgrade(version, ARCHIVE_SCHEMA_VERSION, nightId);
    for (const [table, rows] of Object.entries(derived)) {
      expect(await database.table(table).toArray(), `derived table ${table} filled by the upgrade`).toStrictEqual(rows);
    }
    const storesOfTables = new Set(Object.keys(fixture.tables).map((table) => storedTable(database, table).name));
    const added = Object.keys(current?.stores ?? {}).filter((table) => current?.stores[table] !== null && !(table in fixture.tables) && !(table in derived) && !storesOfTables.has(table));
    for (const table of added) {
      expect(await database.table(table).count(), `table ${table} added after v${version} starts empty`).toBe(0);
    }
    database.close();
  });

  test('after the upgrade every single-field index finds the rows that carry its field', async () => {
    const name = uniqueDatabaseName(`migrate-index-v${version}`);
    await writeOldDatabase(name, schema, fixture);
    const opened = await openArchive(name);
    if (opened.kind !== 'open') throw new Error(`openArchive failed: ${JSON.stringify(opened.failure)}`);
    const database = opened.database;
    let checked = 0;
    for (const [table, rows] of Object.entries(fixture.tables)) {
      if (table === 'transits') continue; // stored in groups since v4: checked through their indexes below
      const dexieTable = database.table(table);
      const primaryKey = dexieTable.schema.primKey.keyPath as string;
      for (const index of dexieTable.schema.indexes.filter((spec) => !spec.compound && !spec.multi)) {
        const field = index.keyPath as string;
        for (const row of rows.filter((candidate) => typeof candidate[field] === 'string' || typeof candidate[field] === 'number')) {
          const found = await dexieTable.where(field).equals(row[field] as string | number).primaryKeys();
          expect(found, `${table}.${field} = ${String(row[field])}`).toContain(row[primaryKey]);
          checked += 1;
        }
      }
    }
    expect(checked).toBeGreaterThan(10);
    const clockStars = await database.stars.where('programmes').equals('clock').primaryKeys();
    expect(clockStars).toEqual(['star-1']);
    const series = (await transitsOfStar(database, 'star-1')).map((t) => t.id);
    expect(series).toEqual(['transit-1']);
    // Each transit is found in its night and, when an import wrote it, in its import (the groups' multi-entry indexes).
    for (const row of fixture.tables.transits ?? []) {
      expect((await transitsOfNight(database, row.nightId as string)).map((t) => t.id), `night of ${String(row.id)}`).toContain(row.id);
      if (typeof row.importId === 'string') expect((await transitsOfImport(database, row.importId)).map((t) => t.id), `import of ${String(row.id)}`).toContain(row.id);
    }
    await database.settings.put({ key: 'after-upgrade', value: -0 });
    expect(Object.is((await database.settings.get('after-upgrade'))?.value, -0)).toBe(true);
    database.close();
  });
});
