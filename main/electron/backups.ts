/**
 * Rolling backups on disk. A backup is written to a temporary file in the same folder, flushed,
 * then renamed over its final name, so an interrupted write never damages an earlier backup.
 * Only files with the backup extension are counted or removed by the rotation.
 */
import { mkdir, open, readdir, readFile, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import type { BackupInfo } from '../../core/bridge.ts';

export const BACKUP_EXTENSION = '.mlbundle';
const TEMP_SUFFIX = '.partial';

export async function writeBackupFile(folder: string, fileName: string, bytes: Uint8Array, keepNewest: number): Promise<BackupInfo> {
  if (!fileName.endsWith(BACKUP_EXTENSION)) {
    throw new Error(`backup file name "${fileName}" must end with ${BACKUP_EXTENSION}`);
  }
  await mkdir(folder, { recursive: true });
  const finalPath = path.join(folder, fileName);
  const tempPath = `${finalPath}.${process.pid}.${Date.now()}${TEMP_SUFFIX}`;
  const handle = await open(tempPath, 'wx');
  try {
    await handle.writeFile(bytes);
    await handle.sync();
  } finally {
    await handle.close();
  }
  await rename(tempPath, finalPath);
  await rotateBackups(folder, keepNewest);
  const written = await stat(finalPath);
  return { fileName, sizeBytes: written.size, writtenUtc: written.mtime.toISOString() };
}

/** The backups in `folder`, newest first; leftovers of interrupted writes are not listed. */
export async function listBackupFiles(folder: string): Promise<BackupInfo[]> {
  let names: string[];
  try {
    names = await readdir(folder);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  const infos = await Promise.all(
    names.filter((name) => name.endsWith(BACKUP_EXTENSION)).map(async (name) => {
      const info = await stat(path.join(folder, name));
      return { fileName: name, sizeBytes: info.size, writtenUtc: info.mtime.toISOString(), mtimeMs: info.mtimeMs };
    }),
  );
  infos.sort((a, b) => b.mtimeMs - a.mtimeMs || b.fileName.localeCompare(a.fileName));
  return infos.map(({ fileName, sizeBytes, writtenUtc }) => ({ fileName, sizeBytes, writtenUtc }));
}

/** Keeps the newest `keepNewest` backups and removes older ones and stale partial writes. */
export async function rotateBackups(folder: string, keepNewest: number): Promise<void> {
  const backups = await listBackupFiles(folder);
  for (const old of backups.slice(keepNewest)) await rm(path.join(folder, old.fileName), { force: true });
  const stale = (await readdir(folder)).filter((name) => name.endsWith(TEMP_SUFFIX));
  for (const name of stale) await rm(path.join(folder, name), { force: true });
}

export async function readBackupFile(folder: string, fileName: string): Promise<Uint8Array> {
  if (!fileName.endsWith(BACKUP_EXTENSION)) throw new Error(`"${fileName}" is not a backup file`);
  return new Uint8Array(await readFile(path.join(folder, fileName)));
}
