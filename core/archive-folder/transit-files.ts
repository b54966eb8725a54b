import type { InstrumentRecord, NightRecord, StarRecord, TransitRecord } from '../archive/records.ts';
import { readCsvTable } from '../formats/csv-table.ts';
import { parseTransitLog } from '../formats/transit-log.ts';
import { reduceToMeanWire } from '../instrument/wire-reduction.ts';
import { DEG } from '../units.ts';
import { approximateUtcMjd, csvFile, dateMjd, dateText, type FolderRejection, numberText, secondsText } from './folder-text.ts';

/** Columns this folder adds to H4's transit log; the general importer ignores them (FOLDER.md). */
export const TRANSIT_EXTENSION_COLUMNS = ['transitId', 'meanWireClockS', 'outlier'] as const;
const HEADER = ['starId', 'culmination', 'clamp', 'nightDate', 'instrumentId', 'observer', 'wireTimesClockS', 'micrometerTurns', 'offsetPx', 'zenithDistanceDeg', 'temperatureC', 'pressureHpa', 'humidityPercent', 'weight', 'flags', 'note', ...TRANSIT_EXTENSION_COLUMNS];

/**
 * The transits as H4's transit logs, one file per year of the nights' local dates
 * (`transits/YYYY.csv`), rows in clock order. Clock times are seconds since 0 h of the night's
 * local date on the instrument clock, to 10 µs; a missed wire is an empty place in the list.
 */
export function writeTransitFiles(transits: readonly TransitRecord[], nights: readonly NightRecord[], instruments: readonly InstrumentRecord[]): Map<string, string> {
  const nightById = new Map(nights.map((n) => [n.id, n]));
  const instrumentById = new Map(instruments.map((i) => [i.id, i]));
  const byYear = new Map<string, { clockMjd: number; fields: string[] }[]>();
  for (const t of transits) {
    const where = `transit ${t.id}`;
    const night = nightById.get(t.nightId);
    const instrument = instrumentById.get(t.instrumentId);
    if (night === undefined) throw new RangeError(`${where}: its night ${t.nightId} is not in the archive`);
    if (instrument === undefined || night.instrumentId !== t.instrumentId) throw new RangeError(`${where}: instrument ${t.instrumentId} is unknown or not its night's instrument`);
    if (t.zenithReadings.length > 1) throw new RangeError(`${where} has ${t.zenithReadings.length} zenith readings; the transit log holds one per row`);
    const day = dateMjd(night.localDate);
    const times = instrument.wireIntervalsEquatorialS.length === 0 ? [t.clockMjd] : t.wireClockMjd;
    if (!times.some(Number.isFinite)) throw new RangeError(`${where} has no wire time; the transit log needs at least one`);
    const reading = t.zenithReadings.length === 0 ? '' : numberText(t.zenithReadings[0], where);
    const column = instrument.readingUnit === 'micrometer-turn' ? 0 : instrument.readingUnit === 'pixel' ? 1 : 2;
    const zenith = ['', '', ''];
    if (reading !== '') zenith[column] = column === 2 ? numberText(t.zenithReadings[0] / 3600, where) : reading;
    const w = t.weather;
    const fields = [
      t.starId, t.culmination, t.clamp ?? '', night.localDate, t.instrumentId, night.observer,
      times.map((m) => (Number.isFinite(m) ? secondsText(m, day) : '')).join(';'), ...zenith,
      w === null ? '' : numberText(w.temperatureC, where), w === null ? '' : numberText(w.pressureHpa, where), w === null ? '' : numberText(w.relativeHumidityPercent, where),
      numberText(t.weight, where), t.userRejected ? 'user-rejected' : '', t.note, t.id, secondsText(t.clockMjd, day), t.flaggedOutlier ? 'yes' : '',
    ];
    const year = night.localDate.slice(0, 4);
    byYear.set(year, [...(byYear.get(year) ?? []), { clockMjd: t.clockMjd, fields }]);
  }
  const files = new Map<string, string>();
  for (const year of [...byYear.keys()].sort()) {
    const rows = byYear.get(year)!.sort((a, b) => a.clockMjd - b.clockMjd).map((r) => r.fields);
    files.set(`transits/${year}.csv`, csvFile(HEADER, rows));
  }
  return files;
}

export interface TransitContext {
  readonly nights: readonly NightRecord[];
  readonly instruments: readonly InstrumentRecord[];
  readonly stars: readonly StarRecord[];
  readonly createdUtc: string;
}

/** Reads one transit file with H4's parser and our extension columns. */
export function readTransitFile(bytes: Uint8Array, file: string, context: TransitContext): { transits: TransitRecord[]; rejected: FolderRejection[]; warnings: string[] } {
  const parsed = parseTransitLog(bytes, { fileName: file, knownStarIds: new Set(context.stars.map((s) => s.id)), nightClockS: { start: -86_400, end: 172_800 } });
  const rejected: FolderRejection[] = parsed.rejected.map((r) => ({ file, ...r }));
  const warnings = parsed.warnings.filter((w) => !onlyExtensionColumns(w));
  const extensions = new Map(readCsvTable(bytes, file).rows.map((r) => [r.row, r.cells]));
  const nightByKey = new Map(context.nights.map((n) => [`${n.instrumentId}\u0000${n.localDate}`, n]));
  const instrumentById = new Map(context.instruments.map((i) => [i.id, i]));
  const starById = new Map(context.stars.map((s) => [s.id, s]));
  const transits: TransitRecord[] = [];
  const droppedFlags = new Set<string>();
  for (const row of parsed.rows) {
    const reject = (column: string, reason: string) => rejected.push({ file, row: row.row, line: row.line, column, reason });
    const date = row.nightDateMjd === null ? null : dateText(row.nightDateMjd);
    const night = row.instrumentId === null || date === null ? undefined : nightByKey.get(`${row.instrumentId}\u0000${date}`);
    const instrument = row.instrumentId === null ? undefined : instrumentById.get(row.instrumentId);
    if (instrument === undefined) { reject('instrumentId', `instrument '${row.instrumentId ?? ''}' is not in site.json`); continue; }
    if (night === undefined) { reject('nightDate', `no night of ${row.instrumentId} on ${date ?? '(no date)'} in nights.csv; add the night`); continue; }
    if (row.times.kind !== 'clock') { reject('wireTimesClockS', 'an archive folder gives clock times (wireTimesClockS), not UTC'); continue; }
    const weatherCells = [row.temperatureC, row.pressureHpa, row.humidityPercent];
    if (weatherCells.some((v) => v === null) && weatherCells.some((v) => v !== null)) { reject('temperatureC', 'transit weather needs temperatureC, pressureHpa and humidityPercent together (or none)'); continue; }
    const unit = instrument.readingUnit === 'micrometer-turn' ? 'turns' : instrument.readingUnit === 'pixel' ? 'px' : 'deg';
    if (row.zenithReading !== null && row.zenithReading.unit !== unit) { reject('micrometerTurns', `instrument ${instrument.id} reads ${instrument.readingUnit}, but the row gives ${row.zenithReading.unit}`); continue; }
    const day = dateMjd(night.localDate);
    const extra = extensions.get(row.row) ?? new Map<string, string>();
    const wires = instrument.wireIntervalsEquatorialS;
    const wireClockMjd = wires.length === 0 ? [] : wires.map(() => Number.NaN);
    for (const w of row.times.wires) {
      if (wires.length > 0 && w.wireIndex >= wires.length) { reject('wireTimesClockS', `wire ${w.wireIndex + 1} does not exist: ${instrument.id} has ${wires.length} wires`); break; }
      if (wires.length > 0) wireClockMjd[w.wireIndex] = day + w.clockS / 86_400;
    }
    if (rejected.some((r) => r.row === row.row && r.file === file)) continue;
    const meanText = (extra.get('meanWireClockS') ?? '').trim();
    let clockMjd: number;
    if (meanText !== '' && Number.isFinite(Number(meanText))) clockMjd = day + Number(meanText) / 86_400;
    else if (wires.length === 0) clockMjd = day + row.times.wires[0].clockS / 86_400;
    else {
      const star = starById.get(row.starId)!;
      const reduced = reduceToMeanWire(row.times.wires.map((w) => ({ wireIndex: w.wireIndex, clockTimeS: w.clockS })), wires, star.decDeg * DEG, row.culmination, row.clamp, 'mean-solar');
      clockMjd = day + reduced.meanWireTimeS / 86_400;
      warnings.push(`${file}: row ${row.row}: no meanWireClockS; reduced the wires to the mean wire at the catalogue declination`);
    }
    row.flags.filter((f) => f !== 'user-rejected').forEach((f) => droppedFlags.add(f));
    const reading = row.zenithReading === null ? [] : [row.zenithReading.unit === 'deg' ? row.zenithReading.value * 3600 : row.zenithReading.value];
    const idText = (extra.get('transitId') ?? '').trim();
    transits.push({
      id: idText !== '' ? idText : `${night.id}/${row.starId}/${row.culmination}`, nightId: night.id, starId: row.starId, instrumentId: instrument.id,
      culmination: row.culmination, ...(row.clamp === 'none' ? {} : { clamp: row.clamp }), clockMjd, wireClockMjd, utcMjd: approximateUtcMjd(clockMjd, night.clockComparisons), zenithReadings: reading,
      weather: row.temperatureC === null ? null : { temperatureC: row.temperatureC, pressureHpa: row.pressureHpa!, relativeHumidityPercent: row.humidityPercent! },
      weight: row.weight, userRejected: row.flags.includes('user-rejected'), flaggedOutlier: (extra.get('outlier') ?? '').trim() === 'yes', note: row.note,
      visibility: 'visible', createdUtc: context.createdUtc, updatedUtc: context.createdUtc,
    });
  }
  if (droppedFlags.size > 0) warnings.push(`${file}: flag(s) ${[...droppedFlags].join(', ')} have no place in the archive records and were not kept`);
  return { transits, rejected, warnings };
}

function onlyExtensionColumns(warning: string): boolean {
  const match = /: unknown column\(s\) ignored: (.*)$/.exec(warning);
  return match !== null && match[1].split(', ').every((c) => (TRANSIT_EXTENSION_COLUMNS as readonly string[]).includes(c));
}
