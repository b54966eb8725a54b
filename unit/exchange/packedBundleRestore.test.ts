// `meridian-ledger simulate` then `bundle pack` (the CLI's contract: "a bundle the app can
// restore"), restored by the app's own code into an empty archive. Invented scenario (simulator).
import { spawnSync } from 'node:child_process';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { restoreBundle, verifyBundle } from '../../renderer/exchange/bundleRestore.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { readNightTallies } from '../../renderer/store/nightTallies.ts';
import { allTransits } from '../../renderer/store/transitGroups.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';

const cli = (args: string[]) => spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { encoding: 'utf8' });

describe('a bundle packed from a simulated archive folder', () => {
  test('restores into an empty archive with every night and transit the folder holds', async () => {
    const folder = await mkdtemp(path.join(os.tmpdir(), 'ml-packed-'));
    try {
      expect(cli(['simulate', '--seed', '5', '--years', '1', '--stars', '6', '--out', path.join(folder, 'archive')]).status).toBe(0);
      const packed = cli(['bundle', 'pack', path.join(folder, 'archive'), '--out', path.join(folder, 'a.mlbundle')]);
      expect(packed.status, packed.stderr).toBe(0);
      const counts = /nights (\d+), transits (\d+)/.exec(packed.stdout + packed.stderr);
      expect(counts).not.toBeNull();
      const database = new ArchiveDatabase(uniqueDatabaseName('packed'));
      const bundle = await verifyBundle(database, new Uint8Array(await readFile(path.join(folder, 'a.mlbundle'))), UNCONTROLLED);
      const restored = await restoreBundle(database, bundle, 'into-empty');
      expect(restored.nights).toBe(Number(counts?.[1]));
      // The simulation's truth travels in the bundle (for unpack) but is not part of the archive.
      expect(bundle.rows.has('simulationTruth')).toBe(true);
      expect(restored).not.toHaveProperty('simulationTruth');
      expect((await allTransits(database)).length).toBe(Number(counts?.[2]));
      expect((await readNightTallies(database)).reduce((sum, t) => sum + t.transitCount, 0)).toBe(Number(counts?.[2]));
      database.close();
    } finally {
      await rm(folder, { recursive: true, force: true });
    }
  });
});
