/**
 * The main-process side of the shell bridge. Every handler checks that the message comes from the
 * main window's own top frame on the app origin, validates the payload, and answers with a
 * `BridgeResult` — it never throws across the boundary.
 */
import { readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { BrowserWindow, app, dialog, ipcMain, type IpcMainInvokeEvent } from 'electron';
import { BRIDGE_CHANNELS, type BridgeResult, type OpenedFile, type ShellInfo } from '../../core/bridge.ts';
import { listBackupFiles, readBackupFile, writeBackupFile } from './backups.ts';
import { isAllowedNavigation, reportWindowOptions } from './security-policy.ts';
import { parseBackupRequest, parseOpenFileRequest, parsePrintRequest, parseSaveFileRequest, safeFileName } from './validate-payload.ts';

function failure(error: unknown): BridgeResult<never> {
  return { kind: 'failed', message: error instanceof Error ? error.message : String(error) };
}

export function backupFolder(): string {
  return path.join(app.getPath('userData'), 'backups');
}

export function registerBridgeHandlers(getWindow: () => BrowserWindow | null): void {
  const trusted = (event: IpcMainInvokeEvent): boolean => {
    const window = getWindow();
    const frame = event.senderFrame;
    return window !== null && event.sender.id === window.webContents.id && frame !== null && frame.parent === null && isAllowedNavigation(frame.url);
  };
  let backupQueue: Promise<unknown> = Promise.resolve();

  const handle = <T>(channel: string, run: (payload: unknown) => Promise<BridgeResult<T>>): void => {
    ipcMain.handle(channel, async (event, payload: unknown) => {
      if (!trusted(event)) return { kind: 'failed', message: 'refused: the request did not come from the Meridian Ledger window' };
      try {
        return await run(payload);
      } catch (error) {
        return failure(error);
      }
    });
  };

  // `info` answers ShellInfo itself (not a BridgeResult), as ShellBridge.info declares; an
  // untrusted sender gets a rejected promise instead.
  ipcMain.handle(BRIDGE_CHANNELS.info, (event): ShellInfo => {
    if (!trusted(event)) throw new Error('refused: the request did not come from the Meridian Ledger window');
    return { shell: 'electron', appVersion: app.getVersion(), automaticBackups: true };
  });

  handle(BRIDGE_CHANNELS.openFiles, async (payload): Promise<BridgeResult<readonly OpenedFile[]>> => {
    const request = parseOpenFileRequest(payload);
    const window = getWindow();
    const options: Electron.OpenDialogOptions = {
      title: request.title,
      filters: request.filters.map((f) => ({ name: f.label, extensions: [...f.extensions] })),
      properties: request.multiple ? ['openFile', 'multiSelections'] : ['openFile'],
    };
    const result = window ? await dialog.showOpenDialog(window, options) : await dialog.showOpenDialog(options);
    if (result.canceled || result.filePaths.length === 0) return { kind: 'cancelled' };
    const files = await Promise.all(result.filePaths.map(async (file) => ({ name: path.basename(file), bytes: new Uint8Array(await readFile(file)) })));
    return { kind: 'ok', value: files };
  });

  handle(BRIDGE_CHANNELS.saveFile, async (payload) => {
    const request = parseSaveFileRequest(payload);
    const window = getWindow();
    const options: Electron.SaveDialogOptions = {
      title: request.title,
      defaultPath: request.suggestedName,
      filters: request.filters.map((f) => ({ name: f.label, extensions: [...f.extensions] })),
    };
    const result = window ? await dialog.showSaveDialog(window, options) : await dialog.showSaveDialog(options);
    if (result.canceled || result.filePath === undefined) return { kind: 'cancelled' };
    await writeFile(result.filePath, request.bytes);
    return { kind: 'ok', value: { savedAs: result.filePath } };
  });

  handle(BRIDGE_CHANNELS.writeBackup, async (payload) => {
    const request = parseBackupRequest(payload);
    const task = backupQueue.then(() => writeBackupFile(backupFolder(), request.fileName, request.bytes, request.keepNewest));
    backupQueue = task.catch(() => undefined);
    return { kind: 'ok', value: await task };
  });

  handle(BRIDGE_CHANNELS.listBackups, async () => ({ kind: 'ok', value: await listBackupFiles(backupFolder()) }));

  handle(BRIDGE_CHANNELS.readBackup, async (payload) => {
    const name = safeFileName(payload, 'readBackup');
    return { kind: 'ok', value: await readBackupFile(backupFolder(), name) };
  });

  handle(BRIDGE_CHANNELS.printReport, async (payload) => {
    const request = parsePrintRequest(payload);
    const reportWindow = new BrowserWindow(reportWindowOptions());
    try {
      reportWindow.webContents.setWindowOpenHandler(() => ({ action: 'deny' }));
      await reportWindow.loadURL(`data:text/html;charset=utf-8;base64,${Buffer.from(request.html, 'utf8').toString('base64')}`);
      const pdf = await reportWindow.webContents.printToPDF({ printBackground: true, pageSize: 'A4' });
      const window = getWindow();
      const name = request.suggestedName.endsWith('.pdf') ? request.suggestedName : `${request.suggestedName}.pdf`;
      const options: Electron.SaveDialogOptions = { title: 'Save report as PDF', defaultPath: name, filters: [{ name: 'PDF', extensions: ['pdf'] }] };
      const result = window ? await dialog.showSaveDialog(window, options) : await dialog.showSaveDialog(options);
      if (result.canceled || result.filePath === undefined) return { kind: 'cancelled' };
      await writeFile(result.filePath, pdf);
      return { kind: 'ok', value: { savedAs: result.filePath } };
    } finally {
      reportWindow.destroy();
    }
  });
}
