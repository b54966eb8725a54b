import { TaskCancelledError, type TaskControl } from '../../core/task/task-control.ts';
import type { ImportRecord } from '../../core/archive/records.ts';
import type { Table } from 'dexie';
import type { ArchiveDatabase } from '../store/database.ts';
import { IMPORTABLE_TABLES } from '../store/importStaging.ts';
import { addToNightTallies, recountNightTallies } from '../store/nightTallies.ts';
import type { NightRecord, TransitRecord } from '../../core/archive/records.ts';
import { inWriteOrder, storedTable, writeTableRows } from '../store/archiveTables.ts';
import { removeTransitsOfImport, replaceTransits } from '../store/transitGroups.ts';

export type ImportableTableName = (typeof IMPORTABLE_TABLES)[number];

/** Replaces stored rows of one table by new versions with the same ids. */
async function writeUpdated(database: ArchiveDatabase, name: ImportableTableName, rows: readonly object[]): Promise<void> {
  if (name === 'transits') await replaceTransits(database, rows as readonly TransitRecord[]);
  else await (database[name] as unknown as Table).bulkPut(rows as object[]);
}

/**
 * Rows per bulkPut inside the import's transaction: big enough that IndexedDB's per-call overhead
 * vanishes, small enough for frequent progress and a prompt cancel.
 */
export const WRITE_CHUNK_ROWS = 10_000;

/** New rows to create per table, and rows that replace existing visible ones. */
export interface ImportWrites {
  readonly created: Partial<Record<ImportableTableName, readonly object[]>>;
  readonly updated: Partial<Record<ImportableTableName, readonly object[]>>;
}

/** Test-only knobs of writeImport (the end-to-end crash tests interrupt an import between chunks). */
export interface WriteImportOptions {
  /** Rows per bulkPut and per progress report; WRITE_CHUNK_ROWS unless given. */
  readonly chunkRows?: number;
  /** Hold the transaction open this long after each chunk (with cheap reads, so it stays alive). */
  readonly chunkPauseMs?: number;
}

/** Opens the journal entry of a new import in state `staging`; returns its id. */
export async function beginImport(database: ArchiveDatabase, fileName: string, format: string, startedUtc: string): Promise<string> {
  const id = crypto.randomUUID();
  const journal: ImportRecord = { id, fileName, format, status: 'staging', startedUtc, finishedUtc: null, rowCounts: {}, rejectedRows: [] };
  await database.imports.add(journal);
  return id;
}

/**
 * Writes an import's rows and makes them visible at once, as the user sees it (DESIGN.md §3),
 * in ONE IndexedDB transaction: rows are written visible, with the import's id, in bulkPuts of
 * `chunkRows`, with progress after each; the journal entry is marked committed at the end of the
 * same transaction. IndexedDB applies a transaction whole or not at all, so a crash, a closed
 * window, a cancel (checked between chunks; the worker reads its messages while it waits for the
 * database) or a quota error leaves the archive exactly as it was. No staged row is written and
 * nothing is rewritten at commit: staging and then flipping every row to visible cost two more
 * writes per row (a cursor flip of 20,000 rows took two minutes in Chromium). On any error the
 * journal entry is marked abandoned before the error is rethrown; if even that fails, the sweep at
 * next start marks it. Other readers of these tables wait until the transaction ends.
 *
 * Inside the transaction only the database is awaited (never the host: a timer would let
 * IndexedDB commit the transaction early), so `control.yieldToHost` is not called.
 */
export async function writeImport(
  database: ArchiveDatabase,
  importId: string,
  writes: ImportWrites,
  control: TaskControl,
  now: () => string,
  options: WriteImportOptions = {},
): Promise<Record<string, number>> {
  const chunkRows = options.chunkRows ?? WRITE_CHUNK_ROWS;
  if (!(Number.isInteger(chunkRows) && chunkRows > 0)) throw new RangeError(`writeImport: chunkRows ${chunkRows} must be a positive integer`);
  const total = IMPORTABLE_TABLES.reduce((sum, table) => sum + (writes.created[table]?.length ?? 0), 0);
  const rowCounts = countRows(writes);
  try {
    await database.transaction('rw', [database.imports, database.nightTallies, ...IMPORTABLE_TABLES.map((t) => storedTable(database, t))], async () => {
      await requireStaging(database, importId);
      let done = 0;
      for (const table of IMPORTABLE_TABLES) {
        const rows = inWriteOrder(table, writes.created[table] ?? []) as readonly object[];
        for (let start = 0; start < rows.length; start += chunkRows) {
          if (control.cancellation.isCancelled) throw new TaskCancelledError('the import', done);
          const chunk = rows.slice(start, start + chunkRows).map((row) => ({ ...row, visibility: 'visible', importId }));
          // Transits go into groups (transitGroups.ts, whose bulkAdd a test hook may patch).
          await writeTableRows(database, table, chunk);
          done += chunk.length;
          control.reportProgress(done, total);
          if ((options.chunkPauseMs ?? 0) > 0) await holdOpen(database, importId, options.chunkPauseMs as number);
        }
      }
      if (control.cancellation.isCancelled) throw new TaskCancelledError('the import', total);
      for (const table of IMPORTABLE_TABLES) {
        const rows = (writes.updated[table] ?? []).map((row) => ({ ...row, visibility: 'visible', importId }));
        if (rows.length > 0) await writeUpdated(database, table, rows);
      }
      await keepTalliesTrue(database, writes);
      await database.imports.update(importId, { rowCounts, status: 'committed', finishedUtc: now() });
    });
    return rowCounts;
  } catch (error) {
    await abandonImport(database, importId, now()).catch(() => undefined);
    throw error;
  }
}

/** The night tallies (schema v3) of the rows just written, in the import's transaction. */
async function keepTalliesTrue(database: ArchiveDatabase, writes: ImportWrites): Promise<void> {
  const created = (writes.created.transits ?? []) as readonly TransitRecord[];
  const asWritten = created.map((t) => ({ nightId: t.nightId, utcMjd: t.utcMjd, userRejected: t.userRejected, visibility: 'visible' as const }));
  await addToNightTallies(database, asWritten, (writes.created.nights ?? []) as readonly NightRecord[]);
  const replaced = (writes.updated.transits ?? []) as readonly TransitRecord[];
  if (replaced.length > 0) await recountNightTallies(database, replaced.map((t) => t.nightId));
}

async function requireStaging(database: ArchiveDatabase, importId: string): Promise<void> {
  const journal = await database.imports.get(importId);
  if (journal === undefined) throw new Error(`writeImport: no import with id "${importId}" in the archive; start the import again.`);
  if (journal.status !== 'staging') throw new Error(`writeImport: import "${importId}" is ${journal.status}, not staging; start the import again.`);
}

/** Keeps the transaction alive for `ms` with cheap reads (test hook only: a timer would end it). */
async function holdOpen(database: ArchiveDatabase, importId: string, ms: number): Promise<void> {
  const until = performance.now() + ms;
  while (performance.now() < until) await database.imports.get(importId);
}

function countRows(writes: ImportWrites): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const table of IMPORTABLE_TABLES) {
    const n = (writes.created[table]?.length ?? 0) + (writes.updated[table]?.length ?? 0);
    if (n > 0) counts[table] = n;
  }
  return counts;
}

/**
 * Deletes any staged rows of one import (an archive written before imports became one
 * transaction may hold some) and marks it abandoned; committed rows are never touched.
 */
export async function abandonImport(database: ArchiveDatabase, importId: string, finishedUtc: string): Promise<void> {
  await database.transaction('rw', [database.imports, ...IMPORTABLE_TABLES.map((t) => storedTable(database, t))], async () => {
    if ((await database.imports.get(importId))?.status !== 'staging') return; // committed or already abandoned: leave it
    for (const table of IMPORTABLE_TABLES) {
      if (table === 'transits') await removeTransitsOfImport(database, importId, (t) => t.visibility === 'staged');
      else await database.table(table).where('importId').equals(importId).and((row) => row.visibility === 'staged').delete();
    }
    await database.imports.update(importId, { status: 'abandoned', finishedUtc });
  });
}
