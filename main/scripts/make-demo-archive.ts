// Makes the demo archive that the app opens on first start: a simulated, invented observatory
// (six years; a transit instrument with 24 programme stars and a fixed zenith camera with 8 stars
// near the zenith, which the transit instrument observes too) packed into
// assets/demo/demo-archive.mlbundle. Deterministic:
// the same seed and options give the same bytes. Run: npx tsx main/scripts/make-demo-archive.ts
import { spawnSync } from 'node:child_process';
import { copyFile, mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { packFolder } from '../archive/pack-folder.ts';

export const DEMO_SEED = 20261201;
export const DEMO_ARGS = ['--seed', String(DEMO_SEED), '--years', '6', '--stars', '24', '--start', '2019-09-01', '--thermal', '0.02', '--zenith-camera-stars', '8'];
const CREATED_UTC = '2026-12-01T00:00:00.000Z';

const folder = await mkdtemp(path.join(os.tmpdir(), 'ml-demo-'));
const archive = path.join(folder, 'archive');
const simulated = spawnSync(process.execPath, ['main/cli/bin.mjs', 'simulate', ...DEMO_ARGS, '--out', archive], { stdio: 'inherit' });
if (simulated.status !== 0) process.exit(simulated.status ?? 1);
// The app's archive has no table for a simulation's truth: it is kept beside the bundle instead.
await copyFile(path.join(archive, 'truth.json'), path.resolve('assets/demo/demo-truth.json'));
await rm(path.join(archive, 'truth.json'));
const out = path.resolve('assets/demo/demo-archive.mlbundle');
const counts = await packFolder(archive, out, 'meridian-ledger demo archive (main/scripts/make-demo-archive.ts)', CREATED_UTC);
await rm(folder, { recursive: true, force: true });
console.log(`wrote ${out}: ${JSON.stringify(counts)}`);
