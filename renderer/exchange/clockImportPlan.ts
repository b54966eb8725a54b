import type { ClockComparison, NightRecord } from '../../core/archive/records.ts';
import { dateText } from '../../core/archive-folder/folder-text.ts';
import { clockComparisonOfRow } from '../../core/archive-folder/night-files.ts';
import { parseClockComparisons } from '../../core/formats/clock-comparisons.ts';
import type { Rejection } from '../../core/formats/parse-result.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { countRejectedRows, countsOf, type ImportPlan } from './importReport.ts';

/** Two comparisons are the same reading when their signal instants agree to 1 µs and their clock − UTC to 1 µs (the file keeps 10 µs). */
const SAME_INSTANT_DAYS = 1e-6 / 86_400;
const SAME_OFFSET_S = 1e-6;

function sameComparison(a: ClockComparison, b: ClockComparison): boolean {
  return Math.abs(a.utcMjd - b.utcMjd) <= SAME_INSTANT_DAYS && Math.abs(a.clockMinusUtcS - b.clockMinusUtcS) <= SAME_OFFSET_S;
}

/**
 * Validates a clock-comparisons CSV (core/reduction/NIGHT.md) and plans its writes: each comparison
 * joins the archived night of its instrument and date (the night record is updated, its list kept
 * in time order); a row without `instrumentId` is the clock of every instrument, as the format
 * says, and joins each archived night of that date. A row with no archived night is rejected
 * with that reason — its transit log must come first, so no night is made up here. A comparison
 * a night already holds is reported as a duplicate and not written again.
 */
export async function planClockImport(database: ArchiveDatabase, bytes: Uint8Array, fileName: string, nowUtc: string): Promise<ImportPlan> {
  const parsed = parseClockComparisons(bytes, fileName);
  const rejected: Rejection[] = [...parsed.rejected];
  const planned = new Map<string, { night: NightRecord; added: ClockComparison[] }>();
  let duplicateCount = 0;
  for (const row of parsed.rows) {
    const localDate = dateText(row.nightDateMjd);
    const nights = await nightsOf(database, localDate, row.instrumentId);
    const where = row.instrumentId === null ? 'of any instrument' : `of instrument ${row.instrumentId}`;
    if (nights.length === 0) {
      rejected.push({ row: row.row, line: row.line, column: 'nightDate', reason: `the archive has no night ${localDate} ${where}; import that night's transit log first` });
      continue;
    }
    const comparison = clockComparisonOfRow(row);
    let joined = 0;
    for (const night of nights) {
      const entry = planned.get(night.id) ?? { night, added: [] };
      planned.set(night.id, entry);
      if ([...entry.night.clockComparisons, ...entry.added].some((c) => sameComparison(c, comparison))) continue;
      entry.added.push(comparison);
      joined += 1;
    }
    if (joined === 0) {
      duplicateCount += 1;
      rejected.push({ row: row.row, line: row.line, column: 'utc', reason: `already archived: the night ${localDate} ${where} holds this comparison` });
    }
  }
  const updated = [...planned.values()].filter((e) => e.added.length > 0).map(({ night, added }): NightRecord => ({
    ...night, clockComparisons: [...night.clockComparisons, ...added].sort((a, b) => a.utcMjd - b.utcMjd), updatedUtc: nowUtc,
  }));
  const rejectedRowCount = countRejectedRows(rejected);
  return {
    report: {
      fileName, kind: 'clock-comparisons', totalRows: parsed.totalRows, validRows: parsed.totalRows - rejectedRowCount, rejectedRowCount,
      rejected, duplicateCount, warnings: parsed.warnings, missingPrerequisites: [],
      createdCounts: {}, updatedCounts: countsOf({ nights: updated }),
    },
    writes: { created: {}, updated: { nights: updated } },
  };
}

/** The visible nights of `localDate`: of one instrument, or of every instrument when `instrumentId` is null. */
async function nightsOf(database: ArchiveDatabase, localDate: string, instrumentId: string | null): Promise<NightRecord[]> {
  const visible = (n: NightRecord) => n.visibility === 'visible';
  if (instrumentId !== null) return database.nights.where('[instrumentId+localDate]').equals([instrumentId, localDate]).filter(visible).toArray();
  return database.nights.where('localDate').equals(localDate).filter(visible).toArray();
}
