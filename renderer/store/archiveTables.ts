import type { Table } from 'dexie';
import type { TransitRecord } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from './database.ts';
import { DERIVED_TABLES } from './nightTallies.ts';
import { addTransits, allTransits, inGroupingOrder } from './transitGroups.ts';

/**
 * The archive's tables as bundles, CSV exports and imports name them, over how IndexedDB stores
 * them. They are the Dexie tables, except that the transits (one logical row per transit, as
 * every file format holds them) are stored in `transitGroups` (schema v4, transitGroups.ts), and
 * derived tables (DERIVED_TABLES) are not archive tables at all.
 */
export const TRANSITS = 'transits';

/** The physical table that stores each logical table, where the name differs. */
const STORED_IN: Readonly<Record<string, string>> = { [TRANSITS]: 'transitGroups' };
const LOGICAL_OF: Readonly<Record<string, string>> = Object.fromEntries(Object.entries(STORED_IN).map(([logical, stored]) => [stored, logical]));

/** The logical name of the stored table `stored` (`transitGroups` → `transits`; others as they are). */
export function logicalTableName(stored: string): string {
  return LOGICAL_OF[stored] ?? stored;
}

/** The logical table names, in the order of the database's tables (derived ones left out). */
export function archiveTableNames(database: ArchiveDatabase): string[] {
  return database.tables.map((t) => logicalTableName(t.name)).filter((name) => !DERIVED_TABLES.includes(name));
}

/**
 * `rows` of logical table `name` in the order to write them in chunks: transits star by star in
 * time order (inGroupingOrder), so each chunk makes full groups; other tables as they are.
 */
export function inWriteOrder(name: string, rows: readonly unknown[]): readonly unknown[] {
  return name === TRANSITS ? inGroupingOrder(rows as readonly TransitRecord[]) : rows;
}

/** The Dexie table that stores logical table `name` (for a transaction's scope). */
export function storedTable(database: ArchiveDatabase, name: string): Table {
  return database.table(STORED_IN[name] ?? name);
}

/** Every row of logical table `name` (visible or not). */
export async function readTableRows(database: ArchiveDatabase, name: string): Promise<object[]> {
  return name === TRANSITS ? allTransits(database) : storedTable(database, name).toArray();
}

/**
 * Writes rows into logical table `name` inside the caller's transaction: transits as new groups
 * (their ids must not be stored yet), any other table by bulkPut.
 */
export async function writeTableRows(database: ArchiveDatabase, name: string, rows: readonly object[]): Promise<void> {
  if (name === TRANSITS) await addTransits(database, rows as readonly TransitRecord[]);
  else await storedTable(database, name).bulkPut(rows as object[]);
}

/**
 * Rows of logical table `name`. For transits, the visible ones, summed from the night tallies
 * (nightTallies.ts): counting a million transits otherwise means reading every group.
 */
export async function countTableRows(database: ArchiveDatabase, name: string): Promise<number> {
  if (name !== TRANSITS) return storedTable(database, name).count();
  let sum = 0;
  await database.nightTallies.each((tally) => void (sum += tally.transitCount));
  return sum;
}
