/** One CSV record: its fields and the 1-based physical line where it starts. */
export interface CsvRecord {
  readonly fields: readonly string[];
  readonly line: number;
}

/** A record that could not be read; `field` is the 1-based field index. */
export interface CsvProblem {
  readonly line: number;
  readonly field: number;
  readonly reason: string;
}

/** The records read, in order, and the malformed ones (which are not in `records`). */
export interface CsvReadResult {
  readonly records: readonly CsvRecord[];
  /** Malformed records, in the same order as they occur (their position among all records is `recordIndex`). */
  readonly problems: readonly (CsvProblem & { readonly recordIndex: number })[];
}

/**
 * Reads RFC 4180 CSV text: fields separated by commas, records by CRLF, LF or a lone CR; a
 * field in double quotes may contain commas, line breaks and doubled quotes (""). Lines that are
 * entirely empty are skipped (common practice; RFC 4180 would read a record with one empty
 * field). A malformed record — a quote inside an unquoted field, text after a closing quote, or a
 * quote left open at the end of the file — is reported with its line and field and reading
 * resumes at the next line break. Fields are not trimmed.
 */
export function readCsv(text: string): CsvReadResult {
  const records: CsvRecord[] = [];
  const problems: (CsvProblem & { recordIndex: number })[] = [];
  let i = 0;
  let line = 1;
  let recordIndex = 0;
  const n = text.length;
  const isBreak = (k: number): boolean => text[k] === '\n' || text[k] === '\r';
  const skipBreak = (): void => {
    if (text[i] === '\r' && text[i + 1] === '\n') i += 2;
    else i += 1;
    line += 1;
  };
  while (i < n) {
    if (isBreak(i)) {
      skipBreak();
      continue;
    }
    const startLine = line;
    const fields: string[] = [];
    let problem: CsvProblem | null = null;
    let field = '';
    // One record: loop over fields until a line break outside quotes or the end of the text.
    for (;;) {
      if (text[i] === '"') {
        i += 1;
        const openedLine = line;
        let closed = false;
        while (i < n) {
          const ch = text[i];
          if (ch === '"') {
            if (text[i + 1] === '"') {
              field += '"';
              i += 2;
              continue;
            }
            i += 1;
            closed = true;
            break;
          }
          if (ch === '\r' || ch === '\n') {
            const crlf = ch === '\r' && text[i + 1] === '\n';
            field += crlf ? '\r\n' : ch;
            i += crlf ? 2 : 1;
            line += 1;
            continue;
          }
          field += ch;
          i += 1;
        }
        if (!closed) {
          problem = { line: openedLine, field: fields.length + 1, reason: `a quoted field opened on line ${openedLine} is never closed; add the closing double quote (everything after it was read as this field)` };
          break;
        }
        if (i < n && text[i] !== ',' && !isBreak(i)) {
          problem = { line, field: fields.length + 1, reason: `text after the closing quote of field ${fields.length + 1}; put the whole field inside the quotes` };
          break;
        }
      } else {
        while (i < n && text[i] !== ',' && !isBreak(i)) {
          if (text[i] === '"') {
            problem = { line, field: fields.length + 1, reason: `a double quote inside unquoted field ${fields.length + 1}; quote the whole field and double the inner quotes ("")` };
            break;
          }
          field += text[i];
          i += 1;
        }
        if (problem) break;
      }
      fields.push(field);
      field = '';
      if (i < n && text[i] === ',') {
        i += 1;
        continue;
      }
      break;
    }
    if (problem) {
      problems.push({ ...problem, recordIndex });
      while (i < n && !isBreak(i)) i += 1;
    } else {
      records.push({ fields, line: startLine });
    }
    recordIndex += 1;
    if (i < n) skipBreak();
  }
  return { records, problems };
}
