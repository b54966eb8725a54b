import { runStartupBackup, type StartupBackupDeps, type StartupBackupOutcome } from './automaticBackups.ts';

/**
 * How often the open app asks whether the daily backup is due (one hour, in ms). An observatory
 * computer may stay open for weeks; checking hourly writes each day's backup within an hour of it
 * falling due, and a check costs one directory listing.
 */
export const BACKUP_CHECK_INTERVAL_MS = 3_600_000;

/** setTimeout / clearTimeout, injected so that tests drive the schedule with a fake clock. */
export interface BackupTimers {
  set(callback: () => void, delayMs: number): unknown;
  clear(handle: unknown): void;
}

export interface RunningBackupDeps extends StartupBackupDeps {
  /**
   * True while an import or a restore runs: a bundle exported then could hold a half-committed
   * import, and its rotation could race the restore. The check is skipped and tried next hour.
   */
  isBusy(): boolean;
  readonly timers: BackupTimers;
  /** Called after every check with what it did. */
  onCheck(check: RunningBackupCheck): void;
}

/** One hourly check: skipped (busy, or the previous check still running), or the daily step's outcome. */
export type RunningBackupCheck =
  | { readonly kind: 'skipped'; readonly reason: 'import-or-restore-running' | 'previous-check-running' }
  | StartupBackupOutcome;

/**
 * The daily automatic backup while the app stays open: every BACKUP_CHECK_INTERVAL_MS it runs the
 * same decision as at start (due when the newest backup is a day old; never over an archive that
 * holds nothing of the user's) and writes the bundle through the shell. The export runs in the
 * worker, so the interface does not wait on it. Checks never overlap; a failure is reported
 * through onCheck and the next hour tries again.
 */
export class BackupsWhileRunning {
  readonly #deps: RunningBackupDeps;
  readonly #intervalMs: number;
  #timer: unknown = null;
  #checking = false;
  #stopped = true;

  constructor(deps: RunningBackupDeps, intervalMs: number = BACKUP_CHECK_INTERVAL_MS) {
    if (!(Number.isFinite(intervalMs) && intervalMs >= 1000)) {
      throw new RangeError(`BackupsWhileRunning: the check interval must be at least 1000 ms, got ${intervalMs}`);
    }
    this.#deps = deps;
    this.#intervalMs = intervalMs;
  }

  /** Schedules the first check one interval from now (the start-up step has just run its own). */
  start(): void {
    if (!this.#stopped) return;
    this.#stopped = false;
    this.#schedule();
  }

  /** Cancels the pending check; a check already running finishes but schedules no other. */
  stop(): void {
    this.#stopped = true;
    if (this.#timer !== null) this.#deps.timers.clear(this.#timer);
    this.#timer = null;
  }

  /** Runs one check now (the timer calls this; so may a test or a menu command). Never throws. */
  async checkNow(): Promise<RunningBackupCheck> {
    let check: RunningBackupCheck;
    if (this.#checking) check = { kind: 'skipped', reason: 'previous-check-running' };
    else if (this.#deps.isBusy()) check = { kind: 'skipped', reason: 'import-or-restore-running' };
    else {
      this.#checking = true;
      try {
        check = await runStartupBackup(this.#deps);
      } finally {
        this.#checking = false;
      }
    }
    this.#deps.onCheck(check);
    return check;
  }

  #schedule(): void {
    this.#timer = this.#deps.timers.set(() => {
      this.#timer = null;
      void this.checkNow().finally(() => {
        if (!this.#stopped) this.#schedule();
      });
    }, this.#intervalMs);
  }
}
