import { BundleWriter } from '../../core/archive/bundle-writer.ts';
import { TaskCancelledError, type TaskControl } from '../../core/task/task-control.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import { ARCHIVE_SCHEMA_VERSION, type ArchiveDatabase } from '../store/database.ts';
import { gzipBytes } from './gzip.ts';
import type { StageClock } from './stageClock.ts';

/** Rows serialised between two yields to the host. */
export const EXPORT_CHUNK_ROWS = 2_000;

/** Setting key of the last export's ISO 8601 UTC time. */
export const LAST_EXPORTED_KEY = 'lastExportedUtc';

export interface ExportedBundle {
  readonly bytes: Uint8Array;
  readonly rowCounts: Readonly<Record<string, number>>;
}

/**
 * The whole archive as a gzip-compressed bundle (core/archive/bundle-format.ts), one bundle
 * table per Dexie table under the same name. Every table is read in one read-only transaction, so
 * the bundle is one consistent snapshot; rows still staged by an unfinished import are left
 * out (they are not part of the archive yet). Serialising yields to the host every
 * EXPORT_CHUNK_ROWS rows for progress and cancel.
 */
export async function exportBundle(database: ArchiveDatabase, control: TaskControl, createdUtc: string, producer: string, clock?: StageClock): Promise<ExportedBundle> {
  const tables = database.tables;
  const snapshot = await database.transaction('r', tables, () => Promise.all(tables.map((t) => t.toArray())));
  clock?.lap('read');
  const writer = new BundleWriter({ schemaVersion: ARCHIVE_SCHEMA_VERSION, createdUtc, producer });
  const parts: string[] = [writer.start()];
  const rowCounts: Record<string, number> = {};
  const total = snapshot.reduce((sum, rows) => sum + rows.length, 0);
  let done = 0;
  for (const [k, table] of tables.entries()) {
    parts.push(writer.beginTable(table.name));
    const rows = snapshot[k].filter((row) => (row as { visibility?: string }).visibility !== 'staged');
    rowCounts[table.name] = rows.length;
    for (const row of rows) {
      parts.push(writer.row(row));
      if (++done % EXPORT_CHUNK_ROWS === 0) {
        if (control.cancellation.isCancelled) throw new TaskCancelledError('the bundle export', done);
        control.reportProgress(done, total);
        await control.yieldToHost();
      }
    }
  }
  parts.push(writer.finish());
  control.reportProgress(total, total);
  clock?.lap('serialise');
  const bytes = await gzipBytes(encodeUtf8(parts.join('')));
  clock?.lap('encode and gzip');
  return { bytes, rowCounts };
}

/** Records when the user last exported, for the reminder in the Exchange view. */
export async function recordExport(database: ArchiveDatabase, exportedUtc: string): Promise<void> {
  await database.settings.put({ key: LAST_EXPORTED_KEY, value: exportedUtc });
}
