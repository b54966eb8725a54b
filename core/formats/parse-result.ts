/**
 * One problem found while reading a file. `row` is the 1-based data row (the header is row 0;
 * row 0 also carries file-level problems such as invalid UTF-8 or a bad header), `line` the
 * 1-based physical line where that row starts (0 when the format has no lines, e.g. a JSON path
 * locates the problem instead), `column` the header name or JSON pointer ('' when the whole row
 * or file is concerned) and `reason` what is wrong and how to fix it.
 */
export interface Rejection {
  readonly row: number;
  readonly line: number;
  readonly column: string;
  readonly reason: string;
}

/**
 * Every parser returns this. `rows` holds the rows that passed every check; a row with any
 * problem is absent from `rows` and has one or more entries in `rejected`, so
 * rows.length + (distinct rejected rows ≥ 1) = totalRows. Nothing is half-processed: the caller
 * either takes the file whole (acceptWhole) or takes the valid rows and shows the rejections.
 */
export interface ParseResult<T> {
  readonly rows: readonly T[];
  readonly rejected: readonly Rejection[];
  readonly warnings: readonly string[];
  readonly totalRows: number;
}

/** The rows if the file is clean (no rejection at all), otherwise null: all-or-nothing import. */
export function acceptWhole<T>(result: ParseResult<T>): readonly T[] | null {
  return result.rejected.length === 0 ? result.rows : null;
}

/** Rejections formatted one per line as "file: row R (line L), column C: reason". */
export function describeRejections(fileName: string, rejected: readonly Rejection[]): string[] {
  return rejected.map((r) => `${fileName}: row ${r.row} (line ${r.line})${r.column ? `, column ${r.column}` : ''}: ${r.reason}`);
}
