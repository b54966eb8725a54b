import type { ReductionRecord } from '../../core/archive/records.ts';
import type { FileFilter, SaveFileRequest } from '../../core/bridge.ts';
import { archiveTableCsv, type CsvTableName, type CsvTableRows } from '../../core/exchange-formats/archive-table-csv.ts';
import { writeCsvTable } from '../../core/exchange-formats/export-columns.ts';
import { SOLVE_STAR_COLUMNS, solveStarsOf } from '../../core/exchange-formats/solve-star-columns.ts';
import { writeVoTable } from '../../core/exchange-formats/votable-writer.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import type { ArchiveDatabase } from '../store/database.ts';

const CSV: FileFilter = { label: 'CSV (comma-separated values)', extensions: ['csv'] };
const VOTABLE: FileFilter = { label: 'VOTable', extensions: ['vot', 'xml'] };

/** A plain file name piece from a label: letters, digits and dashes only (the shell's rule for names). */
function namePiece(label: string): string {
  return label.replace(/[^A-Za-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'untitled';
}

/**
 * One archive table as a CSV save request. Only visible rows are written (rows staged by an
 * unfinished import are not part of the archive yet). Built on the calling thread: fine for
 * tables of tens of thousands of rows; the transits of a very large archive take seconds.
 */
export async function tableCsvRequest<K extends CsvTableName>(database: ArchiveDatabase, table: K, todayUtc: string): Promise<SaveFileRequest> {
  const rows = (await database.table(table).toArray()).filter((row: { visibility?: string }) => row.visibility !== 'staged') as unknown as CsvTableRows[K];
  return { title: `Save the ${table} as CSV`, suggestedName: `meridian-ledger-${table}-${todayUtc}.csv`, filters: [CSV], bytes: encodeUtf8(archiveTableCsv(table, rows)) };
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
