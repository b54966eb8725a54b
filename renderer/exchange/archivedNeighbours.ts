import { Dexie } from 'dexie';
import type { NightRecord, TransitRecord } from '../../core/archive/records.ts';
import type { TransitLogRow } from '../../core/formats/transit-log.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { transitsOfStar } from '../store/transitGroups.ts';

/** Same star, culmination and instrument within this many days is the same transit (FORMATS.md). */
export const DUPLICATE_WINDOW_DAYS = 0.5;

/** Seconds per day, for clock seconds and seconds of a UTC day → fractions of an MJD. */
const SECONDS_PER_DAY = 86_400;

/**
 * Margin added to each star's loaded time range, days: a mean of wire times can round a few units
 * in the last place outside the range of its wires; loading a little more is harmless because
 * every comparison below uses the exact window.
 */
const RANGE_MARGIN_DAYS = 1e-6;

/**
 * The archived rows a transit log is checked against, loaded once before the rows are planned
 * (one query per star and per instrument instead of two per row, which cost about 1.7 ms a row):
 * the visible transits of each star of the file within half a day of the file's times, in
 * `[starId+utcMjd]` index order, and the visible nights of each instrument of the file.
 */
export class ArchivedNeighbours {
  static readonly EMPTY = new ArchivedNeighbours(new Map(), new Map());

  constructor(
    /** Archive star id → its visible transits, ascending utcMjd (ties in primary-key order, as the index returns them). */
    private readonly transitsByStar: ReadonlyMap<string, readonly TransitRecord[]>,
    /** `${instrumentId}\u0000${localDate}` → the first visible night in index order. */
    private readonly nightsByKey: ReadonlyMap<string, NightRecord>,
  ) {}

  /**
   * The archived transit that `record` repeats: the first, in index order, of the same star with
   * utcMjd within ±DUPLICATE_WINDOW_DAYS (inclusive) and the same culmination and instrument.
   */
  duplicateOf(record: TransitRecord): TransitRecord | undefined {
    const list = this.transitsByStar.get(record.starId);
    if (list === undefined) return undefined;
    const low = record.utcMjd - DUPLICATE_WINDOW_DAYS;
    const high = record.utcMjd + DUPLICATE_WINDOW_DAYS;
    for (let k = firstAtOrAbove(list, low); k < list.length && list[k].utcMjd <= high; k++) {
      const t = list[k];
      if (t.culmination === record.culmination && t.instrumentId === record.instrumentId) return t;
    }
    return undefined;
  }

  /** The visible archived night of an instrument on a local date, if any. */
  nightOf(instrumentId: string, localDate: string): NightRecord | undefined {
    return this.nightsByKey.get(`${instrumentId}\u0000${localDate}`);
  }
}

/** Index of the first transit with utcMjd ≥ low (binary search on the ascending list). */
function firstAtOrAbove(list: readonly TransitRecord[], low: number): number {
  let lo = 0;
  let hi = list.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (list[mid].utcMjd < low) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Earliest and latest wire time of each star of the file, MJD (clock times from 0 h of the night date). */
function wireRangeByStar(rows: readonly TransitLogRow[]): Map<string, { low: number; high: number }> {
  const ranges = new Map<string, { low: number; high: number }>();
  for (const row of rows) {
    const times = row.times;
    for (const wire of times.wires) {
      const mjd = 'utc' in wire ? wire.utc.mjd + wire.utc.secondsOfDay / SECONDS_PER_DAY : (row.nightDateMjd ?? Number.NaN) + wire.clockS / SECONDS_PER_DAY;
      if (!Number.isFinite(mjd)) continue;
      const range = ranges.get(row.starId);
      if (range === undefined) ranges.set(row.starId, { low: mjd, high: mjd });
      else {
        range.low = Math.min(range.low, mjd);
        range.high = Math.max(range.high, mjd);
      }
    }
  }
  return ranges;
}

/**
 * Loads what the planning of `rows` needs from the archive, in one read-only transaction: the
 * file's stars (by catalogue id, through `starIdByCatalogueId`) and instruments (the rows' own or
 * `defaultInstrumentId`).
 */
export async function loadArchivedNeighbours(
  database: ArchiveDatabase, rows: readonly TransitLogRow[], lookups: { readonly starIdByCatalogueId: ReadonlyMap<string, string> }, defaultInstrumentId: string | null,
): Promise<ArchivedNeighbours> {
  const ranges = [...wireRangeByStar(rows)].flatMap(([catalogueId, range]) => {
    const starId = lookups.starIdByCatalogueId.get(catalogueId);
    return starId === undefined ? [] : [{ starId, range }];
  });
  const instrumentIds = [...new Set(rows.map((r) => r.instrumentId ?? defaultInstrumentId).filter((id): id is string => id !== null))];
  const margin = DUPLICATE_WINDOW_DAYS + RANGE_MARGIN_DAYS;
  return database.transaction('r', [database.transitGroups, database.nights], async () => {
    const [transitLists, nightLists] = await Promise.all([
      Promise.all(ranges.map(({ starId, range }) => transitsOfStar(database, starId, range.low - margin, range.high + margin))),
      Promise.all(instrumentIds.map((id) => database.nights.where('[instrumentId+localDate]').between([id, Dexie.minKey], [id, Dexie.maxKey], true, true).toArray())),
    ]);
    const transitsByStar = new Map<string, TransitRecord[]>();
    ranges.forEach(({ starId }, k) => transitsByStar.set(starId, transitLists[k].filter((t) => t.visibility === 'visible')));
    const nightsByKey = new Map<string, NightRecord>();
    for (const night of nightLists.flat()) {
      const key = `${night.instrumentId}\u0000${night.localDate}`;
      if (night.visibility === 'visible' && !nightsByKey.has(key)) nightsByKey.set(key, night);
    }
    return new ArchivedNeighbours(transitsByStar, nightsByKey);
  });
}
