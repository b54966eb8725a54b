import { BundleWriter, type ByteSink } from '../../core/archive/bundle-writer.ts';
import { TaskCancelledError, type TaskControl } from '../../core/task/task-control.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import { ARCHIVE_SCHEMA_VERSION, type ArchiveDatabase } from '../store/database.ts';
import { archiveTableNames, readTableRows, storedTable } from '../store/archiveTables.ts';
import { gzipBlocks } from './gzip.ts';
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
 * table per archive table (archiveTables.ts: the Dexie tables, transits as rows). Every table is read in one read-only transaction, so
 * the bundle is one consistent snapshot; rows still staged by an unfinished import are left
 * out (they are not part of the archive yet), and so are derived tables (DERIVED_TABLES: rebuilt
 * after a restore). Serialising yields to the host every
 * EXPORT_CHUNK_ROWS rows for progress and cancel.
 */
export async function exportBundle(database: ArchiveDatabase, control: TaskControl, createdUtc: string, producer: string, clock?: StageClock): Promise<ExportedBundle> {
  const names = archiveTableNames(database);
  const snapshot = await database.transaction('r', names.map((name) => storedTable(database, name)), () => Promise.all(names.map((name) => readTableRows(database, name))));
  clock?.lap('read');
  const writer = new BundleWriter({ schemaVersion: ARCHIVE_SCHEMA_VERSION, createdUtc, producer });
  // UTF-8 bytes line by line (never the whole bundle as one string: a million rows would pass
  // the longest string the engine holds), gathered into blocks for the compressor.
  const blocks = new ByteBlocks();
  blocks.push(encodeUtf8(writer.start()));
  const rowCounts: Record<string, number> = {};
  const total = snapshot.reduce((sum, rows) => sum + rows.length, 0);
  let done = 0;
  for (const [k, name] of names.entries()) {
    blocks.push(encodeUtf8(writer.beginTable(name)));
    const rows = snapshot[k].filter((row) => (row as { visibility?: string }).visibility !== 'staged');
    rowCounts[name] = rows.length;
    for (const row of rows) {
      writer.rowInto(row, blocks);
      if (++done % EXPORT_CHUNK_ROWS === 0) {
        if (control.cancellation.isCancelled) throw new TaskCancelledError('the bundle export', done);
        control.reportProgress(done, total);
        await control.yieldToHost();
      }
    }
  }
  blocks.push(encodeUtf8(writer.finish()));
  control.reportProgress(total, total);
  clock?.lap('serialise');
  const bytes = await gzipBlocks(blocks.finish());
  clock?.lap('gzip');
  return { bytes, rowCounts };
}

/** Small byte arrays gathered into blocks of about BLOCK_BYTES (a Blob of a million parts is slow to build). */
export class ByteBlocks implements ByteSink {
  static readonly BLOCK_BYTES = 4 << 20;
  readonly #blocks: Uint8Array[] = [];
  #current = new Uint8Array(ByteBlocks.BLOCK_BYTES);
  #used = 0;

  push(bytes: Uint8Array): void {
    if (this.#used + bytes.length > this.#current.length) {
      this.#blocks.push(this.#current.subarray(0, this.#used));
      this.#current = new Uint8Array(Math.max(ByteBlocks.BLOCK_BYTES, bytes.length));
      this.#used = 0;
    }
    this.#current.set(bytes, this.#used);
    this.#used += bytes.length;
  }

  reserve(maxBytes: number): { bytes: Uint8Array; offset: number } {
    if (this.#used + maxBytes > this.#current.length) {
      this.#blocks.push(this.#current.subarray(0, this.#used));
      this.#current = new Uint8Array(Math.max(ByteBlocks.BLOCK_BYTES, maxBytes));
      this.#used = 0;
    }
    return { bytes: this.#current, offset: this.#used };
  }

  commit(length: number): void {
    this.#used += length;
  }

  finish(): Uint8Array[] {
    this.#blocks.push(this.#current.subarray(0, this.#used));
    return this.#blocks;
  }
}

/** Records when the user last exported, for the reminder in the Exchange view. */
export async function recordExport(database: ArchiveDatabase, exportedUtc: string): Promise<void> {
  await database.settings.put({ key: LAST_EXPORTED_KEY, value: exportedUtc });
}
