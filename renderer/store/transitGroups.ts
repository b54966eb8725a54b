import type { Transaction } from 'dexie';
import type { TransitRecord } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from './database.ts';
import { TimeOrderedIds } from './timeOrderedId.ts';

/**
 * The archive's transits, stored in groups (schema v4, schemaV4.ts).
 *
 * IndexedDB in Chromium pays about 55 µs for every record it writes, whatever its size and even
 * with no index (headless Chromium on the 2-core build machine, 100,000 transit rows: 56 µs a row
 * with no index, 73 µs with three; the same transits 64 to a record: 7.7 µs a transit with three
 * indexes; README "The archive at scale"). So transits are written as groups of up to
 * GROUP_MAX_TRANSITS transits of ONE star, close in time, and every reader and writer goes
 * through this module: the rest of the app sees TransitRecords, never a group.
 *
 * A group holds its transits in ascending utcMjd (ties by id) and lists the nights and imports
 * they belong to (multi-entry indexes), so a night, a star's time range or an import is found
 * from the indexes. Groups of one star may overlap in time (two imports, a live entry); a group
 * never spans more than GROUP_MAX_SPAN_DAYS, which bounds a star's range query.
 *
 * Every function works inside the caller's transaction when there is one (its scope must hold
 * `transitGroups`), so an import, an edit or a restore stays one atomic transaction.
 */
export interface TransitGroupRecord {
  /** Time-ordered UUID of the group (not of any transit). */
  readonly id: string;
  readonly starId: string;
  /** Smallest and largest utcMjd of its transits. */
  readonly firstUtcMjd: number;
  readonly lastUtcMjd: number;
  /** Distinct nightId of its transits (multi-entry index). */
  readonly nightIds: readonly string[];
  /** Distinct importId of its transits that have one (multi-entry index). */
  readonly importIds: readonly string[];
  /** How many transits it holds (`transits.length`), in the index `[starId+transitCount]` so a star's count is read from keys alone. */
  readonly transitCount: number;
  /** At least one transit, all of `starId`, ascending utcMjd then id. */
  readonly transits: readonly TransitRecord[];
}

/** Transits per group at most: one record write then carries 64 transits. */
export const GROUP_MAX_TRANSITS = 64;

/** Largest utcMjd span of a group, days: a star's range query starts this far before its range. */
export const GROUP_MAX_SPAN_DAYS = 400;

const groupIds = new TimeOrderedIds();

function byTime(a: TransitRecord, b: TransitRecord): number {
  return a.utcMjd - b.utcMjd || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
}

/** A group record holding `transits` (one star, at least one, any order); keeps `id` when given. */
export function groupOf(transits: readonly TransitRecord[], id: string = groupIds.next()): TransitGroupRecord {
  if (transits.length === 0) throw new Error('transitGroups: a group needs at least one transit');
  const sorted = [...transits].sort(byTime);
  const starId = sorted[0].starId;
  const nightIds = new Set<string>();
  const importIds = new Set<string>();
  for (const t of sorted) {
    if (t.starId !== starId) throw new Error(`transitGroups: transit "${t.id}" of star "${t.starId}" in a group of star "${starId}"`);
    nightIds.add(t.nightId);
    if (typeof t.importId === 'string') importIds.add(t.importId);
  }
  return {
    id, starId, firstUtcMjd: sorted[0].utcMjd, lastUtcMjd: (sorted.at(-1) as TransitRecord).utcMjd, nightIds: [...nightIds], importIds: [...importIds],
    transitCount: sorted.length, transits: sorted,
  };
}

/**
 * Cuts transits (any stars, any order) into new groups: per star in time order, a new group after
 * GROUP_MAX_TRANSITS or when the next transit is more than GROUP_MAX_SPAN_DAYS after the group's
 * first. Pure.
 */
export function groupTransits(transits: readonly TransitRecord[]): TransitGroupRecord[] {
  const byStar = new Map<string, TransitRecord[]>();
  for (const t of transits) {
    const list = byStar.get(t.starId);
    if (list === undefined) byStar.set(t.starId, [t]);
    else list.push(t);
  }
  const groups: TransitGroupRecord[] = [];
  for (const list of byStar.values()) {
    list.sort(byTime);
    let start = 0;
    for (let k = 1; k <= list.length; k++) {
      if (k === list.length || k - start === GROUP_MAX_TRANSITS || list[k].utcMjd - list[start].utcMjd > GROUP_MAX_SPAN_DAYS) {
        groups.push(groupOf(list.slice(start, k)));
        start = k;
      }
    }
  }
  return groups;
}

/**
 * The transits ordered by star, then time (a copy): written in chunks in this order, each chunk
 * makes full groups (a file or bundle in night or id order would cut each star's run at every chunk).
 */
export function inGroupingOrder<T extends TransitRecord>(transits: readonly T[]): T[] {
  return [...transits].sort((a, b) => (a.starId < b.starId ? -1 : a.starId > b.starId ? 1 : byTime(a, b)));
}

function flatten(groups: readonly TransitGroupRecord[], keep: (t: TransitRecord) => boolean = () => true): TransitRecord[] {
  const out: TransitRecord[] = [];
  for (const g of groups) for (const t of g.transits) if (keep(t)) out.push(t);
  return out;
}

/**
 * The transit rows of `groups`, in id order: the order a table of rows keyed by id gave before
 * version 4, so exports and bundles list transits as they always did. Pure.
 */
export function transitRowsInIdOrder(groups: readonly Pick<TransitGroupRecord, 'transits'>[]): TransitRecord[] {
  return flatten(groups as readonly TransitGroupRecord[]).sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
}

/** The groups holding a transit one import wrote (the multi-entry index lists each group once per key, here one). */
function groupsOfImport(database: ArchiveDatabase, importId: string): Promise<TransitGroupRecord[]> {
  return database.transitGroups.where('importIds').equals(importId).toArray();
}

/** Writes back the groups an edit changed and deletes those it left empty. */
async function writeBack(database: ArchiveDatabase, changed: readonly TransitGroupRecord[], emptied: readonly string[]): Promise<void> {
  if (changed.length > 0) await database.transitGroups.bulkPut([...changed]);
  if (emptied.length > 0) await database.transitGroups.bulkDelete([...emptied]);
}

/**
 * The groups holding a transit of any of these nights, each once. Found as primary keys first (a
 * key cursor reads no group) and then read once each: the multi-entry index lists a group once per
 * night it holds, so reading values through it read a group up to 64 times (60 consecutive nights
 * of a 1,045-night archive: 436 ms a chunk, most of the overview's time).
 */
async function groupsOfNights(database: ArchiveDatabase, nightIds: readonly string[]): Promise<TransitGroupRecord[]> {
  if (nightIds.length === 0) return [];
  const keys = await database.transitGroups.where('nightIds').anyOf([...nightIds]).primaryKeys();
  const groups = await database.transitGroups.bulkGet([...new Set(keys)]);
  return groups.filter((g): g is TransitGroupRecord => g !== undefined);
}

/** Every stored transit (visible or not), in id order (transitRowsInIdOrder). */
export async function allTransits(database: ArchiveDatabase): Promise<TransitRecord[]> {
  return transitRowsInIdOrder(await database.transitGroups.toArray());
}

/** The stored transits of one night (visible or not), ascending utcMjd. */
export async function transitsOfNight(database: ArchiveDatabase, nightId: string): Promise<TransitRecord[]> {
  return flatten(await groupsOfNights(database, [nightId]), (t) => t.nightId === nightId).sort(byTime);
}

/**
 * The stored transits of these nights (visible or not), ordered by nightId then id (the order a
 * `nightId` index gave before version 4, so reductions see their rows as they always did).
 */
export async function transitsOfNights(database: ArchiveDatabase, nightIds: readonly string[]): Promise<TransitRecord[]> {
  if (nightIds.length === 0) return [];
  const wanted = new Set(nightIds);
  const groups = await groupsOfNights(database, [...wanted]);
  return flatten(groups, (t) => wanted.has(t.nightId))
    .sort((a, b) => (a.nightId < b.nightId ? -1 : a.nightId > b.nightId ? 1 : a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
}

/** The stored transits of one star with utcMjd in [lowMjd, highMjd] (visible or not), ascending utcMjd. */
export async function transitsOfStar(database: ArchiveDatabase, starId: string, lowMjd: number = -Infinity, highMjd: number = Infinity): Promise<TransitRecord[]> {
  const groups = await database.transitGroups.where('[starId+firstUtcMjd]').between([starId, lowMjd - GROUP_MAX_SPAN_DAYS], [starId, highMjd], true, true).toArray();
  return flatten(groups, (t) => t.utcMjd >= lowMjd && t.utcMjd <= highMjd).sort(byTime);
}

/**
 * How many transits each star has (visible or not); stars without one are absent. Read from the
 * keys of the index `[starId+transitCount]` alone, no group is read (at a million transits,
 * reading every group took 6.8 s).
 */
export async function transitCountsByStar(database: ArchiveDatabase): Promise<Map<string, number>> {
  const counts = new Map<string, number>();
  await database.transitGroups.orderBy('[starId+transitCount]').eachKey((key) => {
    const [starId, count] = key as [string, number];
    counts.set(starId, (counts.get(starId) ?? 0) + count);
  });
  return counts;
}

/** The stored transits one import wrote (visible or not). */
export async function transitsOfImport(database: ArchiveDatabase, importId: string): Promise<TransitRecord[]> {
  return flatten(await groupsOfImport(database, importId), (t) => t.importId === importId);
}

/** The stored transit with this id, looked up in its night; undefined when there is none. */
export async function getTransit(database: ArchiveDatabase, nightId: string, transitId: string): Promise<TransitRecord | undefined> {
  return (await transitsOfNight(database, nightId)).find((t) => t.id === transitId);
}

/**
 * Stores new transits (their ids must not be stored yet) as new groups; returns how many group
 * records were written. `bulkAdd` of the groups: a test hook that patches
 * `database.transitGroups.bulkAdd` sees every write.
 */
export async function addTransits(database: ArchiveDatabase, transits: readonly TransitRecord[]): Promise<number> {
  if (transits.length === 0) return 0;
  const groups = groupTransits(transits);
  await database.transitGroups.bulkAdd(groups);
  return groups.length;
}

/**
 * Stores one new transit (a live entry): into a group of its star that has room and stays within
 * GROUP_MAX_SPAN_DAYS, else as a new group.
 */
export async function addTransit(database: ArchiveDatabase, transit: TransitRecord): Promise<void> {
  const candidates = await database.transitGroups.where('[starId+firstUtcMjd]')
    .between([transit.starId, transit.utcMjd - GROUP_MAX_SPAN_DAYS], [transit.starId, transit.utcMjd], true, true).toArray();
  const host = candidates.reverse().find((g) => g.transits.length < GROUP_MAX_TRANSITS
    && Math.max(g.lastUtcMjd, transit.utcMjd) - Math.min(g.firstUtcMjd, transit.utcMjd) <= GROUP_MAX_SPAN_DAYS);
  if (host === undefined) await database.transitGroups.add(groupOf([transit]));
  else await database.transitGroups.put(groupOf([...host.transits, transit], host.id));
}

/**
 * Replaces stored transits by new versions with the same ids (an edit, an undo, an import's
 * update), found in the night each `before` belongs to; a transit whose night changed is looked
 * up in its new night too. Throws, changing nothing, when one is not stored. A version that would
 * stretch its group beyond GROUP_MAX_SPAN_DAYS, or changes star, moves to a group of its own.
 */
export async function replaceTransits(database: ArchiveDatabase, transits: readonly TransitRecord[], previousNightIds: readonly string[] = []): Promise<void> {
  if (transits.length === 0) return;
  const byId = new Map(transits.map((t) => [t.id, t]));
  const groups = await groupsOfNights(database, [...new Set([...transits.map((t) => t.nightId), ...previousNightIds])]);
  const found = new Set<string>();
  const changed: TransitGroupRecord[] = [];
  const emptied: string[] = [];
  const moved: TransitRecord[] = [];
  for (const group of groups) {
    if (!group.transits.some((t) => byId.has(t.id))) continue;
    const kept: TransitRecord[] = [];
    for (const t of group.transits) {
      const next = byId.get(t.id);
      if (next === undefined) kept.push(t);
      else {
        found.add(t.id);
        if (next.starId === group.starId) kept.push(next);
        else moved.push(next);
      }
    }
    if (kept.length === 0) {
      emptied.push(group.id);
      continue;
    }
    const candidate = groupOf(kept, group.id);
    if (candidate.lastUtcMjd - candidate.firstUtcMjd <= GROUP_MAX_SPAN_DAYS) changed.push(candidate);
    else {
      // An edit stretched the group: the edited transits leave it for groups of their own.
      const stay = kept.filter((t) => !byId.has(t.id));
      for (const t of kept) if (byId.has(t.id)) moved.push(t);
      if (stay.length === 0) emptied.push(group.id);
      else changed.push(groupOf(stay, group.id));
    }
  }
  const missing = transits.filter((t) => !found.has(t.id));
  if (missing.length > 0) throw new Error(`transitGroups: no stored transit with id "${missing[0].id}" in night "${missing[0].nightId}" (${missing.length} not found); nothing was changed`);
  await writeBack(database, changed, emptied);
  for (const t of moved) await addTransit(database, t);
}

/**
 * Removes the stored transits of `groups` (each once) that `remove` picks (groups left empty are
 * deleted); returns the removed transits.
 */
async function removeFrom(database: ArchiveDatabase, groups: readonly TransitGroupRecord[], remove: (t: TransitRecord) => boolean): Promise<TransitRecord[]> {
  const removed: TransitRecord[] = [];
  const changed: TransitGroupRecord[] = [];
  const emptied: string[] = [];
  for (const group of groups) {
    const kept = group.transits.filter((t) => !remove(t) || (removed.push(t), false));
    if (kept.length === group.transits.length) continue;
    if (kept.length === 0) emptied.push(group.id);
    else changed.push(groupOf(kept, group.id));
  }
  await writeBack(database, changed, emptied);
  return removed;
}

/** Removes the transits an import wrote that `remove` picks (all of them by default); returns them. */
export async function removeTransitsOfImport(database: ArchiveDatabase, importId: string, remove: (t: TransitRecord) => boolean = () => true): Promise<TransitRecord[]> {
  const groups = await groupsOfImport(database, importId);
  return removeFrom(database, groups, (t) => t.importId === importId && remove(t));
}

/** Removes the transits of these nights that `remove` picks; returns them. */
export async function removeTransitsOfNights(database: ArchiveDatabase, nightIds: readonly string[], remove: (t: TransitRecord) => boolean = () => true): Promise<TransitRecord[]> {
  const wanted = new Set(nightIds);
  const groups = await groupsOfNights(database, [...wanted]);
  return removeFrom(database, groups, (t) => wanted.has(t.nightId) && remove(t));
}

/** Transits read per page by the v4 upgrade (bounded memory at a million rows). */
const UPGRADE_PAGE_ROWS = 20_000;

/**
 * The version 4 upgrade (schemaV4.ts): reads the version 3 `transits` table page by page in
 * primary-key order and writes its rows, unchanged, as groups; the old table is then dropped by
 * the schema. Every row is kept, whatever its visibility. `onProgress` hears transits read, then
 * transits written, out of twice the table's rows.
 */
export async function upgradeToV4(transaction: Transaction, onProgress: (done: number, total: number) => void = () => {}): Promise<void> {
  const rows = transaction.table('transits');
  const groups = transaction.table('transitGroups');
  const total = 2 * (await rows.count());
  onProgress(0, total);
  // Groups are cut per star and time over the whole table, so rows are gathered first (as
  // records, not strings: a million transits is a few hundred megabytes at most).
  const all: TransitRecord[] = [];
  let page = (await rows.limit(UPGRADE_PAGE_ROWS).toArray()) as TransitRecord[];
  while (page.length > 0) {
    for (const t of page) all.push(t);
    onProgress(all.length, total);
    if (page.length < UPGRADE_PAGE_ROWS) break;
    page = (await rows.where(':id').above((page.at(-1) as TransitRecord).id).limit(UPGRADE_PAGE_ROWS).toArray()) as TransitRecord[];
  }
  const cut = groupTransits(all);
  let written = 0;
  for (let start = 0; start < cut.length; start += 1_000) {
    const chunk = cut.slice(start, start + 1_000);
    await groups.bulkAdd(chunk);
    written += chunk.reduce((sum, g) => sum + g.transits.length, 0);
    onProgress(all.length + written, total);
  }
}

/** Rewrites the transits an import wrote through `change` (same id, star and time); returns how many. */
export async function changeTransitsOfImport(database: ArchiveDatabase, importId: string, change: (t: TransitRecord) => TransitRecord): Promise<number> {
  const groups = await groupsOfImport(database, importId);
  let count = 0;
  const changed = groups.map((g) => groupOf(g.transits.map((t) => (t.importId === importId ? (count++, change(t)) : t)), g.id));
  if (changed.length > 0) await database.transitGroups.bulkPut(changed);
  return count;
}
