/**
 * Archive folders on disk (Node): the thin file layer under core/archive-folder, which holds the
 * layout and the formats. `bundle pack DIR` reads a folder with `readArchiveFolderFiles` and hands
 * the map to core's `readArchiveFolder`; `bundle unpack` and `simulate` write with
 * `writeArchiveFolderFiles`.
 */
import { mkdir, readdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';

/** Every file under `dir` (relative paths with `/`) → its bytes. Skips dot-files. */
export async function readArchiveFolderFiles(dir: string): Promise<Map<string, Uint8Array>> {
  const files = new Map<string, Uint8Array>();
  const walk = async (relative: string): Promise<void> => {
    for (const entry of await readdir(path.join(dir, relative), { withFileTypes: true })) {
      if (entry.name.startsWith('.')) continue;
      const child = relative === '' ? entry.name : `${relative}/${entry.name}`;
      if (entry.isDirectory()) await walk(child);
      else if (entry.isFile()) files.set(child, new Uint8Array(await readFile(path.join(dir, child))));
    }
  };
  await walk('');
  return files;
}

/** True when `dir` does not exist or is empty. */
export async function isEmptyOrMissing(dir: string): Promise<boolean> {
  try {
    return (await readdir(dir)).length === 0;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return true;
    throw error;
  }
}

/**
 * Writes the folder's files into `dir`: first into a sibling temporary folder, then swapped in,
 * so a failure half-way leaves no half-written archive. An existing `dir` is replaced only when
 * `replace` is set (the caller decides, e.g. `--force`).
 */
export async function writeArchiveFolderFiles(dir: string, files: ReadonlyMap<string, string | Uint8Array>, replace: boolean): Promise<void> {
  const target = path.resolve(dir);
  if (!replace && !(await isEmptyOrMissing(target))) throw new Error(`${dir} is not empty; choose an empty folder or pass --force to replace it`);
  const temporary = `${target}.partial-${process.pid}`;
  await rm(temporary, { recursive: true, force: true });
  try {
    for (const [relative, content] of files) {
      if (relative.split('/').some((part) => part === '..' || part === '')) throw new Error(`refusing to write "${relative}": not a plain relative path`);
      const file = path.join(temporary, ...relative.split('/'));
      await mkdir(path.dirname(file), { recursive: true });
      await writeFile(file, content);
    }
    await rm(target, { recursive: true, force: true });
    await mkdir(path.dirname(target), { recursive: true });
    await rename(temporary, target);
  } catch (error) {
    await rm(temporary, { recursive: true, force: true });
    throw error;
  }
}
