// Finds the Electron binary without triggering the electron package's lazy download.
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';

/** The absolute path of the Electron executable, or null when its binary is not installed. */
export function electronBinaryPath() {
  const require = createRequire(import.meta.url);
  let packageDir;
  try {
    packageDir = path.dirname(require.resolve('electron/package.json'));
  } catch {
    return null;
  }
  const pathFile = path.join(packageDir, 'path.txt');
  if (process.env.ELECTRON_OVERRIDE_DIST_PATH) {
    const name = existsSync(pathFile) ? readFileSync(pathFile, 'utf8').trim() : 'electron';
    const candidate = path.join(process.env.ELECTRON_OVERRIDE_DIST_PATH, name);
    return existsSync(candidate) ? candidate : null;
  }
  if (!existsSync(pathFile)) return null;
  const candidate = path.join(packageDir, 'dist', readFileSync(pathFile, 'utf8').trim());
  return existsSync(candidate) ? candidate : null;
}
