import { utcInstantMjd } from '../../core/archive-folder/folder-text.ts';
import { parseNightReadings } from '../../core/formats/night-readings.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import type { ImportPlan } from './importReport.ts';
import { planNightListImport, type NightListEntry } from './nightListImport.ts';

/**
 * Validates a night-readings CSV (level and collimation readings, core/reduction/NIGHT.md) and plans
 * its writes: each reading joins its archived night (nightListImport.ts); the nightly reductions
 * fix b at the mean of the night's level readings (collimation readings are kept, c is still fitted).
 */
export function planReadingsImport(database: ArchiveDatabase, bytes: Uint8Array, fileName: string, nowUtc: string): Promise<ImportPlan> {
  const parsed = parseNightReadings(bytes, fileName);
  const rows = parsed.rows.map((row) => {
    const utcMjd = utcInstantMjd(row.utc);
    const entries: NightListEntry[] = [
      ...(row.levelArcsec === null ? [] : [{ list: 'levelReadings' as const, value: { utcMjd, levelArcsec: row.levelArcsec } }]),
      ...(row.collimationArcsec === null ? [] : [{ list: 'collimationReadings' as const, value: { utcMjd, collimationArcsec: row.collimationArcsec } }]),
    ];
    return { ...row, entries };
  });
  return planNightListImport(database, 'night-readings', fileName, nowUtc, { ...parsed, rows });
}
