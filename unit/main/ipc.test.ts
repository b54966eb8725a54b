// The main-process bridge handlers (main/electron/ipc.ts), run against a stand-in for Electron's
// ipcMain: the sender is checked and every payload is validated before anything touches disk.
import { mkdtemp } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it, vi } from 'vitest';

type Handler = (event: unknown, payload?: unknown) => unknown;
const handlers = new Map<string, Handler>();
let userData = '';

vi.mock('electron', () => ({
  app: { getVersion: () => '9.9.9', getPath: () => userData },
  ipcMain: { handle: (channel: string, handler: Handler) => handlers.set(channel, handler) },
  dialog: {},
  BrowserWindow: class {},
}));

const windowContents = { id: 7 };
const fromApp = { sender: { id: 7 }, senderFrame: { url: 'ledger://app/index.html', parent: null } };
const fromElsewhere = { sender: { id: 7 }, senderFrame: { url: 'https://example.org/', parent: null } };
const fromOtherContents = { sender: { id: 8 }, senderFrame: { url: 'ledger://app/index.html', parent: null } };
const fromSubframe = { sender: { id: 7 }, senderFrame: { url: 'ledger://app/index.html', parent: {} } };

beforeAll(async () => {
  userData = await mkdtemp(path.join(os.tmpdir(), 'ml-ipc-'));
  const { registerBridgeHandlers } = await import('../../main/electron/ipc.ts');
  registerBridgeHandlers(() => ({ webContents: windowContents }) as never);
});

describe('bridge handlers in main', () => {
  it('register one handler per channel, all under the one prefix', () => {
    expect([...handlers.keys()].sort()).toEqual(
      ['info', 'list-backups', 'open-files', 'print-report', 'read-backup', 'save-file', 'write-backup'].map((c) => `meridian-ledger:${c}`),
    );
  });
  it('info() answers ShellInfo to the app window and refuses anyone else', () => {
    const info = handlers.get('meridian-ledger:info');
    expect(info?.(fromApp)).toEqual({ shell: 'electron', appVersion: '9.9.9', automaticBackups: true });
    expect(() => info?.(fromElsewhere)).toThrow(/refused/);
  });
  it('refuses messages from another page, another window or a subframe', async () => {
    const list = handlers.get('meridian-ledger:list-backups');
    for (const event of [fromElsewhere, fromOtherContents, fromSubframe]) {
      expect(await list?.(event)).toMatchObject({ kind: 'failed', message: expect.stringMatching(/refused/) });
    }
  });
  it('validates the payload and names the bad field', async () => {
    const write = handlers.get('meridian-ledger:write-backup');
    expect(await write?.(fromApp, { fileName: '../../evil.mlbundle', bytes: new Uint8Array(1), keepNewest: 3 })).toMatchObject({
      kind: 'failed',
      message: expect.stringMatching(/writeBackup\.fileName/),
    });
    expect(await write?.(fromApp, 'not an object')).toMatchObject({ kind: 'failed', message: expect.stringMatching(/expected an object/) });
  });
  it('writes, lists and reads a backup in the user-data folder', async () => {
    const bytes = new Uint8Array([1, 2, 3, 4]);
    const written = await handlers.get('meridian-ledger:write-backup')?.(fromApp, { fileName: 'archive-2026-12-01.mlbundle', bytes, keepNewest: 2 });
    expect(written).toMatchObject({ kind: 'ok', value: { fileName: 'archive-2026-12-01.mlbundle', sizeBytes: 4 } });
    expect(await handlers.get('meridian-ledger:list-backups')?.(fromApp)).toMatchObject({ kind: 'ok', value: [{ fileName: 'archive-2026-12-01.mlbundle' }] });
    const read = (await handlers.get('meridian-ledger:read-backup')?.(fromApp, 'archive-2026-12-01.mlbundle')) as { kind: string; value: Uint8Array };
    expect(Array.from(read.value)).toEqual([1, 2, 3, 4]);
  });
});
