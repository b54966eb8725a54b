import { BundleError, type BundleHeader, type BundleManifest } from '../../core/archive/bundle-format.ts';
import { BundleReader } from '../../core/archive/bundle-reader.ts';
import { decodeUtf8 } from '../../core/formats/utf8.ts';
import { TaskCancelledError, type TaskControl } from '../../core/task/task-control.ts';
import { ARCHIVE_SCHEMA_VERSION, type ArchiveDatabase } from '../store/database.ts';
import { gunzipBytes } from './gzip.ts';

/** A bundle read whole and verified (header, every table's row count and SHA-256). */
export interface VerifiedBundle {
  readonly header: BundleHeader;
  readonly manifest: BundleManifest;
  readonly rows: ReadonlyMap<string, readonly unknown[]>;
}

/** Lines checked between two yields to the host. */
const VERIFY_CHUNK_LINES = 5_000;

/**
 * Decompresses and verifies a bundle before anything is written. Refused, with the reason: not
 * gzip or damaged gzip, invalid UTF-8, a newer bundle format or archive schema than this build
 * knows, a table this archive does not have, a truncated bundle (no manifest), or a table whose
 * row count or SHA-256 differs from the manifest.
 */
export async function verifyBundle(database: ArchiveDatabase, bytes: Uint8Array, control: TaskControl): Promise<VerifiedBundle> {
  const decoded = decodeUtf8(await gunzipBytes(bytes));
  if (!decoded.ok) throw new BundleError(`the bundle is not valid UTF-8: ${decoded.reason}`, null);
  const known = new Set(database.tables.map((t) => t.name));
  const rows = new Map<string, unknown[]>();
  const reader = new BundleReader((table, row) => {
    let list = rows.get(table);
    if (list === undefined) rows.set(table, (list = []));
    list.push(row);
  });
  const lines = decoded.text.split('\n');
  if (lines.at(-1) === '') lines.pop();
  for (let i = 0; i < lines.length; i++) {
    reader.line(lines[i]);
    if (i === 0) checkSchema(JSON.parse(lines[0]) as BundleHeader);
    if ((i + 1) % VERIFY_CHUNK_LINES === 0) {
      if (control.cancellation.isCancelled) throw new TaskCancelledError('the bundle check', i + 1);
      control.reportProgress(i + 1, lines.length);
      await control.yieldToHost();
    }
  }
  const { header, manifest } = reader.finish();
  for (const table of manifest.tables) {
    if (!known.has(table.name)) throw new BundleError(`the bundle holds a table "${table.name}" this archive does not have; update Meridian Ledger`, null);
  }
  control.reportProgress(lines.length, lines.length);
  return { header, manifest, rows };
}

function checkSchema(header: BundleHeader): void {
  if (header.schemaVersion > ARCHIVE_SCHEMA_VERSION) {
    throw new BundleError(`the bundle was written with archive schema ${header.schemaVersion}, newer than this program's (${ARCHIVE_SCHEMA_VERSION}); update Meridian Ledger to restore it`, 1);
  }
}

/** Rows in the tables a user would lose by a replace (every table but settings). */
export async function countArchiveRows(database: ArchiveDatabase): Promise<number> {
  const counts = await Promise.all(database.tables.filter((t) => t.name !== 'settings').map((t) => t.count()));
  return counts.reduce((a, b) => a + b, 0);
}

export type RestoreMode = 'into-empty' | 'replace';

/**
 * Writes a verified bundle into the archive in ONE IndexedDB transaction, so a crash, a closed
 * window or a quota error leaves the archive exactly as it was (IndexedDB aborts the whole
 * transaction). 'into-empty' refuses an archive that holds any row — a restore never mixes with
 * existing data; 'replace' (which the view offers only after an explicit confirmation) clears
 * every table inside the same transaction. Rows are written as the bundle holds them, ids,
 * import ids and every float bit for bit.
 */
export async function restoreBundle(database: ArchiveDatabase, bundle: VerifiedBundle, mode: RestoreMode): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  await database.transaction('rw', database.tables, async () => {
    if (mode === 'into-empty') {
      const existing = await countArchiveRows(database);
      if (existing > 0) {
        throw new Error(`The archive already holds ${existing} rows; a restore never mixes with them. Choose "Replace the archive" (after exporting a bundle of it) or restore into an empty archive.`);
      }
    } else {
      for (const table of database.tables) await table.clear();
    }
    for (const [name, rows] of bundle.rows) {
      await database.table(name).bulkPut(rows as object[]);
      counts[name] = rows.length;
    }
  });
  return counts;
}
