import type { BackupInfo, BridgeResult, ShellBridge } from '../../core/bridge.ts';

/** Setting key of how many automatic backups the shell keeps (the newest N). */
export const BACKUP_KEEP_KEY = 'automaticBackupKeepNewest';
/** Backups kept when the setting is absent: a week of daily backups. */
export const DEFAULT_BACKUP_KEEP = 7;
/** A new automatic backup is due when the newest is at least this old (one day, in ms). */
export const BACKUP_INTERVAL_MS = 86_400_000;

/**
 * What to do about automatic backups when the app starts:
 * - `off`: the shell writes no backups by itself (browser mode: the user downloads bundles);
 * - `offer-restore`: the archive holds no rows of the user's (at most the demo) but the backup
 *   folder holds backups: offer the newest; never write a backup then, or the rotation would
 *   push the real backups out with empty ones;
 * - `nothing-to-back-up`: empty archive and no backups;
 * - `due` / `not-due`: the newest backup is at least / less than BACKUP_INTERVAL_MS old.
 */
export type StartupBackupDecision =
  | { readonly kind: 'off' }
  | { readonly kind: 'offer-restore'; readonly newest: BackupInfo }
  | { readonly kind: 'nothing-to-back-up' }
  | { readonly kind: 'due'; readonly newest: BackupInfo | null }
  | { readonly kind: 'not-due'; readonly newest: BackupInfo };

export interface StartupBackupFacts {
  readonly automaticBackups: boolean;
  /** Whether the data tables hold any row of the user's (demo rows and settings do not count). */
  readonly hasUserRows: boolean;
  /** The shell's backups, in any order. */
  readonly backups: readonly BackupInfo[];
  /** Now, ms since 1970-01-01 UTC. */
  readonly nowUtcMs: number;
}

/** The newest backup by its written time (ties: the later file name), or null if there is none. */
export function newestBackup(backups: readonly BackupInfo[]): BackupInfo | null {
  let newest: BackupInfo | null = null;
  for (const b of backups) {
    const t = Date.parse(b.writtenUtc);
    if (Number.isNaN(t)) throw new RangeError(`backup ${b.fileName} has an unreadable written time "${b.writtenUtc}"; expected ISO 8601 UTC`);
    if (newest === null || t > Date.parse(newest.writtenUtc) || (t === Date.parse(newest.writtenUtc) && b.fileName > newest.fileName)) newest = b;
  }
  return newest;
}

/** Decides, from facts only, what the start of the app does about backups (see StartupBackupDecision). */
export function decideStartupBackup(facts: StartupBackupFacts): StartupBackupDecision {
  if (!facts.automaticBackups) return { kind: 'off' };
  const newest = newestBackup(facts.backups);
  if (!facts.hasUserRows) return newest === null ? { kind: 'nothing-to-back-up' } : { kind: 'offer-restore', newest };
  if (newest === null || facts.nowUtcMs - Date.parse(newest.writtenUtc) >= BACKUP_INTERVAL_MS) return { kind: 'due', newest };
  return { kind: 'not-due', newest };
}

/** `archive-2026-12-01T234257Z.mlbundle` for a backup written at `utcIso`; sorts by time. */
export function backupFileName(utcIso: string, kind: 'daily' | { readonly beforeUpgradeFrom: number } = 'daily'): string {
  const stamp = utcIso.slice(0, 19).replace(/:/g, '') + 'Z';
  if (!/^\d{4}-\d\d-\d\dT\d{6}Z$/.test(stamp)) throw new RangeError(`backupFileName: "${utcIso}" is not an ISO 8601 UTC time`);
  return kind === 'daily' ? `archive-${stamp}.mlbundle` : `archive-${stamp}-before-upgrade-from-v${kind.beforeUpgradeFrom}.mlbundle`;
}

/** How many backups to keep: the setting if it is a whole number 1–365, else the default. */
export function keepNewestFrom(setting: unknown): number {
  return typeof setting === 'number' && Number.isInteger(setting) && setting >= 1 && setting <= 365 ? setting : DEFAULT_BACKUP_KEEP;
}

/** What the start-up step needs, injected so that it is tested with fakes. */
export interface StartupBackupDeps {
  readonly bridge: Pick<ShellBridge, 'info' | 'listBackups' | 'writeBackup'>;
  hasUserRows(): Promise<boolean>;
  /** Computes a bundle of the whole archive (in the app: the worker's bundle-export job). */
  exportBundle(): Promise<Uint8Array>;
  keepNewest(): Promise<number>;
  nowUtcMs(): number;
}

export type StartupBackupOutcome =
  | { readonly kind: 'decided'; readonly decision: Exclude<StartupBackupDecision, { kind: 'due' }> }
  | { readonly kind: 'written'; readonly backup: BackupInfo }
  | { readonly kind: 'failed'; readonly message: string };

function unwrap<T>(result: BridgeResult<T>, what: string): T {
  if (result.kind === 'ok') return result.value;
  throw new Error(`${what} ${result.kind === 'failed' ? `failed: ${result.message}` : 'was cancelled'}`);
}

/** Runs the start-up decision and, when a backup is due, writes it through the shell. Never throws. */
export async function runStartupBackup(deps: StartupBackupDeps): Promise<StartupBackupOutcome> {
  try {
    const info = await deps.bridge.info();
    if (!info.automaticBackups) return { kind: 'decided', decision: { kind: 'off' } };
    const backups = unwrap(await deps.bridge.listBackups(), 'Listing the backups');
    const decision = decideStartupBackup({ automaticBackups: true, hasUserRows: await deps.hasUserRows(), backups, nowUtcMs: deps.nowUtcMs() });
    if (decision.kind !== 'due') return { kind: 'decided', decision };
    const bytes = await deps.exportBundle();
    const fileName = backupFileName(new Date(deps.nowUtcMs()).toISOString());
    const backup = unwrap(await deps.bridge.writeBackup({ fileName, bytes, keepNewest: await deps.keepNewest() }), 'Writing the daily backup');
    return { kind: 'written', backup };
  } catch (error) {
    return { kind: 'failed', message: `The automatic backup did not run: ${error instanceof Error ? error.message : String(error)}. Export a bundle from the Exchange view until this is fixed.` };
  }
}
