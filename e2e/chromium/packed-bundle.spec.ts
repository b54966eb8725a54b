import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, openApp, test } from './fixtures.ts';

// The CLI's contract (README, `bundle pack`): a simulated archive folder packed into a bundle is
// restored by the app. Invented scenario (the simulator's).
test('a bundle packed by the CLI from a simulated archive restores in the app, its truth checked but not restored', async ({ page }) => {
  const dir = mkdtempSync(join(tmpdir(), 'packed-e2e-'));
  try {
    const run = (args: string[]) => {
      const result = spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { encoding: 'utf8' });
      if (result.status !== 0) throw new Error(`meridian-ledger ${args.join(' ')} failed: ${result.stderr}`);
      return `${result.stdout}${result.stderr}`;
    };
    run(['simulate', '--seed', '11', '--years', '1', '--stars', '6', '--out', join(dir, 'archive')]);
    const packed = run(['bundle', 'pack', join(dir, 'archive'), '--out', join(dir, 'sim.mlbundle')]);
    const nights = Number(/nights (\d+)/.exec(packed)?.[1]);
    const transits = Number(/transits (\d+)/.exec(packed)?.[1]);
    expect(nights).toBeGreaterThan(10);
    await openApp(page, './#/exchange');
    const chooser = page.waitForEvent('filechooser');
    await page.getByRole('button', { name: 'Restore from a bundle…' }).click();
    await (await chooser).setFiles(join(dir, 'sim.mlbundle'));
    const preview = page.getByTestId('bundle-preview');
    await expect(preview).toContainText('simulationTruth: 1 (a simulation\'s known truth: checked, not restored)');
    await page.getByRole('button', { name: 'Restore into this empty archive' }).click();
    await expect(page.getByTestId('bundle-message')).toContainText('Restored');
    await expect(page.getByTestId('archive-counts')).toContainText(`${nights} nights · ${transits} transits`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
});
