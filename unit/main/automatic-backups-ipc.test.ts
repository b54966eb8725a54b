// The renderer's automatic backups (renderer/exchange/automaticBackups.ts) through the main-process
// handlers (main/electron/ipc.ts), against a recording stand-in for Electron's ipcMain: the names
// the renderer makes pass main's validation, concurrent writes are queued, and rotation keeps N.
import { mkdtemp, readdir } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { backupFileName, runStartupBackup, type StartupBackupDeps } from '../../renderer/exchange/automaticBackups.ts';

type Handler = (event: unknown, payload?: unknown) => unknown;
const handlers = new Map<string, Handler>();
let userData = '';

vi.mock('electron', () => ({
  app: { getVersion: () => '9.9.9', getPath: () => userData },
  ipcMain: { handle: (channel: string, handler: Handler) => handlers.set(channel, handler) },
  dialog: {},
  BrowserWindow: class {},
}));

const fromApp = { sender: { id: 7 }, senderFrame: { url: 'ledger://app/index.html', parent: null } };

beforeAll(async () => {
  userData = await mkdtemp(path.join(os.tmpdir(), 'ml-auto-backup-'));
  const { registerBridgeHandlers } = await import('../../main/electron/ipc.ts');
  registerBridgeHandlers(() => ({ webContents: { id: 7 } }) as never);
});

/** The renderer's bridge as the preload would forward it: each call is one invoke of its channel. */
const invoke = (channel: string, payload?: unknown) => handlers.get(`meridian-ledger:${channel}`)?.(fromApp, payload) as Promise<never>;
const shell: StartupBackupDeps['bridge'] = {
  info: async () => invoke('info'),
  listBackups: () => invoke('list-backups'),
  writeBackup: (request) => invoke('write-backup', request),
};

describe('automatic backups through the main-process handlers', () => {
  it('the daily and the before-upgrade names pass main\'s file-name check', async () => {
    for (const fileName of [backupFileName('2026-12-01T08:00:00.000Z'), backupFileName('2026-12-01T08:00:00.000Z', { beforeUpgradeFrom: 1 })]) {
      expect(await invoke('write-backup', { fileName, bytes: new Uint8Array([1]), keepNewest: 7 })).toMatchObject({ kind: 'ok', value: { fileName } });
    }
  });

  it('nine concurrent writes keep exactly the newest seven, with no partial file left', async () => {
    const names = Array.from({ length: 9 }, (_, day) => backupFileName(`2026-11-${String(10 + day)}T06:00:00.000Z`));
    const results = await Promise.all(names.map((fileName, k) => invoke('write-backup', { fileName, bytes: new Uint8Array([k]), keepNewest: 7 })));
    expect(results.every((r: { kind: string }) => r.kind === 'ok')).toBe(true);
    const files = await readdir(path.join(userData, 'backups'));
    expect(files.filter((f) => f.endsWith('.partial'))).toEqual([]);
    expect(files).toHaveLength(7);
    expect(files).toContain(names[8]);
  });

  it('runStartupBackup writes once through the shell, then finds it not due', async () => {
    const now = Date.now() + 2 * 86_400_000; // two days after the writes above: due
    const deps: StartupBackupDeps = { bridge: shell, hasUserRows: async () => true, nowUtcMs: () => now, keepNewest: async () => 7, exportBundle: async () => new Uint8Array([9, 9]) };
    const first = await runStartupBackup(deps);
    expect(first).toMatchObject({ kind: 'written', backup: { sizeBytes: 2 } });
    const second = await runStartupBackup({ ...deps, nowUtcMs: () => Date.now() + 3_600_000 });
    expect(second).toMatchObject({ kind: 'decided', decision: { kind: 'not-due' } });
  });
});
