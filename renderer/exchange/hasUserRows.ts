import { DEMO_IMPORT_ID } from '../demo/demoArchive.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { TRANSITS } from '../store/archiveTables.ts';

/** Tables whose rows are the user's observations and set-up (settings and reference tables excluded). */
const USER_TABLES = ['sites', 'instruments', 'instrumentEvents', 'stars', 'nights', 'transits', 'reductions'] as const;

/**
 * Whether the archive holds any row the user would miss: a visible row not written by the demo.
 * Stops at the first such row, so a full archive answers at once; an archive of only the demo
 * scans the demo's rows (a few thousand).
 */
export async function hasUserRows(database: ArchiveDatabase): Promise<boolean> {
  const isUsers = (row: { importId?: string; visibility?: string }) => row.importId !== DEMO_IMPORT_ID && row.visibility !== 'staged';
  for (const name of USER_TABLES) {
    const found = name === TRANSITS
      ? await database.transitGroups.filter((group) => group.transits.some(isUsers)).first()
      : await database.table(name).filter(isUsers).first();
    if (found !== undefined) return true;
  }
  return false;
}
