// Rolling backups: write to a temporary file, rename, keep exactly the newest N.
import { mkdtemp, readFile, readdir, utimes, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { listBackupFiles, readBackupFile, rotateBackups, writeBackupFile } from '../../main/electron/backups.ts';

async function tempFolder(): Promise<string> {
  return mkdtemp(path.join(os.tmpdir(), 'ml-backups-'));
}

describe('writeBackupFile', () => {
  it('keeps exactly N backups, the newest ones', async () => {
    const folder = await tempFolder();
    for (let day = 1; day <= 9; day++) {
      const name = `archive-2026-01-0${day}.mlbundle`;
      await writeBackupFile(folder, name, new TextEncoder().encode(`day ${day}`), 4);
      // Give each file a distinct modification time, one day apart.
      const when = new Date(Date.UTC(2026, 0, day));
      await utimes(path.join(folder, name), when, when);
    }
    await rotateBackups(folder, 4);
    const kept = await listBackupFiles(folder);
    expect(kept.map((b) => b.fileName)).toEqual([9, 8, 7, 6].map((d) => `archive-2026-01-0${d}.mlbundle`));
    expect(new TextDecoder().decode(await readBackupFile(folder, kept[0].fileName))).toBe('day 9');
  });

  it('an interrupted write leaves the previous backup valid and is swept later', async () => {
    const folder = await tempFolder();
    await writeBackupFile(folder, 'archive-a.mlbundle', new TextEncoder().encode('complete'), 3);
    // A crash between writing the temporary file and the rename leaves only a partial file.
    await writeFile(path.join(folder, 'archive-b.mlbundle.123.456.partial'), 'trunc');
    expect((await listBackupFiles(folder)).map((b) => b.fileName)).toEqual(['archive-a.mlbundle']);
    expect(await readFile(path.join(folder, 'archive-a.mlbundle'), 'utf8')).toBe('complete');
    await writeBackupFile(folder, 'archive-c.mlbundle', new TextEncoder().encode('next'), 3);
    expect((await readdir(folder)).filter((n) => n.endsWith('.partial'))).toEqual([]);
  });

  it('refuses a name without the backup extension', async () => {
    await expect(writeBackupFile(await tempFolder(), 'notes.txt', new Uint8Array(1), 2)).rejects.toThrow(/\.mlbundle/);
  });
});
