import { TaskCancelledError, type TaskControl } from '../../core/task/task-control.ts';
import type { ImportRecord } from '../../core/archive/records.ts';
import type { Table } from 'dexie';
import type { ArchiveDatabase } from '../store/database.ts';
import { IMPORTABLE_TABLES, commitImport } from '../store/importStaging.ts';

export type ImportableTableName = (typeof IMPORTABLE_TABLES)[number];

/** The table object itself (`database.transits`), so a test hook that patches it is honoured. */
function tableOf(database: ArchiveDatabase, name: ImportableTableName): Table {
  return database[name] as unknown as Table;
}

/** Rows per write transaction while staging: small enough that a cancel or a crash loses little time. */
export const STAGE_CHUNK_ROWS = 500;

/** New rows to stage per table, and rows that replace existing visible ones (written at commit). */
export interface ImportWrites {
  readonly created: Partial<Record<ImportableTableName, readonly object[]>>;
  readonly updated: Partial<Record<ImportableTableName, readonly object[]>>;
}

/** Opens the journal entry of a new import in state `staging`; returns its id. */
export async function beginImport(database: ArchiveDatabase, fileName: string, format: string, startedUtc: string): Promise<string> {
  const id = crypto.randomUUID();
  const journal: ImportRecord = { id, fileName, format, status: 'staging', startedUtc, finishedUtc: null, rowCounts: {}, rejectedRows: [] };
  await database.imports.add(journal);
  return id;
}

/**
 * Writes an import's rows and makes them visible at once, as the user sees it (DESIGN.md §3):
 * new rows are written in chunks of STAGE_CHUNK_ROWS with `visibility: 'staged'` and the import's
 * id, yielding to the host between chunks (cancel, progress); rows that replace existing ones
 * are written only inside the final commit transaction, so an interrupted import never changes
 * or hides what was there. On cancel or any error the staged rows are deleted and the import is
 * marked abandoned before the error is rethrown (if even that fails, the sweep at next start
 * removes them).
 */
export async function writeImport(
  database: ArchiveDatabase,
  importId: string,
  writes: ImportWrites,
  control: TaskControl,
  now: () => string,
): Promise<Record<string, number>> {
  const created = IMPORTABLE_TABLES.flatMap((table) => (writes.created[table] ?? []).map((row) => ({ table, row })));
  const total = created.length;
  try {
    for (let done = 0; done < total; ) {
      if (control.cancellation.isCancelled) throw new TaskCancelledError('the import', done);
      const chunk = created.slice(done, done + STAGE_CHUNK_ROWS);
      await database.transaction('rw', IMPORTABLE_TABLES.map((t) => database.table(t)), async () => {
        for (const table of IMPORTABLE_TABLES) {
          const rows = chunk.filter((c) => c.table === table).map((c) => ({ ...c.row, visibility: 'staged', importId }));
          if (rows.length > 0) await tableOf(database, table).bulkPut(rows);
        }
      });
      done += chunk.length;
      control.reportProgress(done, total);
      await control.yieldToHost();
    }
    if (control.cancellation.isCancelled) throw new TaskCancelledError('the import', total);
    const rowCounts = countRows(writes);
    await database.transaction('rw', [database.imports, ...IMPORTABLE_TABLES.map((t) => database.table(t))], async () => {
      for (const table of IMPORTABLE_TABLES) {
        const rows = (writes.updated[table] ?? []).map((row) => ({ ...row, visibility: 'visible', importId }));
        if (rows.length > 0) await tableOf(database, table).bulkPut(rows);
      }
      await database.imports.update(importId, { rowCounts });
      await commitImport(database, importId, now());
    });
    return rowCounts;
  } catch (error) {
    await abandonImport(database, importId, now()).catch(() => undefined);
    throw error;
  }
}

function countRows(writes: ImportWrites): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const table of IMPORTABLE_TABLES) {
    const n = (writes.created[table]?.length ?? 0) + (writes.updated[table]?.length ?? 0);
    if (n > 0) counts[table] = n;
  }
  return counts;
}

/** Deletes the staged rows of one import and marks it abandoned; committed rows are never touched. */
export async function abandonImport(database: ArchiveDatabase, importId: string, finishedUtc: string): Promise<void> {
  await database.transaction('rw', [database.imports, ...IMPORTABLE_TABLES.map((t) => database.table(t))], async () => {
    for (const table of IMPORTABLE_TABLES) {
      await database.table(table).where('importId').equals(importId).and((row) => row.visibility === 'staged').delete();
    }
    await database.imports.update(importId, { status: 'abandoned', finishedUtc });
  });
}
