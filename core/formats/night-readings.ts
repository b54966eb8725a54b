import { parseDateCell, parseNumberCell } from './cells.ts';
import { readCsvTable, unusableHeader } from './csv-table.ts';
import type { TableRow } from './csv-table.ts';
import type { ParseResult, Rejection } from './parse-result.ts';
import { isWithinNightWindow } from './night-window.ts';
import { parseUtcCell } from './utc-instant.ts';
import type { UtcInstant } from './utc-instant.ts';

/**
 * One reading of a night's instrument constants taken at the telescope: the striding level's
 * inclination of the axis (arcsec, west end high positive) and/or the collimation error from a
 * collimator or a reversal (arcsec, line of sight east of the normal positive), at UTC `utc`, on
 * the night that began on the local date `nightDateMjd`. Unknown values are null; a row has at least one.
 */
export interface NightReadingRow {
  readonly row: number;
  readonly line: number;
  readonly nightDateMjd: number;
  readonly instrumentId: string | null;
  readonly utc: UtcInstant;
  readonly levelArcsec: number | null;
  readonly collimationArcsec: number | null;
}

const REQUIRED = ['nightDate', 'utc'] as const;
const VALUES = ['levelArcsec', 'collimationArcsec'] as const;
const KNOWN = new Set<string>([...REQUIRED, ...VALUES, 'instrumentId']);
/** Common practice: a transit instrument is levelled and collimated to a few arcseconds; 10′ means a unit or sign slip. */
const LIMIT_ARCSEC = 600;

type Problems = { column: string; reason: string }[];

function parseReading(row: TableRow, present: readonly string[], problems: Problems): NightReadingRow | null {
  const get = (name: string): string => row.cells.get(name) ?? '';
  const date = parseDateCell(get('nightDate'));
  if (!date.ok) problems.push({ column: 'nightDate', reason: date.reason });
  const utc = parseUtcCell(get('utc'));
  if (!utc.ok) problems.push({ column: 'utc', reason: utc.reason });
  const values: Record<string, number | null> = { levelArcsec: null, collimationArcsec: null };
  for (const name of present) {
    if (get(name).trim() === '') continue;
    const value = parseNumberCell(get(name), 'arcseconds', -LIMIT_ARCSEC, LIMIT_ARCSEC);
    if (value.ok) values[name] = value.value; else problems.push({ column: name, reason: value.reason });
  }
  if (!date.ok || !utc.ok || problems.length > 0) return null;
  if (values.levelArcsec === null && values.collimationArcsec === null) {
    problems.push({ column: present[0], reason: `no reading: give ${present.join(' or ')}` });
    return null;
  }
  if (!isWithinNightWindow(utc.value, date.value)) {
    problems.push({ column: 'utc', reason: `reading time '${get('utc').trim()}' is more than a day away from the night ${get('nightDate').trim()}; check the date` });
    return null;
  }
  const instrumentId = get('instrumentId').trim();
  return {
    row: row.row, line: row.line, nightDateMjd: date.value, instrumentId: instrumentId === '' ? null : instrumentId, utc: utc.value,
    levelArcsec: values.levelArcsec, collimationArcsec: values.collimationArcsec,
  };
}

/**
 * Parses a night-readings CSV (layout in core/reduction/NIGHT.md): required `nightDate`
 * (YYYY-MM-DD) and `utc` (ISO 8601 with Z), at least one of `levelArcsec`, `collimationArcsec`
 * (|value| ≤ 600″), optional `instrumentId` (empty: every instrument of the night). Same result
 * shape and row/column rejections as the other parsers (parse-result.ts).
 */
export function parseNightReadings(bytes: Uint8Array, fileName: string): ParseResult<NightReadingRow> {
  const table = readCsvTable(bytes, fileName);
  const unusable = unusableHeader(table, REQUIRED);
  if (unusable !== null) return unusable;
  const present = VALUES.filter((name) => table.header.includes(name));
  const rejected: Rejection[] = [...table.rejected];
  if (present.length === 0) {
    rejected.push({ row: 0, line: 1, column: '', reason: `header: no reading column; give ${VALUES.join(' or ')}` });
    for (const row of table.rows) rejected.push({ row: row.row, line: row.line, column: '', reason: 'not read: the header is unusable (see row 0)' });
    return { rows: [], rejected, warnings: [], totalRows: table.totalRows };
  }
  const unknown = table.header.filter((name) => !KNOWN.has(name));
  const warnings = unknown.length > 0 ? [`${fileName}: unknown column(s) ignored: ${unknown.join(', ')}`] : [];
  const rows: NightReadingRow[] = [];
  for (const tableRow of table.rows) {
    const problems: Problems = [];
    const parsed = parseReading(tableRow, present, problems);
    if (parsed) rows.push(parsed);
    for (const p of problems) rejected.push({ row: tableRow.row, line: tableRow.line, column: p.column, reason: p.reason });
  }
  return { rows, rejected, warnings, totalRows: table.totalRows };
}
