// End-to-end checks of the Electron shell itself. They need Electron's binary, which the electron
// package downloads on first use; where it is absent (no internet) every test here is skipped and
// the run says so.
import { execFileSync } from 'node:child_process';
import { _electron as electron, expect, test } from '@playwright/test';
import { electronBinaryPath } from '../../main/scripts/electron-binary.mjs';

const binary = electronBinaryPath();
if (binary === null) {
  console.log('[electron e2e] skipped: the Electron binary is not installed on this machine (the electron package could not download it).');
}
test.skip(binary === null, 'Electron binary not installed on this machine');

test.beforeAll(() => {
  // test:e2e builds only the renderer; the shell needs main and preload built too.
  execFileSync(process.platform === 'win32' ? 'npm.cmd' : 'npm', ['run', 'build:main'], { stdio: 'inherit' });
});

test('the desktop app opens its window on the app scheme with the bridge exposed', async () => {
  const app = await electron.launch({ executablePath: binary ?? undefined, args: ['.'] });
  try {
    const window = await app.firstWindow();
    await window.waitForLoadState('domcontentloaded');
    expect(window.url()).toMatch(/^ledger:\/\/app\//);
    const shell = await window.evaluate(async () => {
      const bridge = (window as unknown as { meridianLedgerShell?: { info(): Promise<{ shell: string }> } }).meridianLedgerShell;
      return bridge ? (await bridge.info()).shell : 'missing';
    });
    expect(shell).toBe('electron');
    const hasNode = await window.evaluate(() => typeof (window as unknown as { require?: unknown }).require);
    expect(hasNode).toBe('undefined');
  } finally {
    await app.close();
  }
});
