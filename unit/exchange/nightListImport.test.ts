// Importing clock comparisons and level/collimation readings in the Exchange view (core/reduction/NIGHT.md's CSVs): each reading
// joins its archived night (a row without an instrument is every instrument's clock); rows whose
// night is not archived are refused by row and column; a second import of the same file doubles
// nothing. Invented scenario (exchangeFixtures.ts): only structure and arithmetic matter.
import { describe, expect, test } from 'vitest';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { guessImportKind, planImport, type ImportFileRequest } from '../../renderer/exchange/importPlan.ts';
import { beginImport, writeImport } from '../../renderer/exchange/stagedWriter.ts';
import type { ImportFileKind } from '../../renderer/exchange/importReport.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';
import { NOW, SITE_JSON, STAR_LIST_CSV, transitLine, transitLog } from './exchangeFixtures.ts';

const CLOCK_HEADER = 'nightDate,instrumentId,utc,clockS,signal';

function request(kind: ImportFileKind, bytes: Uint8Array, fileName: string, defaultInstrumentId: string | null = null): ImportFileRequest {
  return { kind, bytes, fileName, defaultInstrumentId, columnMapping: {} };
}

async function importWhole(database: ArchiveDatabase, req: ImportFileRequest) {
  const plan = await planImport(database, req, NOW);
  const id = await beginImport(database, req.fileName, req.kind, NOW);
  await writeImport(database, id, plan.writes, UNCONTROLLED, () => NOW);
  return plan.report;
}

/** Site, stars and one transit night (2026-03-01 of qt-2). */
async function archiveWithOneNight(): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(uniqueDatabaseName('clock-import'));
  await importWhole(database, request('site-description', encodeUtf8(SITE_JSON), 'site.json'));
  await importWhole(database, request('star-list', encodeUtf8(STAR_LIST_CSV), 'stars.csv'));
  await importWhole(database, request('transit-log', transitLog([transitLine('QX-1', 0)]), 'log.csv', 'qt-2'));
  return database;
}

describe('clock comparisons through the Exchange import', () => {
  test('guessImportKind(name, header) tells a clock-comparisons CSV from a transit log', () => {
    expect(guessImportKind('clock.csv', CLOCK_HEADER.split(','))).toBe('clock-comparisons');
    expect(guessImportKind('log.csv', ['starId', 'nightDate', 'utc', 'clockS'])).toBe('transit-log');
  });

  test('joins each comparison to its night (clock − UTC from the clock reading), refuses rows without a night, and doubles nothing when imported again', async () => {
    const database = await archiveWithOneNight();
    // 21:00:00 UTC on 2026-03-01 with the clock reading 75600.25 s from 0 h of that date: clock − UTC = +0.25 s.
    const file = encodeUtf8([CLOCK_HEADER,
      '2026-03-01,qt-2,2026-03-01T21:00:00Z,75600.25,GNSS PPS',
      '2026-03-01,,2026-03-01T23:00:00Z,82800.2512,GNSS PPS',
      '2026-03-02,qt-2,2026-03-02T21:00:00Z,75600.3,GNSS PPS',
      '2026-03-01,qt-9,2026-03-01T22:00:00Z,79200.3,GNSS PPS',
    ].join('\n'));
    const report = await importWhole(database, request('clock-comparisons', file, 'clock.csv'));
    expect(report).toMatchObject({ totalRows: 4, validRows: 2, rejectedRowCount: 2, duplicateCount: 0, updatedCounts: { nights: 1 } });
    expect(report.validRows + report.rejectedRowCount).toBe(report.totalRows);
    expect(report.rejected.map((r) => [r.row, r.column])).toEqual([[3, 'nightDate'], [4, 'nightDate']]);
    expect(report.rejected[0].reason).toMatch(/no night 2026-03-02 of instrument qt-2; import that night's transit log first/);
    const night = (await database.nights.toArray())[0];
    expect(night.clockComparisons.map((c) => c.clockMinusUtcS)).toEqual([0.25, expect.closeTo(0.2512, 9)]);
    expect(night.clockComparisons[0].utcMjd).toBeCloseTo(61100 + 21 / 24, 9); // MJD 61100 = 2026-03-01 (common practice: MJD = JD − 2400000.5)
    expect(night.clockComparisons[0].signal).toBe('GNSS PPS');
    const again = await importWhole(database, request('clock-comparisons', file, 'clock.csv'));
    expect(again).toMatchObject({ validRows: 0, duplicateCount: 2, updatedCounts: {} });
    expect((await database.nights.toArray())[0].clockComparisons).toHaveLength(2);
    database.close();
  });

  test('a row without instrumentId is every instrument\'s clock: it joins each archived night of its date', async () => {
    const database = await archiveWithOneNight();
    const second = { ...(await database.nights.toArray())[0], id: 'night-other', instrumentId: 'qt-3', clockComparisons: [] };
    await database.nights.add(second);
    const file = encodeUtf8([CLOCK_HEADER, '2026-03-01,,2026-03-01T21:00:00Z,75600.25,'].join('\n'));
    const report = await importWhole(database, request('clock-comparisons', file, 'clock.csv'));
    expect(report).toMatchObject({ validRows: 1, rejectedRowCount: 0, updatedCounts: { nights: 2 } });
    for (const night of await database.nights.toArray()) expect(night.clockComparisons.map((c) => c.clockMinusUtcS)).toEqual([0.25]);
    database.close();
  });

  test('level and collimation readings join their nights the same way, kept in time order, and are not doubled', async () => {
    const database = await archiveWithOneNight();
    const file = encodeUtf8(['nightDate,instrumentId,utc,levelArcsec,collimationArcsec',
      '2026-03-01,qt-2,2026-03-01T23:00:00Z,1.2,',
      '2026-03-01,qt-2,2026-03-01T20:00:00Z,0.8,0.35',
      '2026-03-05,qt-2,2026-03-05T20:00:00Z,0.8,',
    ].join('\n'));
    expect(guessImportKind('readings.csv', ['nightDate', 'instrumentId', 'utc', 'levelArcsec', 'collimationArcsec'])).toBe('night-readings');
    const report = await importWhole(database, request('night-readings', file, 'readings.csv'));
    expect(report).toMatchObject({ totalRows: 3, validRows: 2, rejectedRowCount: 1, updatedCounts: { nights: 1 } });
    const night = (await database.nights.toArray())[0];
    // Kept in time order whatever the file's order.
    expect(night.levelReadings.map((r) => r.levelArcsec)).toEqual([0.8, 1.2]);
    expect(night.collimationReadings).toEqual([{ utcMjd: expect.closeTo(61100 + 20 / 24, 9), collimationArcsec: 0.35 }]);
    const again = await importWhole(database, request('night-readings', file, 'readings.csv'));
    expect(again).toMatchObject({ validRows: 0, duplicateCount: 2 });
    expect((await database.nights.toArray())[0].levelReadings).toHaveLength(2);
    database.close();
  });
});
