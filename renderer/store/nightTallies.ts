import type { Transaction } from 'dexie';
import type { NightRecord, TransitRecord } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from './database.ts';
import { allTransits, transitsOfNight } from './transitGroups.ts';

/**
 * What the archive knows about one night without reading its transits (schema v3, derived).
 * Counts only `visible` transits (rows staged by an unfinished import from an older version are
 * not part of the archive yet). A night without a visible transit has no tally.
 */
export interface NightTallyRecord {
  readonly nightId: string;
  /** The night's instrument (NightRecord.instrumentId). */
  readonly instrumentId: string;
  /** The night's local date, `YYYY-MM-DD` (NightRecord.localDate). */
  readonly localDate: string;
  /** Visible transits of the night, user-rejected ones included. */
  readonly transitCount: number;
  /** Of those, how many the user rejected (TransitRecord.userRejected). */
  readonly rejectedCount: number;
  /** Earliest and latest TransitRecord.utcMjd of the visible transits, UTC MJD (good to seconds, as utcMjd). */
  readonly firstUtcMjd: number;
  readonly lastUtcMjd: number;
}

/** Tables only derived from others: never exported in a bundle, never restored from one. */
export const DERIVED_TABLES: readonly string[] = ['nightTallies'];

type TallyInput = Pick<TransitRecord, 'nightId' | 'utcMjd' | 'userRejected' | 'visibility'>;
type NightKey = Pick<NightRecord, 'id' | 'instrumentId' | 'localDate'>;

/**
 * Every tally of the archive, one per night holding a visible transit, ordered by instrument and
 * local date. Reads only `nightTallies` (a few thousand rows for a million transits).
 */
export async function readNightTallies(database: ArchiveDatabase): Promise<NightTallyRecord[]> {
  return database.nightTallies.orderBy('[instrumentId+localDate]').toArray();
}

/** Adds `transits` to `tallies` (nightId → tally); the night of each must be in `nights`. Pure. */
function addTo(tallies: Map<string, NightTallyRecord>, transits: Iterable<TallyInput>, nights: ReadonlyMap<string, NightKey>): void {
  for (const t of transits) {
    if (t.visibility !== 'visible') continue;
    const before = tallies.get(t.nightId);
    const night = nights.get(t.nightId);
    if (before === undefined && night === undefined) throw new Error(`nightTallies: transit of night "${t.nightId}", which the archive does not hold`);
    tallies.set(t.nightId, {
      nightId: t.nightId,
      instrumentId: before?.instrumentId ?? (night as NightKey).instrumentId,
      localDate: before?.localDate ?? (night as NightKey).localDate,
      transitCount: (before?.transitCount ?? 0) + 1,
      rejectedCount: (before?.rejectedCount ?? 0) + (t.userRejected ? 1 : 0),
      firstUtcMjd: Math.min(before?.firstUtcMjd ?? Infinity, t.utcMjd),
      lastUtcMjd: Math.max(before?.lastUtcMjd ?? -Infinity, t.utcMjd),
    });
  }
}

/** The tallies of `transits`, computed in memory (restore, upgrade, tests). Pure. */
export function talliesFromRows(nights: Iterable<NightKey>, transits: Iterable<TallyInput>): NightTallyRecord[] {
  const byId = new Map<string, NightKey>();
  for (const n of nights) byId.set(n.id, n);
  const tallies = new Map<string, NightTallyRecord>();
  addTo(tallies, transits, byId);
  return [...tallies.values()];
}

/**
 * Adds newly written transits to the stored tallies. Call inside the transaction that wrote them,
 * with `transitGroups`, `nights` and `nightTallies` in its scope; `newNights` are nights written in the
 * same transaction (looked up first, so no read is needed for them). Only for rows that did not
 * exist before (an import's created rows): a replaced row must go through recountNightTallies.
 */
export async function addToNightTallies(database: ArchiveDatabase, transits: readonly TallyInput[], newNights: readonly NightKey[] = []): Promise<void> {
  const nightIds = [...new Set(transits.filter((t) => t.visibility === 'visible').map((t) => t.nightId))];
  if (nightIds.length === 0) return;
  const stored = await database.nightTallies.bulkGet(nightIds);
  const tallies = new Map<string, NightTallyRecord>();
  for (const tally of stored) if (tally !== undefined) tallies.set(tally.nightId, tally);
  const nights = new Map<string, NightKey>(newNights.map((n) => [n.id, n]));
  const unknown = nightIds.filter((id) => !tallies.has(id) && !nights.has(id));
  for (const night of await database.nights.bulkGet(unknown)) if (night !== undefined) nights.set(night.id, night);
  addTo(tallies, transits, nights);
  await database.nightTallies.bulkPut([...tallies.values()]);
}

/**
 * Recomputes the tallies of a few nights from their stored transits (an edit, a live entry, an
 * undo, a removal); a night left without visible transits loses its tally. Call inside the
 * transaction that changed them, with `transitGroups`, `nights` and `nightTallies` in its scope.
 */
export async function recountNightTallies(database: ArchiveDatabase, nightIds: Iterable<string>): Promise<void> {
  for (const nightId of new Set(nightIds)) {
    const [night, transits] = await Promise.all([database.nights.get(nightId), transitsOfNight(database, nightId)]);
    const [tally] = night === undefined ? [] : talliesFromRows([night], transits);
    if (tally === undefined) await database.nightTallies.delete(nightId);
    else await database.nightTallies.put(tally);
  }
}

/** Throws away every tally and computes them all again from the stored nights and transits (tests, repairs). */
export async function rebuildNightTallies(database: ArchiveDatabase): Promise<void> {
  await database.transaction('rw', [database.nights, database.transitGroups, database.nightTallies], async () => {
    const [nights, transits] = await Promise.all([database.nights.toArray(), allTransits(database)]);
    await database.nightTallies.clear();
    await database.nightTallies.bulkAdd(talliesFromRows(nights, transits));
  });
}

/** Transits read per page by the v3 upgrade: bounded memory and short tasks at a million rows. */
const UPGRADE_PAGE_ROWS = 2_000;

/**
 * The version 3 upgrade (schemaV3.ts): fills `nightTallies` from the rows version 2 stored,
 * paging through the transits in primary-key order rather than reading a million at once.
 */
export async function upgradeToV3(transaction: Transaction): Promise<void> {
  const nights = (await transaction.table('nights').toArray()) as NightRecord[];
  const byId = new Map<string, NightKey>(nights.map((n) => [n.id, n]));
  const tallies = new Map<string, NightTallyRecord>();
  const transits = transaction.table('transits');
  let page = (await transits.limit(UPGRADE_PAGE_ROWS).toArray()) as TransitRecord[];
  while (page.length > 0) {
    // A v2 transit whose night is missing (never written by this app) would stop the upgrade: skip it.
    addTo(tallies, page.filter((t) => byId.has(t.nightId)), byId);
    if (page.length < UPGRADE_PAGE_ROWS) break;
    page = (await transits.where(':id').above((page.at(-1) as TransitRecord).id).limit(UPGRADE_PAGE_ROWS).toArray()) as TransitRecord[];
  }
  await transaction.table('nightTallies').bulkAdd([...tallies.values()]);
}
