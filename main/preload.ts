/**
 * The preload: exposes exactly one object, the shell bridge, to the renderer. It may import only
 * `electron` and types from core/ (lint enforces it); the channel names are spelled out here and
 * checked against the `BridgeChannels` type, so they cannot drift from main's.
 */
import { contextBridge, ipcRenderer } from 'electron';
import type { BridgeChannels, BridgeGlobalName, ShellBridge } from '../core/bridge.ts';

const channels: BridgeChannels = {
  info: 'meridian-ledger:info',
  openFiles: 'meridian-ledger:open-files',
  saveFile: 'meridian-ledger:save-file',
  writeBackup: 'meridian-ledger:write-backup',
  listBackups: 'meridian-ledger:list-backups',
  readBackup: 'meridian-ledger:read-backup',
  printReport: 'meridian-ledger:print-report',
};
const globalName: BridgeGlobalName = 'meridianLedgerShell';

const bridge: ShellBridge = {
  info: () => ipcRenderer.invoke(channels.info),
  openFiles: (request) => ipcRenderer.invoke(channels.openFiles, request),
  saveFile: (request) => ipcRenderer.invoke(channels.saveFile, request),
  writeBackup: (request) => ipcRenderer.invoke(channels.writeBackup, request),
  listBackups: () => ipcRenderer.invoke(channels.listBackups),
  readBackup: (fileName) => ipcRenderer.invoke(channels.readBackup, fileName),
  printReport: (request) => ipcRenderer.invoke(channels.printReport, request),
};

contextBridge.exposeInMainWorld(globalName, Object.freeze(bridge));
