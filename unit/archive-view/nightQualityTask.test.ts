// The worker task behind the overview's colours, run in Node on part of the shipped demo archive
// (assets/demo: invented, made by the simulator with known truth in demo-truth.json). Checks:
// every night gets a quality, a second pass reduces nothing, an edit/reject/restore reduces
// only its night again, a cancel keeps what was done, and a night with a planted blunder (from
// the simulator's truth) stands out from the clean nights.
import { readFile } from 'node:fs/promises';
import { beforeAll, describe, expect, test } from 'vitest';
import { TaskCancelledError, UNCONTROLLED, type TaskControl } from '../../core/task/task-control.ts';
import { ArchiveEditor } from '../../renderer/archive/archiveEditor.ts';
import { uweClass } from '../../renderer/archive/uweClasses.ts';
import { loadDemoIfFirstStart } from '../../renderer/demo/demoArchive.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { endNightQualitySession, NIGHT_QUALITY_CHUNK, nightQualityCache, runNightQuality } from '../../renderer/worker/tasks/nightQuality.ts';
import { DerivedResultsDatabase } from '../../renderer/store/derivedResults.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';
import { putTransitRows } from '../store/transitRows.ts';
import { transitsOfNight, transitsOfNights } from '../../renderer/store/transitGroups.ts';

interface Truth { blunders: { transitId: string; kind: string }[] }
const BLUNDER_NIGHT = 'night-2020-03-17'; // demo-truth.json: a star swapped (ML-011 written as ML-012)

async function demoSubset(keepFirst: number): Promise<{ name: string; database: ArchiveDatabase; kept: string[]; truth: Truth }> {
  const name = uniqueDatabaseName('night-quality');
  const database = new ArchiveDatabase(name);
  await loadDemoIfFirstStart(database, async () => new Uint8Array(await readFile('assets/demo/demo-archive.mlbundle')), '2026-12-01T00:00:00.000Z');
  const truth = JSON.parse(await readFile('assets/demo/demo-truth.json', 'utf8')) as Truth;
  const nights = await database.nights.orderBy('localDate').toArray();
  const kept = [...new Set([...nights.slice(0, keepFirst).map((n) => n.id), BLUNDER_NIGHT])];
  // Keep the few nights by clearing and writing them back: deleting thousands of indexed rows one
  // by one takes minutes in fake-indexeddb.
  const keptNights = nights.filter((n) => kept.includes(n.id));
  const keptTransits = await transitsOfNights(database, kept);
  await database.nights.clear();
  await database.transitGroups.clear();
  await database.nights.bulkAdd(keptNights);
  await putTransitRows(database, keptTransits);
  return { name, database, kept, truth };
}

describe('runNightQuality({ databaseName })', () => {
  let subset: Awaited<ReturnType<typeof demoSubset>>;
  beforeAll(async () => { subset = await demoSubset(16); }, 60_000);

  test('reduces every night once, then takes them all from the cache', async () => {
    expect(subset.truth.blunders.some((b) => b.transitId.startsWith(`${BLUNDER_NIGHT}/`))).toBe(true);
    const first = await runNightQuality({ kind: 'night-quality', databaseName: subset.name }, UNCONTROLLED);
    expect(first.nights.map((q) => q.nightId).sort()).toEqual([...subset.kept].sort());
    expect(first).toMatchObject({ reduced: subset.kept.length, reused: 0 });
    expect(first.nights.every((q) => q.reduced && q.unitWeightError !== null && q.transitsUsed >= 3)).toBe(true);
    const second = await runNightQuality({ kind: 'night-quality', databaseName: subset.name }, UNCONTROLLED);
    expect(second).toMatchObject({ reduced: 0, reused: subset.kept.length });
    expect(second.nights).toEqual(first.nights);
  });

  test('the planted blunder night is in a worse class than most clean nights', async () => {
    const { nights } = await runNightQuality({ kind: 'night-quality', databaseName: subset.name }, UNCONTROLLED);
    const blunderNights = new Set(subset.truth.blunders.map((b) => b.transitId.split('/')[0]));
    const clean = nights.filter((q) => !blunderNights.has(q.nightId)).map((q) => uweClass(q.unitWeightError) as number).sort((a, b) => a - b);
    const median = clean[Math.floor(clean.length / 2)];
    const blunder = nights.find((q) => q.nightId === BLUNDER_NIGHT);
    expect(blunder?.transitsRejected).toBeGreaterThan(0);
    expect(uweClass(blunder?.unitWeightError ?? null)).toBeGreaterThan(median);
  });

  test('rejecting a transit reduces only its night again; restoring it too, and the counts follow', async () => {
    const editor = new ArchiveEditor(subset.database, () => 'Test Editor');
    const night = subset.kept[3];
    const transit = (await transitsOfNight(subset.database, night))[0];
    await editor.setTransitRejected(transit, true, 'a transit');
    const afterReject = await runNightQuality({ kind: 'night-quality', databaseName: subset.name }, UNCONTROLLED);
    expect(afterReject).toMatchObject({ reduced: 1, reused: subset.kept.length - 1 });
    expect(afterReject.nights.find((q) => q.nightId === night)?.transitsUserRejected).toBe(1);
    await editor.setTransitRejected(transit, false, 'a transit');
    const afterRestore = await runNightQuality({ kind: 'night-quality', databaseName: subset.name }, UNCONTROLLED);
    expect(afterRestore.reduced).toBe(1);
    expect(afterRestore.nights.find((q) => q.nightId === night)?.transitsUserRejected).toBe(0);
  });

  test('a cancel stops between chunks with the nights done kept in the cache', async () => {
    const fresh = await demoSubset(NIGHT_QUALITY_CHUNK + 2);
    let progressCalls = 0;
    const control: TaskControl = {
      cancellation: { get isCancelled() { return progressCalls >= 2; } },
      reportProgress: () => { progressCalls++; },
      yieldToHost: () => Promise.resolve(),
    };
    const cancelled = await runNightQuality({ kind: 'night-quality', databaseName: fresh.name }, control).catch((error: unknown) => error);
    expect(cancelled).toBeInstanceOf(TaskCancelledError);
    expect((cancelled as TaskCancelledError).done).toBe(NIGHT_QUALITY_CHUNK);
    expect(nightQualityCache(fresh.name).size).toBe(NIGHT_QUALITY_CHUNK);
    const rest = await runNightQuality({ kind: 'night-quality', databaseName: fresh.name }, UNCONTROLLED);
    expect(rest).toMatchObject({ reused: NIGHT_QUALITY_CHUNK, reduced: fresh.kept.length - NIGHT_QUALITY_CHUNK });
  });

  test('an imported Earth-orientation day changes every night\'s key: all are reduced again, with the archive\'s tables', async () => {
    const fresh = await demoSubset(4);
    const first = await runNightQuality({ kind: 'night-quality', databaseName: fresh.name }, UNCONTROLLED);
    expect(first.reduced).toBe(fresh.kept.length);
    const firstNight = (await fresh.database.nights.orderBy('localDate').first())!;
    const mjd = Math.round(Date.parse(`${firstNight.localDate}T00:00:00Z`) / 86_400_000 + 40_587); // MJD = Unix days + 40587 (common practice)
    // An invented value, 0.5 s off the bundled C04 day the demo was simulated with: that night's clock-like error grows.
    await fresh.database.earthOrientation.bulkPut([mjd, mjd + 1].map((day) => ({ mjd: day, dut1S: 0.5, xpArcsec: 0, ypArcsec: 0, kind: 'final' as const, source: 'invented test table' })));
    const again = await runNightQuality({ kind: 'night-quality', databaseName: fresh.name }, UNCONTROLLED);
    expect(again).toMatchObject({ reused: 0, reduced: fresh.kept.length });
    const before = first.nights.find((q) => q.nightId === firstNight.id)!, after = again.nights.find((q) => q.nightId === firstNight.id)!;
    expect(after.unitWeightErrorTime!).toBeGreaterThan(before.unitWeightErrorTime!);
  });

  test('a new launch takes the qualities kept by the last one (nothing reduced again), and a night edited since is reduced again', async () => {
    const fresh = await demoSubset(6);
    const first = await runNightQuality({ kind: 'night-quality', databaseName: fresh.name }, UNCONTROLLED);
    expect(first.reduced).toBe(fresh.kept.length);
    endNightQualitySession(fresh.name); // as closing the window ends the worker
    const relaunched = await runNightQuality({ kind: 'night-quality', databaseName: fresh.name }, UNCONTROLLED);
    expect(relaunched).toMatchObject({ reduced: 0, reused: fresh.kept.length });
    expect(relaunched.nights).toEqual(first.nights);
    // A night whose record changed while the app was closed (e.g. another build wrote it) gets a new key: only it is reduced again.
    const night = (await fresh.database.nights.get(fresh.kept[0]))!;
    await fresh.database.nights.put({ ...night, note: `${night.note} (edited)`, updatedUtc: '2026-12-02T08:00:00.000Z' });
    endNightQualitySession(fresh.name);
    const afterEdit = await runNightQuality({ kind: 'night-quality', databaseName: fresh.name }, UNCONTROLLED);
    expect(afterEdit).toMatchObject({ reduced: 1, reused: fresh.kept.length - 1 });
    // Kept beside the archive, never in it: the archive has no such table, and the kept entries name this build.
    expect(fresh.database.tables.map((t) => t.name)).not.toContain('nightQualities');
    const kept = new DerivedResultsDatabase(fresh.name);
    expect((await kept.nightQualities.toArray()).every((row) => row.buildId === 'unit-tests')).toBe(true);
    expect(await kept.nightQualities.count()).toBe(fresh.kept.length);
    kept.close();
  });
});
