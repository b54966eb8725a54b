/**
 * Validation of every payload that crosses from the renderer into main. The renderer is treated
 * as untrusted: a payload of the wrong shape is refused with a message naming the field.
 */
import type { BackupRequest, FileFilter, OpenFileRequest, PrintRequest, SaveFileRequest } from '../../core/bridge.ts';

export class PayloadError extends Error {
  override readonly name = 'PayloadError';
}

type Shape = Record<string, unknown>;

function record(value: unknown, where: string): Shape {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new PayloadError(`${where}: expected an object`);
  }
  return value as Shape;
}

function text(value: unknown, where: string, maxLength: number): string {
  if (typeof value !== 'string') throw new PayloadError(`${where}: expected a string`);
  if (value.length > maxLength) throw new PayloadError(`${where}: longer than ${maxLength} characters`);
  return value;
}

/** A bare file name: no folders, no parent references, nothing the OS would treat specially. */
export function safeFileName(value: unknown, where: string): string {
  const name = text(value, where, 200);
  if (name.length === 0 || !/^[A-Za-z0-9][A-Za-z0-9._ -]*$/.test(name) || name.includes('..')) {
    throw new PayloadError(`${where}: "${name}" is not a plain file name (letters, digits, . _ - and spaces only)`);
  }
  return name;
}

function bytes(value: unknown, where: string, maxBytes: number): Uint8Array {
  if (!(value instanceof Uint8Array)) throw new PayloadError(`${where}: expected bytes (Uint8Array)`);
  if (value.byteLength > maxBytes) throw new PayloadError(`${where}: ${value.byteLength} bytes exceeds the limit of ${maxBytes}`);
  return value;
}

function filters(value: unknown, where: string): FileFilter[] {
  if (!Array.isArray(value) || value.length > 20) throw new PayloadError(`${where}: expected a list of at most 20 filters`);
  return value.map((item, index) => {
    const entry = record(item, `${where}[${index}]`);
    const extensions = entry.extensions;
    if (!Array.isArray(extensions) || extensions.length > 20) {
      throw new PayloadError(`${where}[${index}].extensions: expected a list of at most 20 extensions`);
    }
    return {
      label: text(entry.label, `${where}[${index}].label`, 100),
      extensions: extensions.map((ext, j) => {
        const value = text(ext, `${where}[${index}].extensions[${j}]`, 16);
        if (!/^(\*|[A-Za-z0-9.]+)$/.test(value)) throw new PayloadError(`${where}[${index}].extensions[${j}]: "${value}" is not an extension`);
        return value;
      }),
    };
  });
}

const MAX_FILE_BYTES = 2 * 1024 ** 3 - 1;
const MAX_HTML_CHARS = 64 * 1024 ** 2;

export function parseOpenFileRequest(payload: unknown): OpenFileRequest {
  const p = record(payload, 'openFiles');
  if (typeof p.multiple !== 'boolean') throw new PayloadError('openFiles.multiple: expected true or false');
  return { title: text(p.title, 'openFiles.title', 200), filters: filters(p.filters, 'openFiles.filters'), multiple: p.multiple };
}

export function parseSaveFileRequest(payload: unknown): SaveFileRequest {
  const p = record(payload, 'saveFile');
  return {
    title: text(p.title, 'saveFile.title', 200),
    suggestedName: safeFileName(p.suggestedName, 'saveFile.suggestedName'),
    filters: filters(p.filters, 'saveFile.filters'),
    bytes: bytes(p.bytes, 'saveFile.bytes', MAX_FILE_BYTES),
  };
}

export function parseBackupRequest(payload: unknown): BackupRequest {
  const p = record(payload, 'writeBackup');
  const keep = p.keepNewest;
  if (typeof keep !== 'number' || !Number.isInteger(keep) || keep < 1 || keep > 365) {
    throw new PayloadError('writeBackup.keepNewest: expected a whole number from 1 to 365');
  }
  return {
    fileName: safeFileName(p.fileName, 'writeBackup.fileName'),
    bytes: bytes(p.bytes, 'writeBackup.bytes', MAX_FILE_BYTES),
    keepNewest: keep,
  };
}

export function parsePrintRequest(payload: unknown): PrintRequest {
  const p = record(payload, 'printReport');
  return {
    html: text(p.html, 'printReport.html', MAX_HTML_CHARS),
    suggestedName: safeFileName(p.suggestedName, 'printReport.suggestedName'),
  };
}
