/**
 * The one interface through which the renderer reaches what only the shell can do. It is declared
 * here, as types only, so that the Electron preload, the browser implementation and the renderer
 * agree on it without importing each other.
 *
 * Every method resolves; a user who cancels a dialog gets `{ kind: 'cancelled' }`, and a failure
 * gets `{ kind: 'failed', message }` whose message says what went wrong and what to do.
 */

/** A file the user chose to open: its name and its bytes, never a path the renderer could reuse. */
export interface OpenedFile {
  readonly name: string;
  readonly bytes: Uint8Array;
}

/** Which kinds of file a dialog offers; `extensions` are without the leading dot. */
export interface FileFilter {
  readonly label: string;
  readonly extensions: readonly string[];
}

export type BridgeResult<T> =
  | { readonly kind: 'ok'; readonly value: T }
  | { readonly kind: 'cancelled' }
  | { readonly kind: 'failed'; readonly message: string };

export interface OpenFileRequest {
  readonly title: string;
  readonly filters: readonly FileFilter[];
  readonly multiple: boolean;
}

export interface SaveFileRequest {
  readonly title: string;
  readonly suggestedName: string;
  readonly filters: readonly FileFilter[];
  readonly bytes: Uint8Array;
}

/** A rolling backup written by the shell; in the browser the equivalent is a download. */
export interface BackupRequest {
  /** File name inside the backup folder, e.g. `archive-2026-12-01.mlbundle`. */
  readonly fileName: string;
  readonly bytes: Uint8Array;
  /** How many of the newest backups to keep after this one is written. */
  readonly keepNewest: number;
}

export interface BackupInfo {
  readonly fileName: string;
  readonly sizeBytes: number;
  /** ISO 8601 UTC time the backup was written. */
  readonly writtenUtc: string;
}

export interface PrintRequest {
  /** A self-contained HTML document (styles inline, images as data: URLs). */
  readonly html: string;
  readonly suggestedName: string;
}

export interface ShellInfo {
  readonly shell: 'electron' | 'browser';
  readonly appVersion: string;
  /** Whether backups go to disk by themselves (Electron) or need the user to download (browser). */
  readonly automaticBackups: boolean;
}

export interface ShellBridge {
  info(): Promise<ShellInfo>;
  openFiles(request: OpenFileRequest): Promise<BridgeResult<readonly OpenedFile[]>>;
  saveFile(request: SaveFileRequest): Promise<BridgeResult<{ readonly savedAs: string }>>;
  writeBackup(request: BackupRequest): Promise<BridgeResult<BackupInfo>>;
  listBackups(): Promise<BridgeResult<readonly BackupInfo[]>>;
  readBackup(fileName: string): Promise<BridgeResult<Uint8Array>>;
  printReport(request: PrintRequest): Promise<BridgeResult<{ readonly savedAs: string }>>;
}

/**
 * The IPC channels, one per bridge method, all under one prefix. The channel names are spelled as
 * a type so that the preload (which may import only types) is checked against them by the compiler;
 * main imports the value below.
 */
export interface BridgeChannels {
  readonly info: 'meridian-ledger:info';
  readonly openFiles: 'meridian-ledger:open-files';
  readonly saveFile: 'meridian-ledger:save-file';
  readonly writeBackup: 'meridian-ledger:write-backup';
  readonly listBackups: 'meridian-ledger:list-backups';
  readonly readBackup: 'meridian-ledger:read-backup';
  readonly printReport: 'meridian-ledger:print-report';
}

export const BRIDGE_CHANNEL_PREFIX = 'meridian-ledger:';

export const BRIDGE_CHANNELS: BridgeChannels = {
  info: 'meridian-ledger:info',
  openFiles: 'meridian-ledger:open-files',
  saveFile: 'meridian-ledger:save-file',
  writeBackup: 'meridian-ledger:write-backup',
  listBackups: 'meridian-ledger:list-backups',
  readBackup: 'meridian-ledger:read-backup',
  printReport: 'meridian-ledger:print-report',
};

/** Name under which the preload exposes the bridge on `window`. */
export type BridgeGlobalName = 'meridianLedgerShell';
export const BRIDGE_GLOBAL_NAME: BridgeGlobalName = 'meridianLedgerShell';
