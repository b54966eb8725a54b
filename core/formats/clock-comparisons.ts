import { parseDateCell, parseNumberCell } from './cells.ts';
import { readCsvTable, unusableHeader } from './csv-table.ts';
import type { TableRow } from './csv-table.ts';
import type { ParseResult, Rejection } from './parse-result.ts';
import { isWithinNightWindow } from './night-window.ts';
import { parseUtcCell, utcCountS } from './utc-instant.ts';
import type { UtcInstant } from './utc-instant.ts';

/**
 * One comparison of an observatory clock with a time signal: at UTC `utc` (as the signal gave
 * it) the clock read `clockS` seconds, counted from 0 h of the clock on the local date
 * `nightDateMjd` (may exceed 86 400 after midnight, like the transit log's clock columns).
 */
export interface ClockComparisonRow {
  readonly row: number;
  readonly line: number;
  readonly nightDateMjd: number;
  readonly instrumentId: string | null;
  readonly utc: UtcInstant;
  readonly clockS: number;
  /** Name of the signal (radio time signal, GNSS receiver, NTP server …); '' when not given. */
  readonly signal: string;
}

const REQUIRED = ['nightDate', 'utc', 'clockS'] as const;
const KNOWN = new Set<string>([...REQUIRED, 'instrumentId', 'signal']);

type Problems = { column: string; reason: string }[];

function parseComparison(row: TableRow, problems: Problems): ClockComparisonRow | null {
  const get = (name: string): string => row.cells.get(name) ?? '';
  const date = parseDateCell(get('nightDate'));
  if (!date.ok) problems.push({ column: 'nightDate', reason: date.reason });
  const utc = parseUtcCell(get('utc'));
  if (!utc.ok) problems.push({ column: 'utc', reason: utc.reason });
  const clock = parseNumberCell(get('clockS'), 'clock seconds', -86_400, 172_800);
  if (!clock.ok) problems.push({ column: 'clockS', reason: clock.reason });
  if (!date.ok || !utc.ok || !clock.ok) return null;
  if (!isWithinNightWindow(utc.value, date.value)) {
    problems.push({ column: 'utc', reason: `signal time '${get('utc').trim()}' is more than a day away from the night ${get('nightDate').trim()}; check the date` });
    return null;
  }
  const instrumentId = get('instrumentId').trim();
  return {
    row: row.row, line: row.line, nightDateMjd: date.value, instrumentId: instrumentId === '' ? null : instrumentId,
    utc: utc.value, clockS: clock.value, signal: get('signal').trim(),
  };
}

/**
 * Parses a clock-comparisons CSV (layout in core/reduction/NIGHT.md): required `nightDate`
 * (YYYY-MM-DD), `utc` (ISO 8601 with Z) and `clockS`; optional `instrumentId` and `signal`.
 * Same result shape and row/column rejections as the other parsers (parse-result.ts); a second
 * comparison with the same night, instrument and UTC is rejected as a duplicate.
 */
export function parseClockComparisons(bytes: Uint8Array, fileName: string): ParseResult<ClockComparisonRow> {
  const table = readCsvTable(bytes, fileName);
  const unusable = unusableHeader(table, REQUIRED);
  if (unusable !== null) return unusable;
  const rejected: Rejection[] = [...table.rejected];
  const warnings: string[] = [];
  const unknown = table.header.filter((name) => !KNOWN.has(name));
  if (unknown.length > 0) warnings.push(`${fileName}: unknown column(s) ignored: ${unknown.join(', ')}`);
  const rows: ClockComparisonRow[] = [];
  const seen = new Map<string, number>();
  for (const tableRow of table.rows) {
    const problems: Problems = [];
    const parsed = parseComparison(tableRow, problems);
    if (parsed) {
      const key = `${parsed.nightDateMjd}\u0000${parsed.instrumentId ?? ''}\u0000${utcCountS(parsed.utc)}`;
      const earlier = seen.get(key);
      if (earlier !== undefined) problems.push({ column: 'utc', reason: `duplicate of row ${earlier} (same night, instrument and signal time)` });
      else {
        seen.set(key, parsed.row);
        rows.push(parsed);
      }
    }
    for (const p of problems) rejected.push({ row: tableRow.row, line: tableRow.line, column: p.column, reason: p.reason });
  }
  return { rows, rejected, warnings, totalRows: table.totalRows };
}
