import type { InstrumentRecord, NightRecord, SiteRecord, TransitRecord } from '../../core/archive/records.ts';
import type { Rejection } from '../../core/formats/parse-result.ts';
import type { TransitLogRow } from '../../core/formats/transit-log.ts';
import { parseTransitLogOnce } from './parsedLogCache.ts';
import { mjdToCalendarDay } from '../../core/time/julian-date.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { applyColumnMapping, type ColumnMapping } from './columnMapping.ts';
import { countsOf, type ImportPlan } from './importReport.ts';
import { transitRecordFromRow, wireTimesMjd, zenithReadingsFor } from './transitRecordFromRow.ts';
import { ArchivedNeighbours, loadArchivedNeighbours } from './archivedNeighbours.ts';
import type { StageClock } from './stageClock.ts';
import { TimeOrderedIds } from '../store/timeOrderedId.ts';

export interface TransitImportOptions {
  /** Instrument for rows whose instrumentId cell is empty (or absent); null: such rows are rejected. */
  readonly defaultInstrumentId: string | null;
  readonly columnMapping: ColumnMapping;
}

function isoDate(mjd: number): string {
  const { year, month, day } = mjdToCalendarDay(mjd);
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/**
 * Local date on which the night of a UTC instant began: local mean time from the site's east
 * longitude, with the day changing at local noon (an observing night runs noon to noon; common
 * practice). Used only when a row gives no nightDate.
 */
function nightDateOf(utcMjd: number, site: SiteRecord | undefined): number {
  const localMjd = utcMjd + (site?.longitudeDeg ?? 0) / 360;
  return Math.floor(localMjd - 0.5);
}

interface Lookups {
  readonly starIdByCatalogueId: ReadonlyMap<string, string>;
  readonly instruments: ReadonlyMap<string, InstrumentRecord>;
  readonly sites: ReadonlyMap<string, SiteRecord>;
}

async function loadLookups(database: ArchiveDatabase): Promise<Lookups> {
  const visible = <T extends { visibility: string }>(rows: T[]) => rows.filter((r) => r.visibility === 'visible');
  const [stars, instruments, sites] = await Promise.all([database.stars.toArray(), database.instruments.toArray(), database.sites.toArray()]);
  return {
    starIdByCatalogueId: new Map(visible(stars).map((s) => [s.catalogueId, s.id])),
    instruments: new Map(visible(instruments).map((i) => [i.id, i])),
    sites: new Map(visible(sites).map((s) => [s.id, s])),
  };
}

/**
 * Validates a transit log (FORMATS.md) against the archive and plans its writes. Needs the star
 * list and the site description imported first (missingPrerequisites says which is absent, and no
 * row is then importable). Beyond the parser's checks, a row is rejected when its instrument is
 * unknown, its wires do not fit the instrument, its zenith unit is not the instrument's, or the
 * archive already holds the same transit (same star, culmination, instrument within half a
 * day): such duplicates are reported and skipped, never doubled. Nights are found by instrument
 * and local date, or created.
 */
export async function planTransitImport(
  database: ArchiveDatabase, bytes: Uint8Array, fileName: string, nowUtc: string, options: TransitImportOptions, clock?: StageClock,
): Promise<ImportPlan> {
  const lookups = await loadLookups(database);
  clock?.lap('load stars and instruments');
  const missingPrerequisites: string[] = [];
  if (lookups.starIdByCatalogueId.size === 0) missingPrerequisites.push('The archive holds no star list: import the star list (CSV) first, then this transit log.');
  if (lookups.instruments.size === 0) missingPrerequisites.push('The archive holds no site and instrument: import the site description (JSON) first, then this transit log.');
  const parsed = parseTransitLogOnce(applyColumnMapping(bytes, options.columnMapping), fileName, new Set(lookups.starIdByCatalogueId.keys()));
  clock?.lap('decode and parse');
  const rejected: Rejection[] = [...parsed.rejected];
  const transits: TransitRecord[] = [];
  const newNights = new Map<string, NightRecord>();
  let duplicateCount = 0;
  // Ascending ids in file order: IndexedDB writes them faster than random ones (timeOrderedId.ts).
  const ids = new TimeOrderedIds();
  const archived = missingPrerequisites.length === 0 ? await loadArchivedNeighbours(database, parsed.rows, lookups, options.defaultInstrumentId) : ArchivedNeighbours.EMPTY;
  clock?.lap('load archived transits and nights');
  if (missingPrerequisites.length > 0) {
    for (const row of parsed.rows) rejected.push({ row: row.row, line: row.line, column: '', reason: `not imported: ${missingPrerequisites[0]}` });
  }
  for (const row of missingPrerequisites.length === 0 ? parsed.rows : []) {
    const reject = (column: string, reason: string) => rejected.push({ row: row.row, line: row.line, column, reason });
    const instrumentId = row.instrumentId ?? options.defaultInstrumentId;
    const instrument = instrumentId === null ? undefined : lookups.instruments.get(instrumentId);
    if (instrument === undefined) {
      reject('instrumentId', instrumentId === null ? 'no instrumentId in the row and no instrument chosen for the file; choose one or fill the column' : `unknown instrument '${instrumentId}'; import its site description first or correct the id`);
      continue;
    }
    const planned = planRow(row, instrument, lookups, archived, newNights, nowUtc, ids);
    if ('reason' in planned) {
      reject(planned.column, planned.reason);
      continue;
    }
    const duplicate = archived.duplicateOf(planned);
    if (duplicate !== undefined) {
      duplicateCount++;
      reject('starId', `already in the archive (transit ${duplicate.id} at UTC MJD ${duplicate.utcMjd.toFixed(5)}: same star, culmination and instrument within half a day); skipped`);
      continue;
    }
    transits.push(planned);
  }
  const usedNightIds = new Set(transits.map((t) => t.nightId));
  const created = { nights: [...newNights.values()].filter((n) => usedNightIds.has(n.id)), transits };
  const validRows = transits.length;
  clock?.lap('plan rows');
  return {
    report: {
      fileName, kind: 'transit-log', totalRows: parsed.totalRows, validRows, rejectedRowCount: parsed.totalRows - validRows,
      rejected: rejected.sort((a, b) => a.row - b.row), duplicateCount, warnings: parsed.warnings, missingPrerequisites,
      createdCounts: countsOf(created), updatedCounts: {},
    },
    writes: { created, updated: {} },
  };
}

function planRow(
  row: TransitLogRow, instrument: InstrumentRecord, lookups: Lookups, archived: ArchivedNeighbours, newNights: Map<string, NightRecord>, nowUtc: string, ids: TimeOrderedIds,
): TransitRecord | { column: string; reason: string } {
  const site = lookups.sites.get(instrument.siteId);
  const firstUtcMjd = row.times.kind === 'utc' ? row.times.wires[0].utc.mjd + row.times.wires[0].utc.secondsOfDay / 86_400 : null;
  const nightDateMjd = row.nightDateMjd ?? (firstUtcMjd === null ? null : nightDateOf(firstUtcMjd, site));
  const times = wireTimesMjd(row, nightDateMjd, instrument.wireIntervalsEquatorialS.length);
  if ('reason' in times) return times;
  const readings = zenithReadingsFor(row, instrument);
  if ('reason' in readings) return readings;
  const localDate = isoDate(nightDateMjd as number);
  const key = `${instrument.id}\u0000${localDate}`;
  let night: NightRecord | undefined = newNights.get(key);
  night ??= archived.nightOf(instrument.id, localDate);
  if (night === undefined) {
    night = {
      id: ids.next(), siteId: instrument.siteId, instrumentId: instrument.id, localDate, observer: row.observer ?? '',
      weather: null, clockComparisons: [], levelReadings: [], collimationReadings: [], quality: 'fair', note: '',
      visibility: 'visible', createdUtc: nowUtc, updatedUtc: nowUtc,
    };
    newNights.set(key, night);
  }
  const starId = lookups.starIdByCatalogueId.get(row.starId) as string; // the parser rejected unknown ids
  return transitRecordFromRow(row, { id: ids.next(), nightId: night.id, starId, instrumentId: instrument.id }, times, readings, nowUtc);
}
