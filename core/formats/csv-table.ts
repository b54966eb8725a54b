import { readCsv } from './csv.ts';
import type { Rejection } from './parse-result.ts';
import { decodeUtf8 } from './utf8.ts';

/** One data row of a CSV table: 1-based data row number, its physical line and cells by column. */
export interface TableRow {
  readonly row: number;
  readonly line: number;
  readonly cells: ReadonlyMap<string, string>;
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
  // Restore file order: problems carry their record index; good records fill the other places.
  const ordered: ({ kind: 'ok'; fields: readonly string[]; line: number } | { kind: 'bad'; line: number; field: number; reason: string })[] = [];
  let good = 0;
  const problemByIndex = new Map(problems.map((p) => [p.recordIndex, p]));
  for (let index = 0; index < records.length + problems.length; index++) {
    const p = problemByIndex.get(index);
    if (p) ordered.push({ kind: 'bad', line: p.line, field: p.field, reason: p.reason });
    else {
      const r = records[good++];
      ordered.push({ kind: 'ok', fields: r.fields, line: r.line });
    }
  }
  if (ordered.length === 0) return { header: [], rows: [], rejected: [{ row: 0, line: 1, column: '', reason: `${fileName}: the file is empty; the first line must be the header` }], totalRows: 0 };
  const totalRows = ordered.length - 1;
  const rejected: Rejection[] = [];
  const headerEntry = ordered[0];
  let headerProblem: string | null = null;
  let header: string[] = [];
  if (headerEntry.kind === 'bad') headerProblem = `the header is malformed: ${headerEntry.reason}`;
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
  const rows: TableRow[] = [];
  for (let row = 1; row < ordered.length; row++) {
    const entry = ordered[row];
    if (entry.kind === 'bad') {
      rejected.push({ row, line: entry.line, column: header[entry.field - 1] ?? `field ${entry.field}`, reason: entry.reason });
    } else if (entry.fields.length !== header.length) {
      rejected.push({ row, line: entry.line, column: '', reason: `${entry.fields.length} fields but the header has ${header.length}; quote fields that contain commas` });
    } else {
      const cells = new Map<string, string>();
      for (let i = 0; i < header.length; i++) cells.set(header[i], entry.fields[i]);
      rows.push({ row, line: entry.line, cells });
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
