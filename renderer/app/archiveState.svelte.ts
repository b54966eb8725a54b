import type { ArchiveDatabase } from '../store/database.ts';
import type { ArchiveOpenFailure } from '../store/describeOpenFailure.ts';
import { openArchive } from '../store/openArchive.ts';
import { nowUtcIso } from '../store/nowUtcIso.ts';
import { sweepInterruptedImports } from '../store/importStaging.ts';
import { requestStorageStatus, type StorageManagerLike, type StorageStatus } from '../store/storageStatus.ts';

/** The archive as the whole app sees it: opening, open, or failed with the reason. */
export class ArchiveState {
  opening = $state(true);
  database = $state.raw<ArchiveDatabase | null>(null);
  failure = $state.raw<ArchiveOpenFailure | null>(null);
  storage = $state.raw<StorageStatus | null>(null);
  /** Imports interrupted in an earlier session whose staged rows were removed at start. */
  sweptImports = $state(0);

  /** Opens the archive, sweeps interrupted imports, then asks for persistent storage. */
  async start(storage: StorageManagerLike | undefined, databaseName?: string): Promise<void> {
    const result = await openArchive(databaseName);
    if (result.kind === 'open') {
      this.database = result.database;
      this.sweptImports = await sweepInterruptedImports(result.database, nowUtcIso());
    } else {
      this.failure = result.failure;
    }
    this.opening = false;
    this.storage = await requestStorageStatus(storage);
  }
}
