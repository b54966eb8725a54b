import type { ShellBridge } from '../../core/bridge.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import type { ComputeClient } from '../worker/computeClient.ts';
import { BACKUP_KEEP_KEY, keepNewestFrom, runStartupBackup, type StartupBackupOutcome } from './automaticBackups.ts';
import { startExchangeJob } from './exchangeJobs.ts';
import { hasUserRows } from './hasUserRows.ts';

/** What the start-up backup step did, for the Exchange view to show (one per app window). */
class StartupBackupState {
  outcome = $state.raw<StartupBackupOutcome | null>(null);
}

export const startupBackups = new StartupBackupState();

/**
 * The start-up step of automatic backups (desktop app): decides, and when due computes the
 * bundle in the worker (bundle-export job, as the Exchange view's export) and writes it through
 * bridge.writeBackup, keeping the newest N (setting BACKUP_KEEP_KEY, default 7). Returns whether
 * the user should be shown the restore offer (an empty archive with backups on disk).
 */
export async function runStartupBackups(database: ArchiveDatabase, compute: ComputeClient, bridge: ShellBridge): Promise<boolean> {
  const outcome = await runStartupBackup({
    bridge,
    hasUserRows: () => hasUserRows(database),
    nowUtcMs: () => Date.now(),
    keepNewest: async () => keepNewestFrom((await database.settings.get(BACKUP_KEEP_KEY))?.value),
    exportBundle: async () => {
      const info = await bridge.info();
      const run = await startExchangeJob(compute, { kind: 'bundle-export', databaseName: database.name, producer: `meridian-ledger ${info.appVersion} (daily backup)` }, () => {}).outcome;
      if (run.kind === 'finished') return run.result.bytes;
      throw new Error(run.kind === 'failed' ? run.message : 'the export was cancelled');
    },
  });
  startupBackups.outcome = outcome;
  return outcome.kind === 'decided' && outcome.decision.kind === 'offer-restore';
}
