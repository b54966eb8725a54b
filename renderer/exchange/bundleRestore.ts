import { BundleError, SIMULATION_TRUTH_TABLE, type BundleHeader, type BundleManifest } from '../../core/archive/bundle-format.ts';
import { BundleReader } from '../../core/archive/bundle-reader.ts';
import { decodeUtf8 } from '../../core/formats/utf8.ts';
import { TaskCancelledError, UNCONTROLLED, type TaskControl } from '../../core/task/task-control.ts';
import { ARCHIVE_SCHEMA_VERSION, type ArchiveDatabase } from '../store/database.ts';
import { gunzipBytes } from './gzip.ts';
import { talliesFromRows } from '../store/nightTallies.ts';
import { archiveTableNames, countTableRows, inWriteOrder, TRANSITS, writeTableRows } from '../store/archiveTables.ts';
import type { NightRecord, TransitRecord } from '../../core/archive/records.ts';

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
  const inflated = await gunzipBytes(bytes);
  const known = new Set([...archiveTableNames(database), SIMULATION_TRUTH_TABLE]);
  const rows = new Map<string, unknown[]>();
  const reader = new BundleReader((table, row) => {
    let list = rows.get(table);
    if (list === undefined) rows.set(table, (list = []));
    list.push(row);
  });
  let lineNumber = 0;
  for (const { lines, fractionRead } of utf8LineBlocks(inflated)) {
    // The line count is known only at the end: estimated from the share of bytes read.
    const estimatedLines = Math.max(lineNumber + lines.length, Math.round((lineNumber + lines.length) / fractionRead));
    for (const line of lines) {
      reader.line(line);
      if (lineNumber === 0) checkSchema(JSON.parse(line) as BundleHeader);
      if (++lineNumber % VERIFY_CHUNK_LINES === 0) {
        if (control.cancellation.isCancelled) throw new TaskCancelledError('the bundle check', lineNumber);
        control.reportProgress(lineNumber, estimatedLines);
        await control.yieldToHost();
      }
    }
  }
  const { header, manifest } = reader.finish();
  for (const table of manifest.tables) {
    if (!known.has(table.name)) throw new BundleError(`the bundle holds a table "${table.name}" this archive does not have; update Meridian Ledger`, null);
  }
  control.reportProgress(lineNumber, lineNumber);
  return { header, manifest, rows };
}

/** Bytes of decompressed bundle decoded per block (a block ends after a line break where it can). */
const DECODE_BLOCK_BYTES = 8 << 20;

/**
 * The lines of UTF-8 bytes (split at "\n", a last empty line dropped), decoded a block at a time
 * so the bundle is never one string (a million rows pass V8's longest string), with the share of
 * bytes read so far. A leading byte-order mark is dropped, as decodeUtf8 of the whole does; invalid
 * UTF-8 anywhere is refused with decodeUtf8's message for the whole bytes (offset from the start).
 */
function* utf8LineBlocks(bytes: Uint8Array): Generator<{ lines: string[]; fractionRead: number }> {
  const decoder = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });
  const hasBom = bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf;
  const refuse = (): never => {
    const whole = decodeUtf8(bytes);
    throw new BundleError(`the bundle is not valid UTF-8: ${whole.ok ? 'a block could not be decoded' : whole.reason}`, null);
  };
  let pendingTail = '';
  for (let start = hasBom ? 3 : 0; start < bytes.length; ) {
    let end = Math.min(bytes.length, start + DECODE_BLOCK_BYTES);
    if (end < bytes.length) {
      const lastBreak = bytes.lastIndexOf(0x0a, end - 1);
      if (lastBreak >= start) end = lastBreak + 1;
    }
    let text = '';
    try {
      // stream: a block cut inside a very long line may split a multi-byte sequence.
      text = decoder.decode(bytes.subarray(start, end), { stream: end < bytes.length });
    } catch {
      refuse();
    }
    const lines = (pendingTail + text).split('\n');
    pendingTail = lines.pop() ?? '';
    start = end;
    yield { lines, fractionRead: end / bytes.length };
  }
  if (pendingTail !== '') yield { lines: [pendingTail], fractionRead: 1 };
}

function checkSchema(header: BundleHeader): void {
  if (header.schemaVersion > ARCHIVE_SCHEMA_VERSION) {
    throw new BundleError(`the bundle was written with archive schema ${header.schemaVersion}, newer than this program's (${ARCHIVE_SCHEMA_VERSION}); update Meridian Ledger to restore it`, 1);
  }
}

/** Rows in the tables a user would lose by a replace (every table but settings). */
export async function countArchiveRows(database: ArchiveDatabase): Promise<number> {
  const counts = await Promise.all(archiveTableNames(database).filter((name) => name !== 'settings').map((name) => countTableRows(database, name)));
  return counts.reduce((a, b) => a + b, 0);
}

/** Transits are stored in groups without a per-transit key, so a bundle listing one id twice is refused. */
function requireDistinctTransitIds(transits: readonly TransitRecord[]): void {
  const seen = new Set<string>();
  for (const [k, t] of transits.entries()) {
    if (seen.has(t.id)) throw new BundleError(`the bundle's transits table lists the id "${t.id}" twice (row ${k + 1} of the table); nothing was restored`, null);
    seen.add(t.id);
  }
}

export type RestoreMode = 'into-empty' | 'replace';

/** Rows per write inside the restore's one transaction (transits: in groups, transitGroups.ts). */
const RESTORE_CHUNK_ROWS = 10_000;

/**
 * Writes a verified bundle into the archive in ONE IndexedDB transaction, so a crash, a closed
 * window or a quota error leaves the archive exactly as it was (IndexedDB aborts the whole
 * transaction). 'into-empty' refuses an archive that holds any row — a restore never mixes with
 * existing data; 'replace' (which the view offers only after an explicit confirmation) clears
 * every table inside the same transaction. A cancel between chunks aborts it, leaving the archive
 * as it was. Rows are written as the bundle holds them, ids,
 * import ids and every float bit for bit. The night tallies (derived, never in a bundle) are then
 * computed from the restored nights and transits, in the same transaction.
 */
export async function restoreBundle(database: ArchiveDatabase, bundle: VerifiedBundle, mode: RestoreMode, control: TaskControl = UNCONTROLLED): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  const total = [...bundle.rows].reduce((sum, [name, rows]) => sum + (name === SIMULATION_TRUTH_TABLE ? 0 : rows.length), 0);
  let done = 0;
  await database.transaction('rw', database.tables, async () => {
    if (mode === 'into-empty') {
      const existing = await countArchiveRows(database);
      if (existing > 0) {
        throw new Error(`The archive already holds ${existing} rows; a restore never mixes with them. Choose "Replace the archive" (after exporting a bundle of it) or restore into an empty archive.`);
      }
    } else {
      for (const table of database.tables) await table.clear();
    }
    // Chunked only for progress and cancel: every chunk is in the one transaction. Never await
    // the host in here (a timer would let IndexedDB commit early); cancel arrives meanwhile.
    requireDistinctTransitIds((bundle.rows.get(TRANSITS) ?? []) as readonly TransitRecord[]);
    for (const [name, asStored] of bundle.rows) {
      if (name === SIMULATION_TRUTH_TABLE) continue; // checked, not restored: the archive keeps no truth
      const rows = inWriteOrder(name, asStored);
      for (let start = 0; start < rows.length; start += RESTORE_CHUNK_ROWS) {
        if (control.cancellation.isCancelled) throw new TaskCancelledError('the restore', done);
        const chunk = rows.slice(start, start + RESTORE_CHUNK_ROWS) as object[];
        await writeTableRows(database, name, chunk);
        done += chunk.length;
        control.reportProgress(done, total);
      }
      counts[name] = rows.length;
    }
    const nights = (bundle.rows.get('nights') ?? []) as readonly NightRecord[];
    // A transit whose night the bundle lacks (a hand-made folder) is restored but has no night to tally under.
    const nightIds = new Set(nights.map((n) => n.id));
    const transits = ((bundle.rows.get('transits') ?? []) as readonly TransitRecord[]).filter((t) => nightIds.has(t.nightId));
    await database.nightTallies.bulkAdd(talliesFromRows(nights, transits));
  });
  return counts;
}
