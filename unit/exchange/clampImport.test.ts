// The clamp position of a transit log row reaches the archive record (it used to be kept only as a
// tag in the note), so the reductions see a reversed instrument's collimation with its sign.
// Invented scenario (exchangeFixtures.ts).
import { describe, expect, test } from 'vitest';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { planImport, type ImportFileRequest } from '../../renderer/exchange/importPlan.ts';
import { beginImport, writeImport } from '../../renderer/exchange/stagedWriter.ts';
import type { ImportFileKind } from '../../renderer/exchange/importReport.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';
import { NOW, SITE_JSON, STAR_LIST_CSV, transitLine, transitLog } from './exchangeFixtures.ts';
import { allTransits } from '../../renderer/store/transitGroups.ts';

async function importWhole(database: ArchiveDatabase, kind: ImportFileKind, bytes: Uint8Array, fileName: string) {
  const req: ImportFileRequest = { kind, bytes, fileName, defaultInstrumentId: 'qt-2', columnMapping: {} };
  const plan = await planImport(database, req, NOW);
  const id = await beginImport(database, fileName, kind, NOW);
  await writeImport(database, id, plan.writes, UNCONTROLLED, () => NOW);
  return plan.report;
}

describe('the clamp position through the transit-log import', () => {
  test('east and west rows keep their clamp in the record, an empty cell stores none, and the note carries no clamp tag', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('clamp-import'));
    await importWhole(database, 'site-description', encodeUtf8(SITE_JSON), 'site.json');
    await importWhole(database, 'star-list', encodeUtf8(STAR_LIST_CSV), 'stars.csv');
    const east = transitLine('QX-1', 0).replace(',upper,west,', ',upper,east,');
    const none = transitLine('QX-1', 1).replace(',upper,west,', ',upper,,');
    const report = await importWhole(database, 'transit-log', transitLog([transitLine('QX-2', 0), east, none]), 'log.csv');
    expect(report.rejectedRowCount).toBe(0);
    const transits = await allTransits(database);
    expect(transits.map((t) => t.clamp ?? 'none').sort()).toEqual(['east', 'none', 'west']);
    expect(transits.every((t) => !t.note.includes('clamp'))).toBe(true);
    const qx1 = (await database.stars.where('catalogueId').equals('QX-1').first())!;
    expect(transits.filter((t) => t.starId === qx1.id).map((t) => t.clamp ?? 'none').sort()).toEqual(['east', 'none']);
    database.close();
  });
});
