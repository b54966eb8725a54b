import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { BackupInfo, BackupRequest, BridgeResult, ShellInfo } from '../../core/bridge.ts';
import type { WorkerPort } from '../../renderer/worker/computeClient.ts';
import { BACKUP_INTERVAL_MS } from '../../renderer/exchange/automaticBackups.ts';
import { BACKUP_CHECK_INTERVAL_MS, BackupsWhileRunning, type RunningBackupCheck, type RunningBackupDeps } from '../../renderer/exchange/backupsWhileRunning.ts';

// A fake clock (vitest's fake timers drive both setTimeout and Date.now) and a stand-in shell
// that keeps its backups in memory, so a month of an app left open runs in milliseconds.
const START_UTC = '2026-12-01T20:00:00.000Z';
const HOUR_MS = 3_600_000;
const ELECTRON: ShellInfo = { shell: 'electron', appVersion: 'test', automaticBackups: true };

function standInShell(initial: BackupInfo[]) {
  const backups = [...initial];
  const writes: BackupRequest[] = [];
  const bridge: RunningBackupDeps['bridge'] = {
    info: async () => ELECTRON,
    listBackups: async (): Promise<BridgeResult<readonly BackupInfo[]>> => ({ kind: 'ok', value: [...backups] }),
    writeBackup: async (request) => {
      writes.push(request);
      const written = { fileName: request.fileName, sizeBytes: request.bytes.length, writtenUtc: new Date(Date.now()).toISOString() };
      backups.push(written);
      return { kind: 'ok', value: written };
    },
  };
  return { bridge, writes, backups };
}

function scheduler(shell: ReturnType<typeof standInShell>, busy: { now: boolean }, checks: RunningBackupCheck[], exportBundle: RunningBackupDeps['exportBundle'] = async () => new Uint8Array([7, 7])) {
  return new BackupsWhileRunning({
    bridge: shell.bridge, hasUserRows: async () => true, nowUtcMs: () => Date.now(), keepNewest: async () => 7, exportBundle,
    isBusy: () => busy.now,
    timers: { set: (callback, delayMs) => setTimeout(callback, delayMs), clear: (handle) => clearTimeout(handle as ReturnType<typeof setTimeout>) },
    onCheck: (check) => checks.push(check),
  });
}

beforeEach(() => {
  vi.useFakeTimers();
  vi.setSystemTime(new Date(START_UTC));
});
afterEach(() => vi.useRealTimers());

describe('BackupsWhileRunning (daily backup while the app stays open)', () => {
  it('checks hourly and writes one backup a day for a window open a week', async () => {
    // The newest backup is 2 h old at start: the next is due 22 h later, then every 24 h.
    const shell = standInShell([{ fileName: 'archive-2026-12-01T180000Z.mlbundle', sizeBytes: 2, writtenUtc: '2026-12-01T18:00:00.000Z' }]);
    const checks: RunningBackupCheck[] = [];
    const running = scheduler(shell, { now: false }, checks);
    running.start();
    await vi.advanceTimersByTimeAsync(21 * HOUR_MS);
    expect(checks.length).toBe(21);
    expect(shell.writes).toEqual([]);
    await vi.advanceTimersByTimeAsync(1 * HOUR_MS);
    expect(shell.writes.map((w) => w.fileName)).toEqual(['archive-2026-12-02T180000Z.mlbundle']);
    await vi.advanceTimersByTimeAsync(6 * 24 * HOUR_MS);
    expect(shell.writes.length).toBe(7);
    expect(checks.length).toBe(22 + 6 * 24);
    const times = shell.backups.map((b) => Date.parse(b.writtenUtc));
    for (let i = 1; i < times.length; i += 1) expect(times[i] - times[i - 1]).toBe(BACKUP_INTERVAL_MS);
    running.stop();
  });

  it('skips while an import or restore runs and writes at the first free hour', async () => {
    const shell = standInShell([{ fileName: 'old.mlbundle', sizeBytes: 2, writtenUtc: '2026-11-29T00:00:00.000Z' }]);
    const busy = { now: true };
    const checks: RunningBackupCheck[] = [];
    const running = scheduler(shell, busy, checks);
    running.start();
    await vi.advanceTimersByTimeAsync(3 * HOUR_MS);
    expect(checks).toEqual(Array(3).fill({ kind: 'skipped', reason: 'import-or-restore-running' }));
    expect(shell.writes).toEqual([]);
    busy.now = false;
    await vi.advanceTimersByTimeAsync(HOUR_MS);
    expect(checks.at(-1)?.kind).toBe('written');
    expect(shell.writes.map((w) => w.fileName)).toEqual(['archive-2026-12-02T000000Z.mlbundle']);
    running.stop();
  });

  it('never runs two checks at once: a slow export makes the next check skip', async () => {
    const shell = standInShell([]);
    const checks: RunningBackupCheck[] = [];
    let finishExport: (bytes: Uint8Array<ArrayBuffer>) => void = () => {};
    let exportStarted: () => void = () => {};
    const started = new Promise<void>((resolve) => (exportStarted = resolve));
    const running = scheduler(shell, { now: false }, checks, () => new Promise<Uint8Array<ArrayBuffer>>((resolve) => {
      finishExport = resolve;
      exportStarted();
    }));
    const first = running.checkNow();
    await started;
    expect(await running.checkNow()).toEqual({ kind: 'skipped', reason: 'previous-check-running' });
    finishExport(new Uint8Array([1]));
    expect((await first).kind).toBe('written');
    expect(shell.writes.length).toBe(1);
  });

  it('stop() cancels the pending check; a failed write is reported and retried next hour', async () => {
    const shell = standInShell([]);
    const checks: RunningBackupCheck[] = [];
    let failNext = true;
    const write = shell.bridge.writeBackup;
    shell.bridge.writeBackup = async (request) => (failNext ? ((failNext = false), { kind: 'failed', message: 'backup folder not writable' }) : write(request));
    const running = scheduler(shell, { now: false }, checks);
    running.start();
    await vi.advanceTimersByTimeAsync(HOUR_MS);
    expect(checks[0]).toEqual({ kind: 'failed', message: expect.stringMatching(/backup folder not writable/) as string });
    await vi.advanceTimersByTimeAsync(HOUR_MS);
    expect(checks[1]?.kind).toBe('written');
    running.stop();
    await vi.advanceTimersByTimeAsync(48 * HOUR_MS);
    expect(checks.length).toBe(2);
    expect(vi.getTimerCount()).toBe(0);
  });

  it('refuses an interval under a second (a typo in ms would hammer the backup folder)', () => {
    expect(() => new BackupsWhileRunning({} as RunningBackupDeps, 10)).toThrow(/at least 1000 ms, got 10/);
    expect(BACKUP_CHECK_INTERVAL_MS).toBe(HOUR_MS);
  });
});

describe('isExchangeJobRunning(kinds): what makes the hourly check wait', () => {
  it('is true from an import\'s start until the worker answers, then false', async () => {
    vi.useRealTimers();
    const { ComputeClient } = await import('../../renderer/worker/computeClient.ts');
    const { isExchangeJobRunning, startExchangeJob } = await import('../../renderer/exchange/exchangeJobs.ts');
    const listeners: ((event: { readonly data: unknown }) => void)[] = [];
    const started: string[] = [];
    function addEventListener(type: 'message', listener: (event: { readonly data: unknown }) => void): void;
    function addEventListener(type: 'error', listener: (event: { readonly message?: string }) => void): void;
    function addEventListener(type: string, listener: ((event: { readonly data: unknown }) => void) | ((event: { readonly message?: string }) => void)): void {
      if (type === 'message') listeners.push(listener as (event: { readonly data: unknown }) => void);
    }
    const port: WorkerPort = { postMessage: (message) => void started.push(message.jobId), addEventListener };
    const compute = new ComputeClient(port);
    const run = startExchangeJob(compute, { kind: 'bundle-restore', databaseName: 'x', bytes: new Uint8Array(), mode: 'replace' }, () => {});
    expect(isExchangeJobRunning(['exchange-import', 'bundle-restore'])).toBe(true);
    expect(isExchangeJobRunning(['exchange-import'])).toBe(false);
    for (const listener of listeners) listener({ data: { type: 'failed', jobId: started[0], message: 'stand-in worker' } });
    expect((await run.outcome).kind).toBe('failed');
    expect(isExchangeJobRunning(['exchange-import', 'bundle-restore'])).toBe(false);
  });
});
