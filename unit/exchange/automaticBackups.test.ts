import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import type { BackupInfo, BackupRequest, BridgeResult, ShellInfo } from '../../core/bridge.ts';
import { BACKUP_INTERVAL_MS, backupFileName, decideStartupBackup, keepNewestFrom, runStartupBackup, type StartupBackupDeps } from '../../renderer/exchange/automaticBackups.ts';
import { hasUserRows } from '../../renderer/exchange/hasUserRows.ts';
import { DEMO_IMPORT_ID } from '../../renderer/demo/demoArchive.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';

const NOW_MS = Date.parse('2026-12-01T08:00:00.000Z');
const backup = (fileName: string, writtenUtc: string): BackupInfo => ({ fileName, sizeBytes: 100, writtenUtc });
const HOURS = 3_600_000;
const at = (msBeforeNow: number) => new Date(NOW_MS - msBeforeNow).toISOString();

describe('decideStartupBackup(facts)', () => {
  it('is off when the shell writes no backups by itself (browser mode)', () => {
    expect(decideStartupBackup({ automaticBackups: false, hasUserRows: true, backups: [], nowUtcMs: NOW_MS }).kind).toBe('off');
  });
  it('is due with no backup yet, and due once the newest is a day old', () => {
    expect(decideStartupBackup({ automaticBackups: true, hasUserRows: true, backups: [], nowUtcMs: NOW_MS })).toEqual({ kind: 'due', newest: null });
    const old = backup('b.mlbundle', at(BACKUP_INTERVAL_MS));
    expect(decideStartupBackup({ automaticBackups: true, hasUserRows: true, backups: [old], nowUtcMs: NOW_MS }).kind).toBe('due');
  });
  it('is not due when the newest (not the first listed) is younger than a day', () => {
    const backups = [backup('a.mlbundle', at(40 * HOURS)), backup('b.mlbundle', at(23 * HOURS)), backup('c.mlbundle', at(30 * HOURS))];
    expect(decideStartupBackup({ automaticBackups: true, hasUserRows: true, backups, nowUtcMs: NOW_MS })).toEqual({ kind: 'not-due', newest: backups[1] });
  });
  it('offers the newest backup to an empty archive, and never backs the empty archive up', () => {
    const backups = [backup('a.mlbundle', at(90 * HOURS)), backup('b.mlbundle', at(50 * HOURS))];
    expect(decideStartupBackup({ automaticBackups: true, hasUserRows: false, backups, nowUtcMs: NOW_MS })).toEqual({ kind: 'offer-restore', newest: backups[1] });
    expect(decideStartupBackup({ automaticBackups: true, hasUserRows: false, backups: [], nowUtcMs: NOW_MS }).kind).toBe('nothing-to-back-up');
  });
  it('refuses a backup whose written time cannot be read, naming it', () => {
    expect(() => decideStartupBackup({ automaticBackups: true, hasUserRows: true, backups: [backup('x.mlbundle', 'yesterday')], nowUtcMs: NOW_MS })).toThrow(/x\.mlbundle.*yesterday/);
  });
});

describe('backupFileName and keepNewestFrom', () => {
  it('names backups by UTC time, in the characters the shell accepts', () => {
    expect(backupFileName('2026-12-01T23:42:57.123Z')).toBe('archive-2026-12-01T234257Z.mlbundle');
    expect(backupFileName('2026-12-01T23:42:57.123Z', { beforeUpgradeFrom: 1 })).toBe('archive-2026-12-01T234257Z-before-upgrade-from-v1.mlbundle');
    expect(() => backupFileName('1 Dec 2026')).toThrow(/not an ISO 8601 UTC time/);
  });
  it('keeps 7 unless the setting is a whole number 1–365', () => {
    expect([keepNewestFrom(undefined), keepNewestFrom(0), keepNewestFrom(2.5), keepNewestFrom(14)]).toEqual([7, 7, 7, 14]);
  });
});

/** A recording stand-in for the shell: backups in memory, every write request kept. */
function fakeShell(info: ShellInfo, backups: BackupInfo[]) {
  const writes: BackupRequest[] = [];
  const bridge: StartupBackupDeps['bridge'] = {
    info: async () => info,
    listBackups: async (): Promise<BridgeResult<readonly BackupInfo[]>> => ({ kind: 'ok', value: backups }),
    writeBackup: async (request) => {
      writes.push(request);
      return { kind: 'ok', value: backup(request.fileName, new Date(NOW_MS).toISOString()) };
    },
  };
  return { bridge, writes };
}
const ELECTRON: ShellInfo = { shell: 'electron', appVersion: 'test', automaticBackups: true };

describe('runStartupBackup(deps) with fakes', () => {
  const deps = (bridge: StartupBackupDeps['bridge'], userRows: boolean, exported: { count: number }): StartupBackupDeps => ({
    bridge, hasUserRows: async () => userRows, nowUtcMs: () => NOW_MS, keepNewest: async () => 7,
    exportBundle: async () => (exported.count++, new Uint8Array([1, 2, 3])),
  });
  it('writes one bundle when due, keeping the newest 7', async () => {
    const shell = fakeShell(ELECTRON, [backup('old.mlbundle', at(30 * HOURS))]);
    const exported = { count: 0 };
    const outcome = await runStartupBackup(deps(shell.bridge, true, exported));
    expect(outcome.kind).toBe('written');
    expect(exported.count).toBe(1);
    expect(shell.writes.map((w) => [w.fileName, w.keepNewest, [...w.bytes]])).toEqual([['archive-2026-12-01T080000Z.mlbundle', 7, [1, 2, 3]]]);
  });
  it('exports nothing when not due, when empty with a backup, or in the browser', async () => {
    for (const [info, backups, rows, want] of [
      [ELECTRON, [backup('new.mlbundle', at(2 * HOURS))], true, 'not-due'],
      [ELECTRON, [backup('new.mlbundle', at(60 * HOURS))], false, 'offer-restore'],
      [{ ...ELECTRON, shell: 'browser', automaticBackups: false }, [], true, 'off'],
    ] as const) {
      const shell = fakeShell(info, [...backups]);
      const exported = { count: 0 };
      const outcome = await runStartupBackup(deps(shell.bridge, rows, exported));
      expect(outcome.kind === 'decided' ? outcome.decision.kind : outcome.kind).toBe(want);
      expect(exported.count + shell.writes.length).toBe(0);
    }
  });
  it('reports a failed write in words instead of throwing', async () => {
    const shell = fakeShell(ELECTRON, []);
    shell.bridge.writeBackup = async () => ({ kind: 'failed', message: 'disk full' });
    const outcome = await runStartupBackup(deps(shell.bridge, true, { count: 0 }));
    expect(outcome).toEqual({ kind: 'failed', message: expect.stringMatching(/Writing the daily backup failed: disk full.*Export a bundle/) as string });
  });
});

describe('hasUserRows(database)', () => {
  it('ignores the demo and staged rows, sees a row of the user', async () => {
    const database = new ArchiveDatabase(`has-user-rows-${Math.random()}`);
    const audit = { createdUtc: 'x', updatedUtc: 'x' };
    await database.sites.put({ ...audit, id: 'demo-site', label: 'demo', latitudeDeg: 0, longitudeDeg: 0, heightM: 0, note: '', visibility: 'visible', importId: DEMO_IMPORT_ID });
    await database.sites.put({ ...audit, id: 'staged-site', label: 'staged', latitudeDeg: 0, longitudeDeg: 0, heightM: 0, note: '', visibility: 'staged', importId: 'imp-1' });
    await database.settings.put({ key: 'anything', value: 1 });
    expect(await hasUserRows(database)).toBe(false);
    await database.sites.put({ ...audit, id: 'mine', label: 'mine', latitudeDeg: 0, longitudeDeg: 0, heightM: 0, note: '', visibility: 'visible' });
    expect(await hasUserRows(database)).toBe(true);
    database.close();
  });
});
