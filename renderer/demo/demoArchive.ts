/**
 * The demo archive: on the first start of an empty archive the app restores the bundled, invented
 * scenario (assets/demo/, made by the simulator) so that every view has something real to show.
 * Its rows carry the import id DEMO_IMPORT_ID, so the user can remove all of it in one action;
 * a `settings` record remembers that the demo was loaded, skipped or removed, so it never
 * comes back by itself.
 */
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { countArchiveRows, restoreBundle, verifyBundle } from '../exchange/bundleRestore.ts';
import { recountNightTallies } from '../store/nightTallies.ts';
import { TRANSITS } from '../store/archiveTables.ts';
import { removeTransitsOfImport } from '../store/transitGroups.ts';

export const DEMO_IMPORT_ID = 'demo-archive';
export const DEMO_SETTING_KEY = 'demoArchive';
/** The tables whose rows the demo fills (all carry an `importId` index; transits through their groups'). */
export const DEMO_TABLES = ['sites', 'instruments', 'instrumentEvents', 'stars', 'nights', 'transits'] as const;

export type DemoState = { readonly state: 'loaded' | 'skipped' | 'removed'; readonly whenUtc: string };

export async function demoState(database: ArchiveDatabase): Promise<DemoState | null> {
  return ((await database.settings.get(DEMO_SETTING_KEY))?.value as DemoState | undefined) ?? null;
}

/**
 * Restores the demo into an archive that has never seen it and holds nothing; returns the rows
 * written per table, or null when the demo is not due (already decided, or the archive has data).
 */
export async function loadDemoIfFirstStart(
  database: ArchiveDatabase,
  fetchBundle: () => Promise<Uint8Array>,
  nowUtc: string,
): Promise<Record<string, number> | null> {
  if ((await demoState(database)) !== null) return null;
  if ((await countArchiveRows(database)) > 0) {
    await database.settings.put({ key: DEMO_SETTING_KEY, value: { state: 'skipped', whenUtc: nowUtc } satisfies DemoState });
    return null;
  }
  const verified = await verifyBundle(database, await fetchBundle(), UNCONTROLLED);
  const marked = new Map<string, readonly unknown[]>();
  for (const [table, rows] of verified.rows) {
    marked.set(table, (DEMO_TABLES as readonly string[]).includes(table) ? rows.map((row) => ({ ...(row as object), importId: DEMO_IMPORT_ID })) : rows);
  }
  const counts = await restoreBundle(database, { ...verified, rows: marked }, 'into-empty');
  await database.settings.put({ key: DEMO_SETTING_KEY, value: { state: 'loaded', whenUtc: nowUtc } satisfies DemoState });
  return counts;
}

/** Removes every row the demo wrote, in one transaction, and remembers not to load it again. */
export async function removeDemoArchive(database: ArchiveDatabase, nowUtc: string): Promise<number> {
  let removed = 0;
  const tables = DEMO_TABLES.filter((name) => name !== TRANSITS).map((name) => database.table(name));
  await database.transaction('rw', [...tables, database.transitGroups, database.settings, database.nightTallies], async () => {
    // Nights the demo's transits were in: a user's own transit logged into a demo night keeps its tally.
    const removedTransits = await removeTransitsOfImport(database, DEMO_IMPORT_ID);
    const touchedNights = removedTransits.map((t) => t.nightId);
    removed += removedTransits.length;
    for (const table of tables) removed += await table.where('importId').equals(DEMO_IMPORT_ID).delete();
    await recountNightTallies(database, touchedNights);
    await database.settings.put({ key: DEMO_SETTING_KEY, value: { state: 'removed', whenUtc: nowUtc } satisfies DemoState });
  });
  return removed;
}

/** Fetches the bundled demo from the app's own origin (the build copies it as a hashed asset). */
export async function fetchBundledDemo(): Promise<Uint8Array> {
  const url = new URL('../../assets/demo/demo-archive.mlbundle', import.meta.url);
  const response = await fetch(url);
  if (!response.ok) throw new Error(`the demo archive could not be read from the app (${response.status} ${response.statusText})`);
  return new Uint8Array(await response.arrayBuffer());
}
