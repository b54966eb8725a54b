import { Dexie } from 'dexie';
import type { ShellBridge } from '../../core/bridge.ts';
import { BundleWriter } from '../../core/archive/bundle-writer.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import type { ArchiveOpenFailure } from '../store/describeOpenFailure.ts';
import { nowUtcIso } from '../store/nowUtcIso.ts';
import { DERIVED_TABLES } from '../store/nightTallies.ts';
import { backupFileName, DEFAULT_BACKUP_KEEP } from './automaticBackups.ts';
import { gzipBlocks } from './gzip.ts';
import { ByteBlocks } from './bundleExport.ts';
import { logicalTableName } from '../store/archiveTables.ts';
import { transitRowsInIdOrder, type TransitGroupRecord } from '../store/transitGroups.ts';

/**
 * A bundle of an archive still at an older schema, read BEFORE the code's schema upgrades it.
 * Dexie cannot run code between "this database is older" and its own upgrade, so the old
 * database is opened first without any declared version (Dexie's dynamic mode reads the stores as
 * they are on disk and changes nothing), exported, closed, and only then opened by the app's
 * ArchiveDatabase, which upgrades it. The bundle's header carries the OLD schema version, so a
 * restore runs the same upgrade again. Staged rows of unfinished imports are left out, as in
 * exportBundle. Transits stored in groups (schema 4 on) are written as the bundle's `transits`
 * rows, in id order, as exportBundle writes them. Rows are serialised line by line into blocks,
 * never into one string (a million transits pass V8's longest string). Dynamic mode never
 * upgrades, so it may run in the worker (the app does: `archive-export-old` job).
 */
export async function exportOldArchive(name: string, fromSchemaVersion: number, createdUtc: string, producer: string): Promise<Uint8Array> {
  const old = new Dexie(name);
  await old.open();
  try {
    if (old.verno !== fromSchemaVersion) throw new Error(`the archive on disk is at schema ${old.verno}, not ${fromSchemaVersion} as expected`);
    const tables = old.tables.filter((t) => !DERIVED_TABLES.includes(t.name));
    const snapshot = await old.transaction('r', tables, () => Promise.all(tables.map((t) => t.toArray())));
    const named = tables.map((table, k) => {
      // A stored table under another name holds the transits in groups (schema 4 on): written as rows.
      const name = logicalTableName(table.name);
      return { name, rows: name !== table.name ? transitRowsInIdOrder(snapshot[k] as TransitGroupRecord[]) : snapshot[k] };
    }).sort((a, b) => a.name.localeCompare(b.name));
    const writer = new BundleWriter({ schemaVersion: fromSchemaVersion, createdUtc, producer });
    const blocks = new ByteBlocks();
    blocks.push(encodeUtf8(writer.start()));
    for (const { name, rows } of named) {
      blocks.push(encodeUtf8(writer.beginTable(name)));
      for (const row of rows) if ((row as { visibility?: string }).visibility !== 'staged') writer.rowInto(row, blocks);
    }
    blocks.push(encodeUtf8(writer.finish()));
    return await gzipBlocks(blocks.finish());
  } finally {
    old.close();
  }
}

/** Called by openArchive when the archive on disk is older than the code; a failure stops the upgrade. */
export type BeforeUpgrade = (fromSchemaVersion: number) => Promise<ArchiveOpenFailure | null>;

/**
 * The app's step before a schema upgrade: where the shell keeps backups by itself (the desktop
 * app), write a bundle of the old archive to the backup folder first; if that fails, refuse the
 * upgrade (the old archive is left exactly as it was) and say so. In the browser nothing is
 * written: the browser keeps no backup folder.
 */
export function backupBeforeUpgrade(
  name: string, bridge: Pick<ShellBridge, 'info' | 'writeBackup'>,
  /** Where the old archive is read and bundled: exportOldArchive on this thread unless given (the app: in the worker). */
  exportOld: typeof exportOldArchive = exportOldArchive,
): BeforeUpgrade {
  return async (fromSchemaVersion) => {
    try {
      const info = await bridge.info();
      if (!info.automaticBackups) return null;
      const createdUtc = nowUtcIso();
      const bytes = await exportOld(name, fromSchemaVersion, createdUtc, `meridian-ledger ${info.appVersion} (before upgrade)`);
      const written = await bridge.writeBackup({ fileName: backupFileName(createdUtc, { beforeUpgradeFrom: fromSchemaVersion }), bytes, keepNewest: DEFAULT_BACKUP_KEEP });
      if (written.kind === 'ok') return null;
      throw new Error(written.kind === 'failed' ? written.message : 'the write was cancelled');
    } catch (error) {
      return {
        errorName: 'BackupBeforeUpgrade',
        title: 'The archive was not upgraded',
        message: `This version of Meridian Ledger upgrades the archive from schema ${fromSchemaVersion}, and first writes a backup of it; that backup failed: ${error instanceof Error ? error.message : String(error)}.`,
        advice: 'Free space in the backup folder (or fix what the message names) and start again. Nothing in the archive was changed or deleted.',
      };
    }
  };
}
