import { clockComparisonOfRow } from '../../core/archive-folder/night-files.ts';
import { parseClockComparisons } from '../../core/formats/clock-comparisons.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import type { ImportPlan } from './importReport.ts';
import { planNightListImport } from './nightListImport.ts';

/**
 * Validates a clock-comparisons CSV (core/reduction/NIGHT.md) and plans its writes: each comparison
 * joins its archived night (nightListImport.ts; a row without `instrumentId` is the clock of every
 * instrument, as the format says).
 */
export function planClockImport(database: ArchiveDatabase, bytes: Uint8Array, fileName: string, nowUtc: string): Promise<ImportPlan> {
  const parsed = parseClockComparisons(bytes, fileName);
  const rows = parsed.rows.map((row) => ({ ...row, entries: [{ list: 'clockComparisons' as const, value: clockComparisonOfRow(row) }] }));
  return planNightListImport(database, 'clock-comparisons', fileName, nowUtc, { ...parsed, rows });
}
