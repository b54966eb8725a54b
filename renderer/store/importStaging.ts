import type { ArchiveDatabase } from './database.ts';
import { recountNightTallies } from './nightTallies.ts';
import { storedTable, TRANSITS } from './archiveTables.ts';
import { changeTransitsOfImport, removeTransitsOfImport, transitsOfImport } from './transitGroups.ts';

/** The tables whose rows an import may write; each carries `visibility` and `importId`. */
export const IMPORTABLE_TABLES = [
  'sites',
  'instruments',
  'instrumentEvents',
  'stars',
  'nights',
  'transits',
] as const;

function importableTables(database: ArchiveDatabase) {
  return IMPORTABLE_TABLES.map((name) => storedTable(database, name));
}

/** The importable tables other than transits (whose rows sit in groups: transitGroups.ts). */
function rowTables(database: ArchiveDatabase) {
  return IMPORTABLE_TABLES.filter((name) => name !== TRANSITS).map((name) => database.table(name));
}

/**
 * Makes every row staged under `importId` visible and marks the import committed, in one
 * transaction: the user sees the whole file or nothing. Fails (and changes nothing) when the
 * import is unknown or not staging.
 */
export async function commitImport(database: ArchiveDatabase, importId: string, finishedUtc: string): Promise<void> {
  await database.transaction('rw', [database.imports, database.nightTallies, ...importableTables(database)], async () => {
    const journal = await database.imports.get(importId);
    if (journal === undefined) {
      throw new Error(`commitImport: no import with id "${importId}" in the archive; start the import again.`);
    }
    if (journal.status !== 'staging') {
      throw new Error(`commitImport: import "${importId}" is ${journal.status}, not staging; it cannot be committed.`);
    }
    const touchedNights = (await transitsOfImport(database, importId)).map((t) => t.nightId);
    for (const table of rowTables(database)) {
      await table.where('importId').equals(importId).modify({ visibility: 'visible' });
    }
    await changeTransitsOfImport(database, importId, (t) => ({ ...t, visibility: 'visible' }));
    await recountNightTallies(database, touchedNights);
    await database.imports.update(importId, { status: 'committed', finishedUtc });
  });
}

/**
 * Deletes the staged rows of every import still `staging` (an import interrupted by a crash or a
 * closed window) and marks those imports abandoned; returns how many imports were swept. Call it
 * once at start, before any import runs. Committed rows are never touched.
 */
export async function sweepInterruptedImports(database: ArchiveDatabase, finishedUtc: string): Promise<number> {
  return database.transaction('rw', [database.imports, ...importableTables(database)], async () => {
    const interrupted = await database.imports.where('status').equals('staging').primaryKeys();
    for (const importId of interrupted) {
      for (const table of rowTables(database)) {
        await table.where('importId').equals(importId).and((row) => row.visibility === 'staged').delete();
      }
      await removeTransitsOfImport(database, importId, (t) => t.visibility === 'staged');
      await database.imports.update(importId, { status: 'abandoned', finishedUtc });
    }
    return interrupted.length;
  });
}
