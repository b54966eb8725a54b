// Stars imported through the Exchange view get random record ids (their catalogue id is kept in
// `catalogueId`); the nightly reductions behind the overview's colours must still read them. The
// shipped demo archive (invented, assets/demo) has readable ids, so this test gives its stars
// random ids as an import would, then checks every night still reduces to the same quality.
import { randomUUID } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { expect, test } from 'vitest';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { loadDemoIfFirstStart } from '../../renderer/demo/demoArchive.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { runNightQuality } from '../../renderer/worker/tasks/nightQuality.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';
import { putTransitRows } from '../store/transitRows.ts';
import { transitsOfNights } from '../../renderer/store/transitGroups.ts';

async function demoNights(count: number, randomIds: boolean): Promise<string> {
  const name = uniqueDatabaseName(randomIds ? 'quality-random-ids' : 'quality-demo-ids');
  const database = new ArchiveDatabase(name);
  await loadDemoIfFirstStart(database, async () => new Uint8Array(await readFile('assets/demo/demo-archive.mlbundle')), '2026-12-01T00:00:00.000Z');
  const nights = (await database.nights.orderBy('localDate').toArray()).slice(0, count);
  const transits = await transitsOfNights(database, nights.map((n) => n.id));
  const stars = await database.stars.toArray();
  const newId = new Map(stars.map((s) => [s.id, randomIds ? randomUUID() : s.id]));
  await database.transaction('rw', database.nights, database.transitGroups, database.stars, async () => {
    await Promise.all([database.nights.clear(), database.transitGroups.clear(), database.stars.clear()]);
    await database.nights.bulkAdd(nights);
    await database.stars.bulkAdd(stars.map((s) => ({ ...s, id: newId.get(s.id) ?? s.id })));
    await putTransitRows(database, transits.map((t) => ({ ...t, starId: newId.get(t.starId) ?? t.starId })));
  });
  database.close();
  return name;
}

test('nights whose stars carry random record ids (as imported) reduce exactly as with readable ids', async () => {
  const [plain, imported] = [await demoNights(8, false), await demoNights(8, true)];
  const a = await runNightQuality({ kind: 'night-quality', databaseName: plain }, UNCONTROLLED);
  const b = await runNightQuality({ kind: 'night-quality', databaseName: imported }, UNCONTROLLED);
  expect(b.nights.filter((q) => !q.reduced).map((q) => q.failure)).toEqual([]);
  expect(b.nights.map((q) => [q.nightId, q.unitWeightError])).toEqual(a.nights.map((q) => [q.nightId, q.unitWeightError]));
}, 120_000);
