import { parseChoiceCell, parseDateCell, parseNumberCell } from './cells.ts';
import type { CellResult } from './cells.ts';
import { readCsvTable } from './csv-table.ts';
import type { TableRow } from './csv-table.ts';
import type { ParseResult, Rejection } from './parse-result.ts';
import { analyseTransitLogHeader } from './transit-log-columns.ts';
import type { TransitLogLayout } from './transit-log-columns.ts';
import { parseUtcCell, utcCountS } from './utc-instant.ts';
import type { UtcInstant } from './utc-instant.ts';

/** Wire times of one transit: wire index 0-based (file wire number − 1). */
export type TransitTimes =
  | { readonly kind: 'utc'; readonly wires: readonly { readonly wireIndex: number; readonly utc: UtcInstant }[] }
  | { readonly kind: 'clock'; readonly wires: readonly { readonly wireIndex: number; readonly clockS: number }[] };

/** One accepted transit row. Optional cells that were empty are null. */
export interface TransitLogRow {
  readonly row: number;
  readonly line: number;
  readonly starId: string;
  readonly culmination: 'upper' | 'lower';
  readonly clamp: 'east' | 'west' | 'none';
  readonly nightDateMjd: number | null;
  readonly instrumentId: string | null;
  readonly observer: string | null;
  readonly times: TransitTimes;
  readonly zenithReading: { readonly unit: 'turns' | 'px' | 'deg'; readonly value: number } | null;
  readonly temperatureC: number | null;
  readonly pressureHpa: number | null;
  readonly humidityPercent: number | null;
  readonly weight: number;
  readonly flags: readonly TransitFlag[];
  readonly note: string;
}

export const TRANSIT_FLAGS = ['user-rejected', 'doubtful', 'cloud', 'wind', 'poor-seeing', 'bright-sky', 'reversed-mid-transit'] as const;
export type TransitFlag = (typeof TRANSIT_FLAGS)[number];

/** What the parser checks rows against; each check is skipped (with a warning) when its input is absent. */
export interface TransitLogOptions {
  readonly fileName: string;
  readonly knownStarIds?: ReadonlySet<string>;
  readonly nightUtc?: { readonly start: UtcInstant; readonly end: UtcInstant };
  readonly nightClockS?: { readonly start: number; readonly end: number };
}

type Problems = { column: string; reason: string }[];

function cell(row: TableRow, name: string): string {
  return row.cells.get(name) ?? '';
}

function take<T>(result: CellResult<T>, column: string, problems: Problems): T | null {
  if (result.ok) return result.value;
  problems.push({ column, reason: result.reason });
  return null;
}

function optionalNumber(row: TableRow, name: string, unit: string, min: number, max: number, problems: Problems): number | null {
  const text = cell(row, name);
  return text.trim() === '' ? null : take(parseNumberCell(text, unit, min, max), name, problems);
}

function parseTimes(row: TableRow, layout: TransitLogLayout, options: TransitLogOptions, problems: Problems): TransitTimes | null {
  const entries: { wireIndex: number; text: string; column: string }[] = [];
  if (layout.listColumn !== null) {
    cell(row, layout.listColumn).split(';').forEach((text, k) => entries.push({ wireIndex: k, text, column: layout.listColumn! }));
  } else {
    for (const w of layout.wireColumns) entries.push({ wireIndex: w.wireNumber - 1, text: cell(row, w.name), column: w.name });
  }
  const present = entries.filter((e) => e.text.trim() !== '');
  if (present.length === 0) {
    problems.push({ column: layout.listColumn ?? layout.wireColumns[0]?.name ?? '', reason: 'no wire time in this row; give at least one' });
    return null;
  }
  const count = problems.length;
  if (layout.timeKind === 'utc') {
    const wires = present.flatMap((e) => {
      const utc = take(parseUtcCell(e.text), e.column, problems);
      if (utc && options.nightUtc && (utcCountS(utc) < utcCountS(options.nightUtc.start) || utcCountS(utc) > utcCountS(options.nightUtc.end))) {
        problems.push({ column: e.column, reason: `time '${e.text.trim()}' is outside the night's window; check the date or the night` });
      }
      return utc ? [{ wireIndex: e.wireIndex, utc }] : [];
    });
    return problems.length > count ? null : { kind: 'utc', wires };
  }
  const wires = present.flatMap((e) => {
    const clockS = take(parseNumberCell(e.text, 'clock seconds', -86_400, 172_800), e.column, problems);
    if (clockS !== null && options.nightClockS && (clockS < options.nightClockS.start || clockS > options.nightClockS.end)) {
      problems.push({ column: e.column, reason: `clock time ${clockS} s is outside the night's window [${options.nightClockS.start}, ${options.nightClockS.end}] s` });
    }
    return clockS !== null ? [{ wireIndex: e.wireIndex, clockS }] : [];
  });
  return problems.length > count ? null : { kind: 'clock', wires };
}

function parseZenith(row: TableRow, problems: Problems): TransitLogRow['zenithReading'] {
  const readings = [
    ['micrometerTurns', 'turns', -1e6, 1e6],
    ['offsetPx', 'px', -1e6, 1e6],
    ['zenithDistanceDeg', 'deg', 0, 90],
  ] as const;
  const given = readings.filter(([name]) => cell(row, name).trim() !== '');
  if (given.length > 1) {
    problems.push({ column: given[1][0], reason: `more than one zenith-distance reading (${given.map((g) => g[0]).join(', ')}); give one per row` });
    return null;
  }
  if (given.length === 0) return null;
  const [name, unit, min, max] = given[0];
  const value = take(parseNumberCell(cell(row, name), unit === 'deg' ? 'degrees of zenith distance' : unit, min, max), name, problems);
  return value === null ? null : { unit, value };
}

function parseFlags(row: TableRow, problems: Problems): TransitFlag[] {
  const text = cell(row, 'flags').trim();
  if (text === '') return [];
  const flags = text.split(';').map((f) => f.trim());
  const unknown = flags.filter((f) => !(TRANSIT_FLAGS as readonly string[]).includes(f));
  if (unknown.length > 0) problems.push({ column: 'flags', reason: `unknown flag(s) ${unknown.join(', ')}; known: ${TRANSIT_FLAGS.join(', ')}` });
  return flags.filter((f): f is TransitFlag => (TRANSIT_FLAGS as readonly string[]).includes(f));
}

function parseRow(row: TableRow, layout: TransitLogLayout, options: TransitLogOptions, problems: Problems): TransitLogRow | null {
  const starId = cell(row, 'starId').trim();
  if (starId === '') problems.push({ column: 'starId', reason: 'empty star id' });
  else if (options.knownStarIds && !options.knownStarIds.has(starId)) problems.push({ column: 'starId', reason: `unknown star id '${starId}'; add it to the star list or correct the id` });
  const culmination = take(parseChoiceCell(cell(row, 'culmination'), ['upper', 'lower'] as const), 'culmination', problems);
  const clampText = cell(row, 'clamp').trim();
  const clamp = clampText === '' ? 'none' : take(parseChoiceCell(clampText, ['east', 'west', 'none'] as const), 'clamp', problems);
  const dateText = cell(row, 'nightDate').trim();
  const nightDateMjd = dateText === '' ? null : take(parseDateCell(dateText), 'nightDate', problems);
  const times = parseTimes(row, layout, options, problems);
  const zenithReading = parseZenith(row, problems);
  const temperatureC = optionalNumber(row, 'temperatureC', '°C', -90, 60, problems);
  const pressureHpa = optionalNumber(row, 'pressureHpa', 'hPa', 300, 1100, problems);
  const humidityPercent = optionalNumber(row, 'humidityPercent', '%', 0, 100, problems);
  const weight = optionalNumber(row, 'weight', '(relative weight)', 0, 1e6, problems);
  if (weight === 0) problems.push({ column: 'weight', reason: 'weight 0; flag the transit user-rejected instead' });
  const flags = parseFlags(row, problems);
  if (problems.length > 0 || culmination === null || clamp === null || times === null) return null;
  const text = (name: string): string | null => (cell(row, name).trim() === '' ? null : cell(row, name).trim());
  return {
    row: row.row, line: row.line, starId, culmination, clamp, nightDateMjd, instrumentId: text('instrumentId'), observer: text('observer'),
    times, zenithReading, temperatureC, pressureHpa, humidityPercent, weight: weight ?? 1, flags, note: cell(row, 'note'),
  };
}

/** First wire time on one count of seconds; clock seconds count from 0 h of the row's night date. */
function firstTimeS(row: TransitLogRow): number {
  const times = row.times;
  return times.kind === 'utc' ? utcCountS(times.wires[0].utc) : times.wires[0].clockS + (row.nightDateMjd ?? 0) * 86_400;
}

const HALF_DAY_S = 43_200;

/**
 * Accepted rows by star, culmination and instrument, in half-day buckets of their first wire
 * time, so that finding an earlier row within half a day looks at three buckets instead of every
 * earlier row of that star (the list scan made a 1,000,000-row log quadratic).
 */
class EarlierTransits {
  /** Star, culmination and instrument → half-day bucket number → rows in file order. */
  readonly #byTransit = new Map<string, Map<number, TransitLogRow[]>>();

  #bucketsOf(row: TransitLogRow): Map<number, TransitLogRow[]> {
    const key = `${row.starId}\u0000${row.culmination}\u0000${row.instrumentId ?? ''}`;
    let buckets = this.#byTransit.get(key);
    if (buckets === undefined) this.#byTransit.set(key, (buckets = new Map()));
    return buckets;
  }

  add(row: TransitLogRow): void {
    const buckets = this.#bucketsOf(row);
    const bucket = Math.floor(firstTimeS(row) / HALF_DAY_S);
    const list = buckets.get(bucket);
    if (list === undefined) buckets.set(bucket, [row]);
    else list.push(row);
  }

  /** The earliest accepted row (in file order) less than half a day from `row`, if any. */
  firstWithinHalfDay(row: TransitLogRow): TransitLogRow | undefined {
    const buckets = this.#bucketsOf(row);
    const timeS = firstTimeS(row);
    const bucket = Math.floor(timeS / HALF_DAY_S);
    let first: TransitLogRow | undefined;
    for (let b = bucket - 1; b <= bucket + 1; b++) {
      for (const earlier of buckets.get(b) ?? []) {
        if (Math.abs(firstTimeS(earlier) - timeS) < HALF_DAY_S && (first === undefined || earlier.row < first.row)) first = earlier;
      }
    }
    return first;
  }
}

/**
 * Parses a transit log CSV (bytes, UTF-8; layout in FORMATS.md) into typed rows. Every row is
 * checked: numbers per column with the unit of its header, impossible angles and weather, times
 * outside the night (when a window is given), unknown star ids (when the star list is given) and
 * duplicate transits (same star, culmination and instrument within half a day: the later row is
 * rejected). Unknown columns produce a warning that lists them.
 */
export function parseTransitLog(bytes: Uint8Array, options: TransitLogOptions): ParseResult<TransitLogRow> {
  const table = readCsvTable(bytes, options.fileName);
  const rejected: Rejection[] = [...table.rejected];
  const warnings: string[] = [];
  if (table.header.length === 0 || table.rejected.some((r) => r.row === 0)) return { rows: [], rejected, warnings, totalRows: table.totalRows };
  const layout = analyseTransitLogHeader(table.header);
  if ('problem' in layout) {
    rejected.push({ row: 0, line: 1, column: '', reason: `header: ${layout.problem}` });
    for (const row of table.rows) rejected.push({ row: row.row, line: row.line, column: '', reason: 'not read: the header is unusable (see row 0)' });
    return { rows: [], rejected, warnings, totalRows: table.totalRows };
  }
  if (layout.unknownColumns.length > 0) warnings.push(`${options.fileName}: unknown column(s) ignored: ${layout.unknownColumns.join(', ')}`);
  if (!options.knownStarIds) warnings.push(`${options.fileName}: star ids not checked (no star list given)`);
  if (layout.timeKind === 'utc' ? !options.nightUtc : !options.nightClockS) warnings.push(`${options.fileName}: times not checked against the night's window (none given)`);
  const rows: TransitLogRow[] = [];
  const seen = new EarlierTransits();
  for (const tableRow of table.rows) {
    const problems: Problems = [];
    const parsed = parseRow(tableRow, layout, options, problems);
    if (parsed) {
      const earlier = seen.firstWithinHalfDay(parsed);
      if (earlier) problems.push({ column: 'starId', reason: `duplicate of row ${earlier.row} (same star, culmination and instrument within half a day)` });
      else {
        rows.push(parsed);
        seen.add(parsed);
      }
    }
    for (const p of problems) rejected.push({ row: tableRow.row, line: tableRow.line, column: p.column, reason: p.reason });
  }
  return { rows, rejected, warnings, totalRows: table.totalRows };
}
