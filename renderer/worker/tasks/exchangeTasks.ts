import type { TaskControl } from '../../../core/task/task-control.ts';
import { decodeUtf8 } from '../../../core/formats/utf8.ts';
import { ArchiveDatabase } from '../../store/database.ts';
import { nowUtcIso } from '../../store/nowUtcIso.ts';
import { exportBundle, recordExport } from '../../exchange/bundleExport.ts';
import { countArchiveRows, restoreBundle, type RestoreMode } from '../../exchange/bundleRestore.ts';
import { importEarthOrientation, importLeapSecondsList } from '../../exchange/iersTables.ts';
import { planImport, type ImportFileRequest } from '../../exchange/importPlan.ts';
import type { ImportReport } from '../../exchange/importReport.ts';
import { beginImport, writeImport, type WriteImportOptions } from '../../exchange/stagedWriter.ts';
import { describeStorageError } from '../../exchange/describeStorageError.ts';
import { tableCsvBytes } from '../../exchange/tableExports.ts';
import { exportOldArchive } from '../../exchange/preUpgradeBackup.ts';
import { StageClock } from '../../exchange/stageClock.ts';
import { forgetParsedLog } from '../../exchange/parsedLogCache.ts';
import { forgetVerifiedBundle, verifyBundleOnce } from '../../exchange/verifiedBundleCache.ts';
import type { CsvTableName } from '../../../core/exchange-formats/archive-table-csv.ts';

/** Hooks for the end-to-end tests only; the view sends them only when the page has `?test-hooks`. */
export interface ExchangeTestHooks {
  /** Throw a QuotaExceededError DOMException from the n-th write of new transits (transitGroups.bulkAdd, 1-based). */
  readonly quotaOnTransitWrite?: number;
  /** Hold the import's transaction open this long at every chunk boundary, so a test can interrupt it mid-write. */
  readonly chunkDelayMs?: number;
  /** Rows per chunk (and per progress report) instead of WRITE_CHUNK_ROWS. */
  readonly chunkRows?: number;
}

export type ExchangeRequest =
  | { readonly kind: 'exchange-validate'; readonly databaseName: string; readonly file: ImportFileRequest }
  | { readonly kind: 'exchange-import'; readonly databaseName: string; readonly file: ImportFileRequest; readonly testHooks: ExchangeTestHooks | null }
  | { readonly kind: 'bundle-export'; readonly databaseName: string; readonly producer: string }
  | { readonly kind: 'bundle-verify'; readonly databaseName: string; readonly bytes: Uint8Array }
  | { readonly kind: 'bundle-restore'; readonly databaseName: string; readonly bytes: Uint8Array; readonly mode: RestoreMode }
  | { readonly kind: 'iers-import'; readonly databaseName: string; readonly fileName: string; readonly bytes: Uint8Array }
  | { readonly kind: 'table-export'; readonly databaseName: string; readonly table: CsvTableName }
  /** Opens the archive here, so a schema upgrade it needs runs in the worker, not in the window. */
  | { readonly kind: 'archive-upgrade'; readonly databaseName: string }
  /** A bundle of the archive as it is on disk, at its older schema, before the upgrade (preUpgradeBackup.ts). */
  | { readonly kind: 'archive-export-old'; readonly databaseName: string; readonly fromSchemaVersion: number; readonly createdUtc: string; readonly producer: string };

export type ExchangeResult =
  | { readonly kind: 'exchange-validate'; readonly report: ImportReport }
  | { readonly kind: 'exchange-import'; readonly report: ImportReport; readonly rowCounts: Readonly<Record<string, number>> }
  | { readonly kind: 'bundle-export'; readonly bytes: Uint8Array; readonly createdUtc: string; readonly rowCounts: Readonly<Record<string, number>> }
  | {
      readonly kind: 'bundle-verify';
      readonly createdUtc: string; readonly producer: string; readonly schemaVersion: number;
      readonly tables: readonly { readonly name: string; readonly rows: number }[]; readonly archiveRows: number;
    }
  | { readonly kind: 'bundle-restore'; readonly rowCounts: Readonly<Record<string, number>> }
  | { readonly kind: 'iers-import'; readonly what: 'leap-seconds' | 'earth-orientation'; readonly summary: string }
  | { readonly kind: 'table-export'; readonly table: CsvTableName; readonly bytes: Uint8Array; readonly rows: number }
  | { readonly kind: 'archive-upgrade'; readonly schemaVersion: number }
  | { readonly kind: 'archive-export-old'; readonly bytes: Uint8Array };

export const EXCHANGE_KINDS: readonly ExchangeRequest['kind'][] = ['exchange-validate', 'exchange-import', 'bundle-export', 'bundle-verify', 'bundle-restore', 'iers-import', 'table-export', 'archive-upgrade', 'archive-export-old'];

export function isExchangeKind(kind: string): kind is ExchangeRequest['kind'] {
  return (EXCHANGE_KINDS as readonly string[]).includes(kind);
}

function installTestHooks(database: ArchiveDatabase, hooks: ExchangeTestHooks | null): WriteImportOptions {
  if (hooks === null) return {};
  if (hooks.quotaOnTransitWrite !== undefined) {
    const original = database.transitGroups.bulkAdd.bind(database.transitGroups);
    let calls = 0;
    database.transitGroups.bulkAdd = ((...args: Parameters<typeof original>) => {
      calls++;
      if (calls === hooks.quotaOnTransitWrite) throw new DOMException('The quota has been exceeded (test hook).', 'QuotaExceededError');
      return original(...args);
    }) as typeof original;
  }
  return { chunkRows: hooks.chunkRows, chunkPauseMs: hooks.chunkDelayMs };
}

async function runIersImport(database: ArchiveDatabase, fileName: string, bytes: Uint8Array): Promise<ExchangeResult> {
  const decoded = decodeUtf8(bytes);
  if (!decoded.ok) throw new Error(`${fileName}: ${decoded.reason}`);
  if (/^#@/m.test(decoded.text)) {
    const info = await importLeapSecondsList(database, decoded.text, fileName, nowUtcIso());
    return { kind: 'iers-import', what: 'leap-seconds', summary: `${info.steps} leap-second steps from ${fileName}, valid until MJD ${info.expiresMjd}` };
  }
  const info = await importEarthOrientation(database, decoded.text, fileName, nowUtcIso());
  return { kind: 'iers-import', what: 'earth-orientation', summary: `${info.lastMjd - info.firstMjd + 1} days of Earth orientation from ${fileName} (observed to MJD ${info.lastObservedMjd})` };
}

async function runWith(database: ArchiveDatabase, request: ExchangeRequest, control: TaskControl): Promise<ExchangeResult> {
  // The parse of a validated transit log is kept for the import that follows it, and for nothing else.
  if (request.kind !== 'exchange-validate' && request.kind !== 'exchange-import') forgetParsedLog();
  // Likewise the bundle verified for the preview is kept for the restore that follows it.
  if (request.kind !== 'bundle-verify' && request.kind !== 'bundle-restore') forgetVerifiedBundle();
  switch (request.kind) {
    case 'exchange-validate':
      return { kind: request.kind, report: (await planImport(database, request.file, nowUtcIso())).report };
    case 'exchange-import': {
      const clock = new StageClock(`import of ${request.file.fileName}`);
      const writeOptions = installTestHooks(database, request.testHooks);
      const plan = await planImport(database, request.file, nowUtcIso(), clock);
      if (plan.report.missingPrerequisites.length > 0) throw new Error(plan.report.missingPrerequisites.join(' '));
      const importId = await beginImport(database, request.file.fileName, request.file.kind, nowUtcIso());
      const rowCounts = await writeImport(database, importId, plan.writes, control, nowUtcIso, writeOptions);
      clock.lap('write and commit');
      forgetParsedLog();
      clock.log();
      return { kind: request.kind, report: plan.report, rowCounts };
    }
    case 'bundle-export': {
      const createdUtc = nowUtcIso();
      const clock = new StageClock('bundle export');
      const exported = await exportBundle(database, control, createdUtc, request.producer, clock);
      clock.log();
      await recordExport(database, createdUtc);
      return { kind: request.kind, bytes: exported.bytes, createdUtc, rowCounts: exported.rowCounts };
    }
    case 'bundle-verify': {
      const bundle = await verifyBundleOnce(database, request.bytes, control);
      const { createdUtc, producer, schemaVersion } = bundle.header;
      return { kind: request.kind, createdUtc, producer, schemaVersion, tables: bundle.manifest.tables.map((t) => ({ name: t.name, rows: t.rows })), archiveRows: await countArchiveRows(database) };
    }
    case 'bundle-restore': {
      const clock = new StageClock('bundle restore');
      const verified = await verifyBundleOnce(database, request.bytes, control);
      clock.lap('unzip, read and verify (or the preview\'s check reused)');
      try {
        const rowCounts = await restoreBundle(database, verified, request.mode, control);
        clock.lap('write');
        clock.log();
        return { kind: request.kind, rowCounts };
      } finally {
        forgetVerifiedBundle();
      }
    }
    case 'iers-import':
      return runIersImport(database, request.fileName, request.bytes);
    case 'table-export':
      return { kind: request.kind, table: request.table, ...(await tableCsvBytes(database, request.table, control)) };
    case 'archive-export-old':
      throw new Error('archive-export-old runs without the archive database (runExchangeTask)');
    case 'archive-upgrade': {
      const clock = new StageClock('schema upgrade');
      await database.open();
      clock.lap(`open (and upgrade) to schema ${database.verno}`);
      clock.log();
      return { kind: request.kind, schemaVersion: database.verno };
    }
  }
}

const ACTIONS: Readonly<Record<ExchangeRequest['kind'], string>> = {
  'exchange-validate': 'Checking the file', 'exchange-import': 'The import', 'bundle-export': 'The export',
  'bundle-verify': 'Checking the bundle', 'bundle-restore': 'The restore', 'iers-import': 'The IERS import',
  'table-export': 'The table export', 'archive-upgrade': 'The archive upgrade', 'archive-export-old': 'The backup before the upgrade',
};

/**
 * Runs one Exchange job in the worker against the archive database named in the request (the
 * worker opens its own connection and closes it at the end, whatever happens).
 */
export async function runExchangeTask(request: ExchangeRequest, control: TaskControl): Promise<ExchangeResult> {
  if (request.kind === 'archive-export-old') {
    // Never through ArchiveDatabase: opening it would upgrade the archive before it is backed up.
    const { databaseName, fromSchemaVersion, createdUtc, producer } = request;
    return { kind: request.kind, bytes: await exportOldArchive(databaseName, fromSchemaVersion, createdUtc, producer) };
  }
  // An upgrade's progress (transits read and written) goes to the window's banner as the job's.
  const database = new ArchiveDatabase(request.databaseName, request.kind === 'archive-upgrade' ? { onUpgradeProgress: (done, total) => control.reportProgress(done, total) } : {});
  try {
    return await runWith(database, request, control);
  } catch (error) {
    // Our own refusals already say what is wrong; storage errors (Dexie, IndexedDB) get the advice.
    const name = error instanceof Error ? error.name : '';
    if (['Error', 'BundleError', 'SyntaxError', 'RangeError', 'TaskCancelledError'].includes(name)) throw error;
    throw new Error(describeStorageError(ACTIONS[request.kind], error).message);
  } finally {
    database.close();
  }
}
