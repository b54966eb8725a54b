import { Dexie } from 'dexie';
import type { ShellBridge } from '../../core/bridge.ts';
import { BundleWriter } from '../../core/archive/bundle-writer.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import type { ArchiveOpenFailure } from '../store/describeOpenFailure.ts';
import { nowUtcIso } from '../store/nowUtcIso.ts';
import { DERIVED_TABLES } from '../store/nightTallies.ts';
import { backupFileName, DEFAULT_BACKUP_KEEP } from './automaticBackups.ts';
import { gzipBytes } from './gzip.ts';

/**
 * A bundle of an archive still at an older schema, read BEFORE the code's schema upgrades it.
 * Dexie cannot run code between "this database is older" and its own upgrade, so the old
 * database is opened first without any declared version (Dexie's dynamic mode reads the stores as
 * they are on disk and changes nothing), exported, closed, and only then opened by the app's
 * ArchiveDatabase, which upgrades it. The bundle's header carries the OLD schema version, so a
 * restore runs the same upgrade again. Staged rows of unfinished imports are left out, as in
 * exportBundle. Runs on the calling thread (the worker would open, and so upgrade, the database).
 */
export async function exportOldArchive(name: string, fromSchemaVersion: number, createdUtc: string, producer: string): Promise<Uint8Array> {
  const old = new Dexie(name);
  await old.open();
  try {
    if (old.verno !== fromSchemaVersion) throw new Error(`the archive on disk is at schema ${old.verno}, not ${fromSchemaVersion} as expected`);
    const tables = old.tables.filter((t) => !DERIVED_TABLES.includes(t.name)).sort((a, b) => a.name.localeCompare(b.name));
    const snapshot = await old.transaction('r', tables, () => Promise.all(tables.map((t) => t.toArray())));
    const writer = new BundleWriter({ schemaVersion: fromSchemaVersion, createdUtc, producer });
    const parts = [writer.start()];
    for (const [k, table] of tables.entries()) {
      parts.push(writer.beginTable(table.name));
      for (const row of snapshot[k]) if ((row as { visibility?: string }).visibility !== 'staged') parts.push(writer.row(row));
    }
    parts.push(writer.finish());
    return await gzipBytes(encodeUtf8(parts.join('')));
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
export function backupBeforeUpgrade(name: string, bridge: Pick<ShellBridge, 'info' | 'writeBackup'>): BeforeUpgrade {
  return async (fromSchemaVersion) => {
    try {
      const info = await bridge.info();
      if (!info.automaticBackups) return null;
      const createdUtc = nowUtcIso();
      const bytes = await exportOldArchive(name, fromSchemaVersion, createdUtc, `meridian-ledger ${info.appVersion} (before upgrade)`);
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
