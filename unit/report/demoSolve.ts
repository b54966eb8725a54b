import { readFile } from 'node:fs/promises';
import type { ReductionRecord } from '../../core/archive/records.ts';
import { DEFAULT_JOINT_MODEL } from '../../core/joint/joint-model.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { loadDemoIfFirstStart } from '../../renderer/demo/demoArchive.ts';
import { WHOLE_ARCHIVE } from '../../renderer/solve/solveSelection.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { runJointSolve } from '../../renderer/worker/tasks/jointSolve.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';
import { putTransitRows } from '../store/transitRows.ts';
import { transitsOfNights } from '../../renderer/store/transitGroups.ts';

/**
 * A real saved solve, made the way the Solve view makes one: the shipped demo archive (invented,
 * assets/demo) cut to its first `nights` nights, solved by the worker's joint-solve task in Node
 * and saved as a ReductionRecord. Fails with the task's own message, never returns a partial record.
 */
export async function demoSolveRecord(nights: number): Promise<{ record: ReductionRecord; database: ArchiveDatabase }> {
  const name = uniqueDatabaseName('report');
  const database = new ArchiveDatabase(name);
  await loadDemoIfFirstStart(database, async () => new Uint8Array(await readFile('assets/demo/demo-archive.mlbundle')), '2026-12-01T00:00:00.000Z');
  const all = await database.nights.orderBy('localDate').toArray();
  // Keep the first nights by clearing and writing them back: deleting thousands of indexed rows
  // one by one takes minutes in fake-indexeddb.
  const kept = all.slice(0, nights);
  const keptTransits = await transitsOfNights(database, kept.map((n) => n.id));
  await database.nights.clear();
  await database.transitGroups.clear();
  await database.nights.bulkAdd(kept);
  await putTransitRows(database, keptTransits);
  const model = { ...DEFAULT_JOINT_MODEL, catalogueSigma: { default: { positionMas: 5, pmMasYr: 0.7 }, stars: {} } };
  const { reduction } = await runJointSolve({ kind: 'joint-solve', databaseName: name, label: 'Demo, first nights', model, selection: WHOLE_ARCHIVE, codeVersion: '0.1.0-test' }, UNCONTROLLED);
  return { record: reduction, database };
}
