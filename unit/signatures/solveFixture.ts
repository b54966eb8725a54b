import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/**
 * A real saved-solve result made by the pipeline itself: `simulate --seed 3 --years 3 --stars 10`
 * then `solve DIR --json --residuals` through the real bin (about 3 s). Fails with the command's
 * own message when either step fails, never returns a partial result.
 */
export function solveResultsFromPipeline(): Record<string, unknown> {
  const dir = mkdtempSync(join(tmpdir(), 'signatures-'));
  try {
    const archive = join(dir, 'archive');
    const run = (args: string[]) => {
      const result = spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
      if (result.status !== 0) throw new Error(`meridian-ledger ${args.join(' ')} failed (${result.status}): ${result.stderr}`);
      return result.stdout;
    };
    run(['simulate', '--seed', '3', '--years', '3', '--stars', '10', '--out', archive]);
    return JSON.parse(run(['solve', archive, '--json', '--residuals'])) as Record<string, unknown>;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
