import type {
  BackupInfo,
  BackupRequest,
  BridgeResult,
  OpenFileRequest,
  OpenedFile,
  PrintRequest,
  SaveFileRequest,
  ShellBridge,
  ShellInfo,
} from '../../core/bridge.ts';
import { downloadBytes } from './downloadBytes.ts';
import { pickFiles } from './pickFiles.ts';
import { printHtml } from './printHtml.ts';

/** Why listBackups/readBackup fail in the browser, and what to do instead. */
export const BROWSER_HAS_NO_BACKUP_FOLDER =
  'The browser keeps no backup folder: each backup was a download, saved wherever the browser ' +
  'puts downloads. To restore one, use Exchange → Restore and choose the file.';

function failure(action: string, error: unknown): { kind: 'failed'; message: string } {
  const reason = error instanceof Error ? error.message : String(error);
  return { kind: 'failed', message: `${action} failed in the browser: ${reason}. Try again, or use the desktop app.` };
}

/**
 * The ShellBridge for a plain browser: file input to open, downloads to save and back up, a hidden
 * iframe to print. The browser never reports where a download went, so `savedAs` is the file name.
 */
export function createBrowserBridge(appVersion: string): ShellBridge {
  return {
    info: async (): Promise<ShellInfo> => ({ shell: 'browser', appVersion, automaticBackups: false }),

    openFiles: (request: OpenFileRequest): Promise<BridgeResult<readonly OpenedFile[]>> => pickFiles(request),

    saveFile: async (request: SaveFileRequest) => {
      try {
        await downloadBytes(request.bytes, request.suggestedName);
        return { kind: 'ok', value: { savedAs: request.suggestedName } };
      } catch (error) {
        return failure('Saving', error);
      }
    },

    // keepNewest cannot apply: the page cannot see or delete earlier downloads.
    writeBackup: async (request: BackupRequest): Promise<BridgeResult<BackupInfo>> => {
      try {
        await downloadBytes(request.bytes, request.fileName);
        const info = { fileName: request.fileName, sizeBytes: request.bytes.byteLength, writtenUtc: new Date().toISOString() };
        return { kind: 'ok', value: info };
      } catch (error) {
        return failure('Writing the backup', error);
      }
    },

    listBackups: async () => ({ kind: 'failed', message: BROWSER_HAS_NO_BACKUP_FOLDER }),

    readBackup: async () => ({ kind: 'failed', message: BROWSER_HAS_NO_BACKUP_FOLDER }),

    printReport: async (request: PrintRequest) => {
      try {
        printHtml(request.html);
        return { kind: 'ok', value: { savedAs: request.suggestedName } };
      } catch (error) {
        return failure('Printing', error);
      }
    },
  };
}
