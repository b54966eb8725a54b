import { readCsv, type CsvProblem, type CsvRecord } from './csv.ts';
import type { Rejection } from './parse-result.ts';
import { decodeUtf8 } from './utf8.ts';

/** One data row of a CSV table: 1-based data row number, its physical line and cells by column. */
export interface TableRow {
  readonly row: number;
  readonly line: number;
  readonly cells: ReadonlyMap<string, string>;
}

/**
 * The cells of one data row by column name, read through the table's one name → position map
 * instead of a Map per row (a million-row log made a million Maps). Behaves as a ReadonlyMap in
 * header order.
 */
class RowCells implements ReadonlyMap<string, string> {
  constructor(
    private readonly columnIndex: ReadonlyMap<string, number>,
    private readonly fields: readonly string[],
  ) {}

  get size(): number {
    return this.columnIndex.size;
  }

  get(name: string): string | undefined {
    const index = this.columnIndex.get(name);
    return index === undefined ? undefined : this.fields[index];
  }

  has(name: string): boolean {
    return this.columnIndex.has(name);
  }

  *entries(): MapIterator<[string, string]> {
    for (const [name, index] of this.columnIndex) yield [name, this.fields[index]];
  }

  *keys(): MapIterator<string> {
    yield* this.columnIndex.keys();
  }

  *values(): MapIterator<string> {
    for (const index of this.columnIndex.values()) yield this.fields[index];
  }

  [Symbol.iterator](): MapIterator<[string, string]> {
    return this.entries();
  }

  forEach(callback: (value: string, key: string, map: ReadonlyMap<string, string>) => void, thisArg?: unknown): void {
    for (const [name, value] of this.entries()) callback.call(thisArg, value, name, this);
  }
}

/** A decoded CSV file split into header and data rows; structural problems already rejected. */
export interface CsvTable {
  readonly header: readonly string[];
  readonly rows: readonly TableRow[];
  readonly rejected: Rejection[];
  readonly totalRows: number;
}

/**
 * Bytes → UTF-8 text → RFC 4180 records → header + data rows. Rejects, with row and line:
 * invalid UTF-8 (byte offset named; nothing else is read), an empty file, a malformed header
 * (every data row is then rejected too, since its columns are unknown), malformed records and
 * rows whose field count differs from the header's.
 * `fileName` is used in messages only.
 */
export function readCsvTable(bytes: Uint8Array, fileName: string): CsvTable {
  const decoded = decodeUtf8(bytes);
  if (!decoded.ok) return { header: [], rows: [], rejected: [{ row: 0, line: 0, column: '', reason: `${fileName}: ${decoded.reason}` }], totalRows: 0 };
  const { records, problems } = readCsv(decoded.text);
  // Restore file order: problems carry their record index; good records fill the other places
  // (the records themselves, not copies: a million-row log makes a million of them).
  const ordered: (CsvRecord | (CsvProblem & { readonly recordIndex: number }))[] = [];
  let good = 0;
  const problemByIndex = new Map(problems.map((p) => [p.recordIndex, p]));
  for (let index = 0; index < records.length + problems.length; index++) {
    ordered.push(problemByIndex.get(index) ?? records[good++]);
  }
  if (ordered.length === 0) return { header: [], rows: [], rejected: [{ row: 0, line: 1, column: '', reason: `${fileName}: the file is empty; the first line must be the header` }], totalRows: 0 };
  const totalRows = ordered.length - 1;
  const rejected: Rejection[] = [];
  const headerEntry = ordered[0];
  let headerProblem: string | null = null;
  let header: string[] = [];
  if ('reason' in headerEntry) headerProblem = `the header is malformed: ${headerEntry.reason}`;
  else {
    header = headerEntry.fields.map((f) => f.trim());
    const seen = new Set<string>();
    for (const name of header) {
      if (name === '') headerProblem = 'the header has an empty column name; name every column';
      else if (seen.has(name)) headerProblem = `the header names column '${name}' twice; each column once`;
      seen.add(name);
    }
  }
  if (headerProblem !== null) {
    rejected.push({ row: 0, line: headerEntry.line, column: '', reason: headerProblem });
    ordered.slice(1).forEach((entry, k) => rejected.push({ row: k + 1, line: entry.line, column: '', reason: 'not read: the header is unusable (see row 0)' }));
    return { header, rows: [], rejected, totalRows };
  }
  const columnIndex = new Map(header.map((name, i) => [name, i]));
  const rows: TableRow[] = [];
  for (let row = 1; row < ordered.length; row++) {
    const entry = ordered[row];
    if ('reason' in entry) {
      rejected.push({ row, line: entry.line, column: header[entry.field - 1] ?? `field ${entry.field}`, reason: entry.reason });
    } else if (entry.fields.length !== header.length) {
      rejected.push({ row, line: entry.line, column: '', reason: `${entry.fields.length} fields but the header has ${header.length}; quote fields that contain commas` });
    } else {
      rows.push({ row, line: entry.line, cells: new RowCells(columnIndex, entry.fields) });
    }
  }
  return { header, rows, rejected, totalRows };
}

/**
 * The rejection of a whole file whose header cannot be read or lacks a required column: the
 * header problem as row 0 and every data row "not read"; null when the header is usable. Shared by
 * the parsers so each file kind words and counts it the same way.
 */
export function unusableHeader(table: CsvTable, required: readonly string[]): { rows: never[]; rejected: Rejection[]; warnings: string[]; totalRows: number } | null {
  if (table.header.length === 0 || table.rejected.some((r) => r.row === 0)) return { rows: [], rejected: [...table.rejected], warnings: [], totalRows: table.totalRows };
  const missing = required.filter((name) => !table.header.includes(name));
  if (missing.length === 0) return null;
  const rejected: Rejection[] = [...table.rejected, { row: 0, line: 1, column: '', reason: `header: required column(s) ${missing.join(', ')} missing` }];
  for (const row of table.rows) rejected.push({ row: row.row, line: row.line, column: '', reason: 'not read: the header is unusable (see row 0)' });
  return { rows: [], rejected, warnings: [], totalRows: table.totalRows };
}
