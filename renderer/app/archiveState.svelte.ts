import type { BeforeUpgrade } from '../exchange/preUpgradeBackup.ts';
import { ARCHIVE_DATABASE_NAME, type ArchiveDatabase } from '../store/database.ts';
import type { ArchiveOpenFailure } from '../store/describeOpenFailure.ts';
import { openArchive } from '../store/openArchive.ts';
import { nowUtcIso } from '../store/nowUtcIso.ts';
import { sweepInterruptedImports } from '../store/importStaging.ts';
import { loadDemoIfFirstStart } from '../demo/demoArchive.ts';
import { requestStorageStatus, type StorageManagerLike, type StorageStatus } from '../store/storageStatus.ts';

/** The archive as the whole app sees it: opening, open, or failed with the reason. */
export class ArchiveState {
  opening = $state(true);
  database = $state.raw<ArchiveDatabase | null>(null);
  failure = $state.raw<ArchiveOpenFailure | null>(null);
  storage = $state.raw<StorageStatus | null>(null);
  /** Imports interrupted in an earlier session whose staged rows were removed at start. */
  sweptImports = $state(0);
  /** Why the demo archive could not be loaded on first start, if it could not. */
  demoFailure = $state('');
  /** While an older archive is upgraded at open: from and to which schema version; null otherwise. */
  upgrading = $state.raw<{ readonly from: number; readonly to: number } | null>(null);
  /** How far that upgrade has got, when the code running it says (transits read and written); null otherwise. */
  upgradeProgress = $state.raw<{ readonly done: number; readonly total: number } | null>(null);
  /** The IndexedDB database the archive is (being) opened from. */
  databaseName = $state(ARCHIVE_DATABASE_NAME);

  /**
   * Opens the archive, sweeps interrupted imports, restores the demo archive on the very first
   * start of an empty archive (when `fetchDemo` is given), then asks for persistent storage.
   * `beforeUpgrade` runs when the archive on disk is older than this build (the desktop app backs
   * the old archive up there, renderer/exchange/preUpgradeBackup.ts).
   */
  async start(
    storage: StorageManagerLike | undefined, databaseName?: string, fetchDemo?: () => Promise<Uint8Array>, beforeUpgrade?: BeforeUpgrade,
    /** Runs a schema upgrade off this thread (the app: a worker job) before the archive is opened here. */
    upgradeElsewhere?: (databaseName: string) => Promise<void>,
  ): Promise<void> {
    this.databaseName = databaseName ?? ARCHIVE_DATABASE_NAME;
    const name = this.databaseName;
    const result = await openArchive(name, beforeUpgrade, (from, to) => (this.upgrading = { from, to }), upgradeElsewhere === undefined ? undefined : () => upgradeElsewhere(name));
    this.upgrading = null;
    this.upgradeProgress = null;
    if (result.kind === 'open') {
      this.sweptImports = await sweepInterruptedImports(result.database, nowUtcIso());
      if (fetchDemo !== undefined) {
        try {
          await loadDemoIfFirstStart(result.database, fetchDemo, nowUtcIso());
        } catch (error) {
          this.demoFailure = `The demo archive could not be loaded (${error instanceof Error ? error.message : String(error)}); the archive is empty and works as usual.`;
        }
      }
      this.database = result.database;
    } else {
      this.failure = result.failure;
    }
    this.opening = false;
    this.storage = await requestStorageStatus(storage);
  }
}
