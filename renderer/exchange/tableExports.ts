import type { ReductionRecord } from '../../core/archive/records.ts';
import type { FileFilter, SaveFileRequest } from '../../core/bridge.ts';
import { archiveTableCsv, type CsvTableName, type CsvTableRows } from '../../core/exchange-formats/archive-table-csv.ts';
import { writeCsvTable } from '../../core/exchange-formats/export-columns.ts';
import { SOLVE_STAR_COLUMNS, solveStarsOf } from '../../core/exchange-formats/solve-star-columns.ts';
import { writeVoTable } from '../../core/exchange-formats/votable-writer.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { readTableRows, storedTable } from '../store/archiveTables.ts';
import { TaskCancelledError, type TaskControl } from '../../core/task/task-control.ts';

const CSV: FileFilter = { label: 'CSV (comma-separated values)', extensions: ['csv'] };
const VOTABLE: FileFilter = { label: 'VOTable', extensions: ['vot', 'xml'] };

/** A plain file name piece from a label: letters, digits and dashes only (the shell's rule for names). */
function namePiece(label: string): string {
  return label.replace(/[^A-Za-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'untitled';
}

/** Rows written to CSV between two yields to the host (progress, cancel). */
export const TABLE_EXPORT_CHUNK_ROWS = 20_000;

/**
 * One archive table as CSV bytes (UTF-8), for the worker. Only visible rows are written (rows
 * staged by an unfinished import are not part of the archive yet). Rows are read in one read-only
 * transaction (one consistent snapshot) and written TABLE_EXPORT_CHUNK_ROWS at a time with progress and
 * cancel; the text is the same as archiveTableCsv of all rows at once, and so is any refusal
 * (on a refused cell the whole table is written again to name the row as a single pass would).
 */
export async function tableCsvBytes<K extends CsvTableName>(database: ArchiveDatabase, table: K, control: TaskControl): Promise<{ bytes: Uint8Array; rows: number }> {
  const all = await database.transaction('r', storedTable(database, table), () => readTableRows(database, table));
  const rows = all.filter((row: { visibility?: string }) => row.visibility !== 'staged') as unknown as CsvTableRows[K];
  const headerLength = archiveTableCsv(table, [] as unknown as CsvTableRows[K]).length;
  const parts: string[] = [];
  for (let start = 0; start < rows.length || start === 0; start += TABLE_EXPORT_CHUNK_ROWS) {
    if (control.cancellation.isCancelled) throw new TaskCancelledError(`the ${table} export`, start);
    const chunk = rows.slice(start, start + TABLE_EXPORT_CHUNK_ROWS) as unknown as CsvTableRows[K];
    let text: string;
    try {
      text = archiveTableCsv(table, chunk);
    } catch {
      text = archiveTableCsv(table, rows); // throws again, with the row number counted over the whole table
    }
    parts.push(start === 0 ? text : text.slice(headerLength));
    control.reportProgress(Math.min(start + TABLE_EXPORT_CHUNK_ROWS, rows.length), rows.length);
    await control.yieldToHost();
  }
  return { bytes: encodeUtf8(parts.join('')), rows: rows.length };
}

/** The save request for one table's CSV bytes (made in the worker by tableCsvBytes). */
export function tableCsvSaveRequest(table: CsvTableName, bytes: Uint8Array, todayUtc: string): SaveFileRequest {
  return { title: `Save the ${table} as CSV`, suggestedName: `meridian-ledger-${table}-${todayUtc}.csv`, filters: [CSV], bytes };
}

/** A saved solve's star table as a CSV or VOTable 1.4 save request. */
export function solveStarsRequest(reduction: ReductionRecord, format: 'csv' | 'votable'): SaveFileRequest {
  const stars = solveStarsOf(reduction);
  const base = `meridian-ledger-solve-${namePiece(reduction.label)}-stars`;
  if (format === 'csv') return { title: 'Save the star table as CSV', suggestedName: `${base}.csv`, filters: [CSV], bytes: encodeUtf8(writeCsvTable('stars', SOLVE_STAR_COLUMNS, stars)) };
  const description = `Joint solve "${reduction.label}" of ${reduction.createdUtc}, code ${reduction.codeVersion}, input ${reduction.inputFingerprint}: absolute values with 1-sigma formal errors.`;
  const xml = writeVoTable({ resourceName: 'meridian-ledger-solve', tableName: 'stars', description }, SOLVE_STAR_COLUMNS, stars);
  return { title: 'Save the star table as VOTable', suggestedName: `${base}.vot`, filters: [VOTABLE], bytes: encodeUtf8(xml) };
}
