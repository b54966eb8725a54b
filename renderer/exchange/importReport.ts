import type { Rejection } from '../../core/formats/parse-result.ts';
import type { ImportWrites } from './stagedWriter.ts';

/** The kinds of file the Exchange view imports. */
export type ImportFileKind = 'site-description' | 'star-list' | 'transit-log' | 'clock-comparisons' | 'night-readings';

/**
 * What the validation pass found in one file, before anything is written. Invariant (tested):
 * validRows + rejectedRowCount = totalRows, where rejectedRowCount counts distinct rejected data
 * rows (a row with two problems counts once; row 0, the header, is not a data row).
 */
export interface ImportReport {
  readonly fileName: string;
  readonly kind: ImportFileKind;
  readonly totalRows: number;
  readonly validRows: number;
  readonly rejectedRowCount: number;
  /** Every problem, row 0 for the header or the whole file; duplicates of archived rows included. */
  readonly rejected: readonly Rejection[];
  /** Rows skipped because the archive already holds them (also listed in `rejected`). */
  readonly duplicateCount: number;
  readonly warnings: readonly string[];
  /** What the archive must hold first (e.g. the star list before a transit log); empty when ready. */
  readonly missingPrerequisites: readonly string[];
  /** Rows that will be created and updated, per table. */
  readonly createdCounts: Readonly<Record<string, number>>;
  readonly updatedCounts: Readonly<Record<string, number>>;
}

/** A validated file: the report and the writes that importing its valid rows would make. */
export interface ImportPlan {
  readonly report: ImportReport;
  readonly writes: ImportWrites;
}

/** Distinct data rows (row ≥ 1) among the rejections. */
export function countRejectedRows(rejected: readonly Rejection[]): number {
  return new Set(rejected.filter((r) => r.row >= 1).map((r) => r.row)).size;
}

export function countsOf(rows: ImportWrites['created']): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const [table, list] of Object.entries(rows)) if (list && list.length > 0) counts[table] = list.length;
  return counts;
}
