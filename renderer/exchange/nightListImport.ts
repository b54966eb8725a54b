import type { ClockComparison, CollimationReading, LevelReading, NightRecord } from '../../core/archive/records.ts';
import { dateText } from '../../core/archive-folder/folder-text.ts';
import type { ParseResult, Rejection } from '../../core/formats/parse-result.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { countRejectedRows, countsOf, type ImportFileKind, type ImportPlan } from './importReport.ts';

/** The lists a night record keeps in time order, and what one entry of each holds. */
export type NightListEntry =
  | { readonly list: 'clockComparisons'; readonly value: ClockComparison }
  | { readonly list: 'levelReadings'; readonly value: LevelReading }
  | { readonly list: 'collimationReadings'; readonly value: CollimationReading };

/** A parsed row of a night-list file: its night (date, instrument or null for every one) and its entries. */
export interface NightListRow {
  readonly row: number;
  readonly line: number;
  readonly nightDateMjd: number;
  readonly instrumentId: string | null;
  readonly entries: readonly NightListEntry[];
}

/** The same reading twice: instants within 1 µs and every number within 1e-6 (the files keep 10 µs and 0.001″). */
function sameEntry(a: NightListEntry, b: NightListEntry): boolean {
  if (a.list !== b.list || Math.abs(a.value.utcMjd - b.value.utcMjd) > 1e-6 / 86_400) return false;
  const numbers = (e: NightListEntry) => Object.values(e.value).filter((v): v is number => typeof v === 'number');
  const x = numbers(a), y = numbers(b);
  return x.length === y.length && x.every((v, k) => Math.abs(v - y[k]) <= 1e-6);
}

const entriesOf = (night: NightRecord): NightListEntry[] => [
  ...night.clockComparisons.map((value) => ({ list: 'clockComparisons' as const, value })),
  ...night.levelReadings.map((value) => ({ list: 'levelReadings' as const, value })),
  ...night.collimationReadings.map((value) => ({ list: 'collimationReadings' as const, value })),
];

/** The visible nights of `localDate`: of one instrument, or of every instrument when `instrumentId` is null. */
async function nightsOf(database: ArchiveDatabase, localDate: string, instrumentId: string | null): Promise<NightRecord[]> {
  const visible = (n: NightRecord) => n.visibility === 'visible';
  if (instrumentId !== null) return database.nights.where('[instrumentId+localDate]').equals([instrumentId, localDate]).filter(visible).toArray();
  return database.nights.where('localDate').equals(localDate).filter(visible).toArray();
}

/**
 * Plans the import of readings that belong to archived nights (clock comparisons, level and
 * collimation readings): each row joins the night of its date and instrument (every instrument's
 * night of that date when the row names none; a night record is updated, its lists kept in time
 * order). A row with no archived night is rejected with that reason — its transit log must come
 * first, so no night is made up here; a row whose readings the night already holds is reported as
 * a duplicate and not written again.
 */
export async function planNightListImport(database: ArchiveDatabase, kind: ImportFileKind, fileName: string, nowUtc: string, parsed: ParseResult<NightListRow>): Promise<ImportPlan> {
  const rejected: Rejection[] = [...parsed.rejected];
  const planned = new Map<string, { night: NightRecord; added: NightListEntry[] }>();
  // A file holds several readings a night: each night (date, instrument) is looked up once.
  const nightsByKey = new Map<string, NightRecord[]>();
  let duplicateCount = 0;
  for (const row of parsed.rows) {
    const localDate = dateText(row.nightDateMjd);
    const lookup = `${localDate}\u0000${row.instrumentId ?? ''}`;
    let nights = nightsByKey.get(lookup);
    if (nights === undefined) nightsByKey.set(lookup, (nights = await nightsOf(database, localDate, row.instrumentId)));
    const where = row.instrumentId === null ? 'of any instrument' : `of instrument ${row.instrumentId}`;
    if (nights.length === 0) {
      rejected.push({ row: row.row, line: row.line, column: 'nightDate', reason: `the archive has no night ${localDate} ${where}; import that night's transit log first` });
      continue;
    }
    let joined = 0;
    for (const night of nights) {
      const entry = planned.get(night.id) ?? { night, added: [] };
      planned.set(night.id, entry);
      for (const item of row.entries) {
        if ([...entriesOf(entry.night), ...entry.added].some((held) => sameEntry(held, item))) continue;
        entry.added.push(item);
        joined += 1;
      }
    }
    if (joined === 0) {
      duplicateCount += 1;
      rejected.push({ row: row.row, line: row.line, column: 'utc', reason: `already archived: the night ${localDate} ${where} holds this reading` });
    }
  }
  const updated = [...planned.values()].filter((e) => e.added.length > 0).map(({ night, added }) => withEntries(night, added, nowUtc));
  const rejectedRowCount = countRejectedRows(rejected);
  return {
    report: {
      fileName, kind, totalRows: parsed.totalRows, validRows: parsed.totalRows - rejectedRowCount, rejectedRowCount,
      rejected, duplicateCount, warnings: parsed.warnings, missingPrerequisites: [],
      createdCounts: {}, updatedCounts: countsOf({ nights: updated }),
    },
    writes: { created: {}, updated: { nights: updated } },
  };
}

function withEntries(night: NightRecord, added: readonly NightListEntry[], nowUtc: string): NightRecord {
  const merged = <T extends { utcMjd: number }>(held: readonly T[], list: NightListEntry['list']): T[] =>
    [...held, ...added.filter((e) => e.list === list).map((e) => e.value as unknown as T)].sort((a, b) => a.utcMjd - b.utcMjd);
  return {
    ...night, updatedUtc: nowUtc,
    clockComparisons: merged(night.clockComparisons, 'clockComparisons'),
    levelReadings: merged(night.levelReadings, 'levelReadings'),
    collimationReadings: merged(night.collimationReadings, 'collimationReadings'),
  };
}
