// Test-side access to stored transits by id and as rows. Since schema v4 the archive stores
// transits in groups (renderer/store/transitGroups.ts) and the app never looks a transit up by id
// alone; tests that seed or inspect single rows use these, built on the module's own functions.
import type { TransitRecord } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from '../../renderer/store/database.ts';
import { addTransits, allTransits, groupOf } from '../../renderer/store/transitGroups.ts';

/** Stores `rows` as `bulkPut` of rows did: a row whose id is stored replaces it, the others are added. */
export async function putTransitRows(database: ArchiveDatabase, rows: readonly TransitRecord[]): Promise<void> {
  await database.transaction('rw', database.transitGroups, async () => {
    const ids = new Set(rows.map((r) => r.id));
    for (const group of await database.transitGroups.toArray()) {
      if (!group.transits.some((t) => ids.has(t.id))) continue;
      const kept = group.transits.filter((t) => !ids.has(t.id));
      if (kept.length === 0) await database.transitGroups.delete(group.id);
      else await database.transitGroups.put(groupOf(kept, group.id));
    }
    await addTransits(database, rows);
  });
}

/** The stored transit with this id (read over every group), or undefined. */
export async function transitById(database: ArchiveDatabase, id: string): Promise<TransitRecord | undefined> {
  return (await allTransits(database)).find((t) => t.id === id);
}

/** How many transits are stored, visible or not (read over every group). */
export async function storedTransitCount(database: ArchiveDatabase): Promise<number> {
  return (await allTransits(database)).length;
}

/** Changes fields of the stored transit with this id, as `update` of a row did; returns 1, or 0 when it is not stored. */
export async function updateTransitRow(database: ArchiveDatabase, id: string, change: Partial<TransitRecord>): Promise<number> {
  const before = await transitById(database, id);
  if (before === undefined) return 0;
  await putTransitRows(database, [{ ...before, ...change }]);
  return 1;
}
