// `npm start`: builds the renderer and the main process, then launches Electron. Where Electron's
// binary cannot be had (no internet when the package installed), it says so and points to the
// browser mode instead of failing obscurely.
import { spawn, spawnSync } from 'node:child_process';
import { createRequire } from 'node:module';
import { electronBinaryPath } from './electron-binary.mjs';

const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
const build = spawnSync(npm, ['run', 'build'], { stdio: 'inherit' });
if (build.status !== 0) process.exit(build.status ?? 1);

let binary = electronBinaryPath();
if (binary === null) {
  // The electron package downloads its binary on first use; try that once.
  try {
    binary = createRequire(import.meta.url)('electron');
  } catch {
    binary = null;
  }
}
if (binary === null || typeof binary !== 'string') {
  console.error(
    [
      '',
      'Meridian Ledger: the Electron binary is not installed on this machine, so the desktop app cannot start.',
      'The electron package downloads it from the internet on first use; that download failed here.',
      'Either connect to the internet and run `npm start` again, or use the browser mode:',
      '',
      '    npm run start:web      (serves the app on http://127.0.0.1 and prints the URL)',
      '',
    ].join('\n'),
  );
  process.exit(1);
}
const child = spawn(binary, ['.'], { stdio: 'inherit' });
child.on('exit', (code) => process.exit(code ?? 0));
