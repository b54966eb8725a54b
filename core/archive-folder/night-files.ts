import type { ClockComparison, CollimationReading, LevelReading, NightQuality, NightRecord, WeatherReading } from '../archive/records.ts';
import { parseChoiceCell, parseDateCell, parseNumberCell, type CellResult } from '../formats/cells.ts';
import { readCsvTable, type TableRow } from '../formats/csv-table.ts';
import { parseClockComparisons, type ClockComparisonRow } from '../formats/clock-comparisons.ts';
import { parseUtcCell, type UtcInstant, utcCountS } from '../formats/utc-instant.ts';
import { csvFile, dateMjd, dateText, type FolderRejection, numberText, secondsText, utcInstantMjd, utcText } from './folder-text.ts';

export const NIGHT_HEADER = ['id', 'instrumentId', 'siteId', 'localDate', 'observer', 'temperatureC', 'pressureHpa', 'humidityPercent', 'quality', 'note'];
export const CLOCK_HEADER = ['nightDate', 'instrumentId', 'utc', 'clockS', 'signal'];
export const LEVEL_HEADER = ['nightId', 'utc', 'levelArcsec'];
export const COLLIMATION_HEADER = ['nightId', 'utc', 'collimationArcsec'];

/** The four night tables (FOLDER.md): nights, clock comparisons, level and collimation readings. */
export function writeNightFiles(nights: readonly NightRecord[]): { nights: string; clock: string; level: string; collimation: string } {
  const sorted = [...nights].sort((a, b) => (a.localDate < b.localDate ? -1 : a.localDate > b.localDate ? 1 : a.instrumentId < b.instrumentId ? -1 : 1));
  const n = (value: number, night: NightRecord) => numberText(value, `night ${night.id}`);
  return {
    nights: csvFile(NIGHT_HEADER, sorted.map((night) => [
      night.id, night.instrumentId, night.siteId, night.localDate, night.observer,
      night.weather === null ? '' : n(night.weather.temperatureC, night), night.weather === null ? '' : n(night.weather.pressureHpa, night),
      night.weather === null ? '' : n(night.weather.relativeHumidityPercent, night), night.quality, night.note,
    ])),
    clock: csvFile(CLOCK_HEADER, sorted.flatMap((night) => night.clockComparisons.map((c) => clockCells(c, night)))),
    level: csvFile(LEVEL_HEADER, sorted.flatMap((night) => night.levelReadings.map((r) => [night.id, utcText(r.utcMjd), n(r.levelArcsec, night)]))),
    collimation: csvFile(COLLIMATION_HEADER, sorted.flatMap((night) => night.collimationReadings.map((r) => [night.id, utcText(r.utcMjd), n(r.collimationArcsec, night)]))),
  };
}

/** The clock-comparisons file's cells of one comparison (H4's format: the clock's reading at a signal time). */
function clockCells(c: ClockComparison, night: NightRecord): string[] {
  const day = dateMjd(night.localDate);
  return [night.localDate, night.instrumentId, utcText(c.utcMjd), secondsText(c.utcMjd + c.clockMinusUtcS / 86_400, day), c.signal];
}

/** A parsed clock-comparisons row (core/formats/clock-comparisons.ts) as the night record stores it. */
export function clockComparisonOfRow(row: ClockComparisonRow): ClockComparison {
  return comparisonFromCells(row.utc, row.clockS, row.nightDateMjd, row.signal);
}

/** A comparison from the file's cells: clock − UTC = clock seconds − UTC seconds, both from 0 h of the night date. */
function comparisonFromCells(utc: UtcInstant, clockS: number, nightDateMjd: number, signal: string): ClockComparison {
  return { utcMjd: utcInstantMjd(utc), clockMinusUtcS: clockS - (utcCountS(utc) - nightDateMjd * 86_400), signal };
}

/**
 * A comparison as it reads back from the file (times to 10 µs): what a writer of records that
 * must round-trip exactly (the simulator) stores.
 */
export function canonicalClockComparison(c: ClockComparison, localDate: string): ClockComparison {
  const day = dateMjd(localDate);
  const utc = parseUtcCell(utcText(c.utcMjd));
  if (!utc.ok) throw new RangeError(`canonicalClockComparison: ${utc.reason}`);
  return comparisonFromCells(utc.value, Number(secondsText(c.utcMjd + c.clockMinusUtcS / 86_400, day)), day, c.signal.trim());
}

type Problems = { column: string; reason: string }[];

/** Reads one table of ours: header check, then `parse` per row; every problem becomes a rejection. */
function readTable<T>(bytes: Uint8Array, file: string, header: readonly string[], required: readonly string[], parse: (row: TableRow, problems: Problems) => T | null) {
  const table = readCsvTable(bytes, file);
  const rejected: FolderRejection[] = table.rejected.map((r) => ({ file, ...r }));
  const rows: T[] = [];
  const warnings: string[] = [];
  if (table.header.length === 0 || table.rejected.some((r) => r.row === 0)) return { rows, rejected, warnings };
  const missing = required.filter((name) => !table.header.includes(name));
  if (missing.length > 0) {
    rejected.push({ file, row: 0, line: 1, column: '', reason: `header: required column(s) ${missing.join(', ')} missing; the header is ${header.join(',')}` });
    return { rows, rejected, warnings };
  }
  const unknown = table.header.filter((name) => !header.includes(name));
  if (unknown.length > 0) warnings.push(`${file}: unknown column(s) ignored: ${unknown.join(', ')}`);
  for (const row of table.rows) {
    const problems: Problems = [];
    const value = parse(row, problems);
    for (const p of problems) rejected.push({ file, row: row.row, line: row.line, column: p.column, reason: p.reason });
    if (value !== null && problems.length === 0) rows.push(value);
  }
  return { rows, rejected, warnings };
}

function cellOf(row: TableRow, problems: Problems) {
  const text = (name: string): string => row.cells.get(name) ?? '';
  const take = <T>(name: string, result: CellResult<T>): T | null => {
    if (result.ok) return result.value;
    problems.push({ column: name, reason: result.reason });
    return null;
  };
  const number = (name: string, unit: string, min: number, max: number) => take(name, parseNumberCell(text(name), unit, min, max));
  const required = (name: string): string => {
    const value = text(name).trim();
    if (value === '') problems.push({ column: name, reason: `empty ${name}; every row needs one` });
    return value;
  };
  return { text, take, number, required };
}

function parseNight(row: TableRow, problems: Problems, audit: { createdUtc: string }): NightRecord | null {
  const c = cellOf(row, problems);
  const id = c.required('id'), instrumentId = c.required('instrumentId'), siteId = c.required('siteId');
  const localDate = c.required('localDate');
  if (localDate !== '') c.take('localDate', parseDateCell(localDate));
  const given = ['temperatureC', 'pressureHpa', 'humidityPercent'].filter((name) => c.text(name).trim() !== '');
  let weather: WeatherReading | null = null;
  if (given.length === 3) {
    const temperatureC = c.number('temperatureC', '°C', -90, 60), pressureHpa = c.number('pressureHpa', 'hPa', 300, 1100);
    const relativeHumidityPercent = c.number('humidityPercent', '%', 0, 100);
    if (temperatureC !== null && pressureHpa !== null && relativeHumidityPercent !== null) weather = { temperatureC, pressureHpa, relativeHumidityPercent };
  } else if (given.length > 0) {
    problems.push({ column: given[0], reason: 'the night weather needs temperatureC, pressureHpa and humidityPercent together (or none of them)' });
  }
  const quality = c.take('quality', parseChoiceCell<NightQuality>(c.text('quality'), ['good', 'fair', 'poor']));
  if (problems.length > 0 || quality === null) return null;
  return {
    id, siteId, instrumentId, localDate, observer: c.text('observer'), weather, clockComparisons: [], levelReadings: [], collimationReadings: [],
    quality, note: c.text('note'), visibility: 'visible', createdUtc: audit.createdUtc, updatedUtc: audit.createdUtc,
  };
}

function parseTimed<T>(row: TableRow, problems: Problems, known: ReadonlySet<string>, build: (c: ReturnType<typeof cellOf>, utcMjd: number) => T | null): { nightId: string; value: T } | null {
  const c = cellOf(row, problems);
  const nightId = c.required('nightId');
  if (nightId !== '' && !known.has(nightId)) problems.push({ column: 'nightId', reason: `no night '${nightId}' in nights.csv; add the night or correct the id` });
  const utc = c.take('utc', parseUtcCell(c.text('utc')));
  if (utc === null) return null;
  const value = build(c, utcInstantMjd(utc));
  return value === null ? null : { nightId, value };
}

/** Reads the four night tables; readings are attached to their nights in file order. */
export function readNightFiles(files: { nights: Uint8Array; clock?: Uint8Array; level?: Uint8Array; collimation?: Uint8Array }, names: { nights: string; clock: string; level: string; collimation: string }, audit: { createdUtc: string }) {
  const nightTable = readTable(files.nights, names.nights, NIGHT_HEADER, ['id', 'instrumentId', 'siteId', 'localDate', 'quality'], (row, p) => parseNight(row, p, audit));
  const rejected = [...nightTable.rejected];
  const warnings = [...nightTable.warnings];
  const byId = new Map<string, { night: NightRecord; clock: ClockComparison[]; level: LevelReading[]; collimation: CollimationReading[] }>();
  for (const night of nightTable.rows) {
    if (byId.has(night.id)) rejected.push({ file: names.nights, row: 0, line: 0, column: 'id', reason: `duplicate night id '${night.id}'` });
    else byId.set(night.id, { night, clock: [], level: [], collimation: [] });
  }
  const known = new Set(byId.keys());
  const attach = <T>(bytes: Uint8Array | undefined, file: string, header: readonly string[], build: (c: ReturnType<typeof cellOf>, utcMjd: number) => T | null, into: (entry: { clock: ClockComparison[]; level: LevelReading[]; collimation: CollimationReading[] }, value: T) => void) => {
    if (bytes === undefined) return;
    const table = readTable(bytes, file, header, header.slice(0, 3), (row, p) => parseTimed(row, p, known, build));
    rejected.push(...table.rejected);
    warnings.push(...table.warnings);
    for (const { nightId, value } of table.rows) into(byId.get(nightId)!, value);
  };
  if (files.clock !== undefined) {
    const parsed = parseClockComparisons(files.clock, names.clock);
    rejected.push(...parsed.rejected.map((r) => ({ file: names.clock, ...r })));
    warnings.push(...parsed.warnings);
    const byDate = new Map([...byId.values()].map((e) => [`${e.night.instrumentId}\u0000${e.night.localDate}`, e]));
    const instrumentIds = new Set([...byId.values()].map((e) => e.night.instrumentId));
    for (const row of parsed.rows) {
      const instrumentId = row.instrumentId ?? (instrumentIds.size === 1 ? [...instrumentIds][0] : null);
      const entry = instrumentId === null ? undefined : byDate.get(`${instrumentId}\u0000${dateText(row.nightDateMjd)}`);
      if (entry === undefined) {
        rejected.push({ file: names.clock, row: row.row, line: row.line, column: instrumentId === null ? 'instrumentId' : 'nightDate', reason: instrumentId === null ? 'give the instrumentId: the folder has more than one instrument' : `no night of ${instrumentId} on ${dateText(row.nightDateMjd)} in nights.csv; add the night` });
        continue;
      }
      entry.clock.push(comparisonFromCells(row.utc, row.clockS, row.nightDateMjd, row.signal));
    }
  }
  attach(files.level, names.level, LEVEL_HEADER, (c, utcMjd) => {
    const v = c.number('levelArcsec', 'arcsec', -3600, 3600);
    return v === null ? null : { utcMjd, levelArcsec: v };
  }, (e, v) => e.level.push(v));
  attach(files.collimation, names.collimation, COLLIMATION_HEADER, (c, utcMjd) => {
    const v = c.number('collimationArcsec', 'arcsec', -3600, 3600);
    return v === null ? null : { utcMjd, collimationArcsec: v };
  }, (e, v) => e.collimation.push(v));
  const nights = [...byId.values()].map(({ night, clock, level, collimation }) => ({ ...night, clockComparisons: clock, levelReadings: level, collimationReadings: collimation }));
  return { nights, rejected, warnings };
}
