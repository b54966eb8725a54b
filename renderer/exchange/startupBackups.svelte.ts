import type { ShellBridge } from '../../core/bridge.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import type { ComputeClient } from '../worker/computeClient.ts';
import { BACKUP_KEEP_KEY, keepNewestFrom, runStartupBackup, type StartupBackupDeps, type StartupBackupOutcome } from './automaticBackups.ts';
import { BackupsWhileRunning } from './backupsWhileRunning.ts';
import { isExchangeJobRunning, startExchangeJob } from './exchangeJobs.ts';
import { hasUserRows } from './hasUserRows.ts';

/** What the automatic backup did last (at start, or a later hourly check that wrote or failed), for the Exchange view. */
class StartupBackupState {
  outcome = $state.raw<StartupBackupOutcome | null>(null);
}

export const startupBackups = new StartupBackupState();

/** The hourly checks of this window, started once the start-up step has run. */
let whileRunning: BackupsWhileRunning | null = null;

function backupDeps(database: ArchiveDatabase, compute: ComputeClient, bridge: ShellBridge): StartupBackupDeps {
  return {
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
  };
}

/**
 * The start-up step of automatic backups (desktop app): decides, and when due computes the
 * bundle in the worker (bundle-export job, as the Exchange view's export) and writes it through
 * bridge.writeBackup, keeping the newest N (setting BACKUP_KEEP_KEY, default 7). Then, when the
 * shell writes backups, starts the hourly check (BackupsWhileRunning) so that a window left open
 * for weeks still gets one backup a day; imports, IERS imports and restores make it wait an hour.
 * Returns whether the user should be shown the restore offer (an empty archive with backups on disk).
 */
export async function runStartupBackups(database: ArchiveDatabase, compute: ComputeClient, bridge: ShellBridge): Promise<boolean> {
  const deps = backupDeps(database, compute, bridge);
  const outcome = await runStartupBackup(deps);
  startupBackups.outcome = outcome;
  if (!(outcome.kind === 'decided' && outcome.decision.kind === 'off')) {
    whileRunning?.stop();
    whileRunning = new BackupsWhileRunning({
      ...deps,
      isBusy: () => isExchangeJobRunning(['exchange-import', 'bundle-restore', 'iers-import']),
      timers: { set: (callback, delayMs) => setTimeout(callback, delayMs), clear: (handle) => clearTimeout(handle as ReturnType<typeof setTimeout>) },
      // Only news replaces what the notice shows: a quiet "not due" must not hide a restore offer.
      onCheck: (check) => {
        if (check.kind === 'written' || check.kind === 'failed') startupBackups.outcome = check;
      },
    });
    whileRunning.start();
  }
  return outcome.kind === 'decided' && outcome.decision.kind === 'offer-restore';
}
