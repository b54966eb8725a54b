import { csvLine, numberText } from '../archive-folder/folder-text.ts';

/** The value of one cell before it is written: text, a finite number, a flag, or unknown (null). */
export type CellValue = string | number | boolean | null;

/** VOTable datatypes the exports use (VOTable 1.4 §2.1; `char` is written with arraysize="*"). */
export type ExportDatatype = 'char' | 'double' | 'int' | 'boolean';

/**
 * One exported column. `name` carries the unit the values are in (parallaxMas, utcMjd), so a CSV
 * header says it without a separate line; `unit` and `ucd` are the VOTable attributes (`unit` in
 * the IVOA string form, e.g. "mas", "mas/yr"; `ucd` only where an IVOA UCD1+ word fits).
 */
export interface ExportColumn<Row> {
  readonly name: string;
  readonly datatype: ExportDatatype;
  readonly unit?: string;
  readonly ucd?: string;
  readonly description: string;
  readonly value: (row: Row) => CellValue;
}

/**
 * A cell as text: numbers as the shortest decimal that reads back to the same double (ECMAScript
 * Number::toString), flags as true/false, unknown as an empty cell. NaN or ±∞ is refused with the
 * column and row named, since no exported cell may hold one.
 */
export function cellText(value: CellValue, where: string): string {
  if (value === null) return '';
  if (typeof value === 'number') return numberText(value, where);
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  return value;
}

/** The rows as text cells, column by column; `table` names the table in error messages. */
export function textRows<Row>(table: string, columns: readonly ExportColumn<Row>[], rows: readonly Row[]): string[][] {
  return rows.map((row, k) => columns.map((c) => cellText(c.value(row), `${table} row ${k + 1}, column ${c.name}`)));
}

/**
 * An RFC 4180 CSV file of `rows` in `columns`: header first, CRLF after every record (RFC 4180
 * §2.1–2.3), fields with a comma, quote or line break quoted and quotes doubled (§2.6–2.7).
 * Encode the text as UTF-8 (RFC 4180 §3 gives text/csv an optional charset; ours is always UTF-8).
 */
export function writeCsvTable<Row>(table: string, columns: readonly ExportColumn<Row>[], rows: readonly Row[]): string {
  const lines = [csvLine(columns.map((c) => c.name)), ...textRows(table, columns, rows).map(csvLine)];
  return lines.join('\r\n') + '\r\n';
}
