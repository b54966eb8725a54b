// The Solve view's records→inputs bridge (store records → archive folder files → SolveInputs, in the
// worker task) against the real `meridian-ledger solve --json` on the same folder, which the real
// `meridian-ledger simulate` wrote: the same numbers must come out. Invented (simulated) data only.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readArchiveFolder } from '../../core/archive-folder/archive-folder.ts';
import { DEFAULT_JOINT_MODEL } from '../../core/joint/joint-model.ts';
import { TaskCancelledError, UNCONTROLLED } from '../../core/task/task-control.ts';
import { readArchiveFolderFiles } from '../../main/archive/archive-folder-files.ts';
import { folderFingerprint } from '../../renderer/solve/folderFingerprint.ts';
import { WHOLE_ARCHIVE } from '../../renderer/solve/solveSelection.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { runJointSolve, solveInputsFromStore } from '../../renderer/worker/tasks/jointSolve.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';
import { putTransitRows } from '../store/transitRows.ts';
import { allTransits } from '../../renderer/store/transitGroups.ts';

const MAS = 1; // results are in mas; named so the tolerances read as units
const run = (args: string[]) => spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { encoding: 'utf8', env: { ...process.env, TZ: 'UTC' } });
let dir: string;
let cli: { stars: { id: string; parallaxMas: number; parallaxSigmaMas: number; pmRaMasYr: number; pmDecMasYr: number; observations: number }[]; global: Record<string, number>; unitWeightError: number };
let databaseName: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'ml-solve-view-'));
  const made = run(['simulate', '--out', join(dir, 'archive'), '--seed', '11', '--years', '2', '--stars', '6', '--blunder-rate', '0']);
  expect(made.status, made.stderr).toBe(0);
  const solved = run(['solve', join(dir, 'archive'), '--json']);
  expect(solved.status, solved.stderr).toBe(0);
  cli = JSON.parse(solved.stdout);
  // The folder read into records and stored, as the Exchange view's folder import leaves them.
  const folder = readArchiveFolder(await readArchiveFolderFiles(join(dir, 'archive')), '2026-12-01T00:00:00.000Z');
  expect(folder.rejected).toEqual([]);
  const content = folder.content!;
  databaseName = uniqueDatabaseName('solve-bridge');
  const database = new ArchiveDatabase(databaseName);
  await database.sites.put(content.site);
  await database.instruments.bulkPut([...content.instruments]);
  await database.instrumentEvents.bulkPut([...content.events]);
  await database.stars.bulkPut([...content.stars]);
  await database.nights.bulkPut([...content.nights]);
  await putTransitRows(database, [...content.transits]);
  database.close();
}, 120_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('runJointSolve(request) on stored records', () => {
  it('gives the parallaxes, proper motions, Δκ and unit-weight error that `solve --json` prints for the same folder', async () => {
    const { reduction } = await runJointSolve({ kind: 'joint-solve', databaseName, label: 'bridge check', model: DEFAULT_JOINT_MODEL, selection: WHOLE_ARCHIVE, codeVersion: 'test' }, UNCONTROLLED);
    const results = reduction.results as unknown as typeof cli & { starNights: Record<string, number>; signatures: unknown; correlation: unknown; instrumentSeries: unknown[] };
    expect(results.stars.map((s) => s.id)).toEqual(cli.stars.map((s) => s.id));
    for (const [k, star] of results.stars.entries()) {
      const want = cli.stars[k];
      expect(star.observations, star.id).toBe(want.observations);
      // Same inputs and code path: agreement to rounding of the text formats (far below 0.01 σ).
      expect(Math.abs(star.parallaxMas - want.parallaxMas), `${star.id} parallax want ${want.parallaxMas} got ${star.parallaxMas}`).toBeLessThan(0.001 * MAS);
      expect(Math.abs(star.pmRaMasYr - want.pmRaMasYr), `${star.id} μα*`).toBeLessThan(0.001 * MAS);
      expect(Math.abs(star.pmDecMasYr - want.pmDecMasYr), `${star.id} μδ`).toBeLessThan(0.001 * MAS);
      expect(star.parallaxSigmaMas / want.parallaxSigmaMas).toBeCloseTo(1, 6);
      expect(results.starNights[star.id]).toBeGreaterThan(1);
      expect(results.starNights[star.id]).toBeLessThanOrEqual(star.observations);
    }
    expect(Math.abs(results.global.deltaKappaArcsec - cli.global.deltaKappaArcsec)).toBeLessThan(1e-6);
    expect(results.unitWeightError).toBeCloseTo(cli.unitWeightError, 6);
    expect(results.signatures).toBeDefined();
    expect(results.correlation).toBeDefined();
    expect(results.instrumentSeries.length).toBeGreaterThan(10);
    expect(reduction.residuals).toHaveLength(cli.stars.reduce((n, s) => n + s.observations, 0));
    // It was saved.
    const database = new ArchiveDatabase(databaseName);
    expect((await database.reductions.get(reduction.id))?.inputFingerprint).toBe(reduction.inputFingerprint);
    database.close();
  }, 120_000);
});

describe('folderFingerprint(files)', () => {
  it('is SHA-256 of path, NUL, length, NUL, bytes in path order (checked with node:crypto)', () => {
    const files = new Map([['b.csv', new Uint8Array([1, 2, 3])], ['a.json', new TextEncoder().encode('{}')]]);
    const want = createHash('sha256').update('a.json\u00002\u0000{}').update('b.csv\u00003\u0000').update(Buffer.from([1, 2, 3])).digest('hex');
    expect(folderFingerprint(files)).toBe(want);
  });
  it('is stable over two reads of the same store and changes when one transit changes', async () => {
    const database = new ArchiveDatabase(databaseName);
    const first = (await solveInputsFromStore(database, WHOLE_ARCHIVE)).fingerprint;
    expect((await solveInputsFromStore(database, WHOLE_ARCHIVE)).fingerprint).toBe(first);
    expect(first).toMatch(/^[0-9a-f]{64}$/);
    const transit = (await allTransits(database))[0];
    await putTransitRows(database, [{ ...transit, userRejected: !transit.userRejected }]);
    expect((await solveInputsFromStore(database, WHOLE_ARCHIVE)).fingerprint).not.toBe(first);
    database.close();
  });
});

describe('runJointSolve(request, control) cancelled', () => {
  const request = () => ({ kind: 'joint-solve' as const, databaseName, label: 'cancelled', model: DEFAULT_JOINT_MODEL, selection: WHOLE_ARCHIVE, codeVersion: 'test' });
  const controlCancellingAt = (threshold: number) => {
    const cancellation = { isCancelled: false };
    return { cancellation, reportProgress: (done: number) => { if (done >= threshold) cancellation.isCancelled = true; }, yieldToHost: () => Promise.resolve() };
  };
  it.each([['during the nightly reductions', 100], ['during the joint passes', 750]])('%s: throws TaskCancelledError and saves nothing', async (_when, threshold) => {
    const database = new ArchiveDatabase(databaseName);
    const before = await database.reductions.count();
    await expect(runJointSolve(request(), controlCancellingAt(threshold))).rejects.toBeInstanceOf(TaskCancelledError);
    expect(await database.reductions.count()).toBe(before);
    database.close();
  }, 60_000);
});
