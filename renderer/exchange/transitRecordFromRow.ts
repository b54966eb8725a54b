import type { InstrumentRecord, TransitRecord, WeatherReading } from '../../core/archive/records.ts';
import type { TransitLogRow } from '../../core/formats/transit-log.ts';

/** Seconds per day, for clock seconds and seconds of a UTC day → fractions of an MJD. */
const SECONDS_PER_DAY = 86_400;

/** A problem that keeps one row out, with the column it concerns. */
export interface RowProblem {
  readonly column: string;
  readonly reason: string;
}

/**
 * Wire times as MJD in the order of the instrument's wires (NaN for a missed wire), and their plain
 * mean. Clock times count seconds from 0 h of the clock on `nightDateMjd`; UTC times are read as
 * an instant of a UTC day (a leap second 23:59:60 maps to the next day's 0 h: good to 1 s, enough
 * for ordering; the reduction reads the exact wire times again from the file's fields).
 */
export function wireTimesMjd(row: TransitLogRow, nightDateMjd: number | null, wireCount: number): { wires: number[]; meanMjd: number } | RowProblem {
  const times = row.times;
  const entries = times.kind === 'utc'
    ? times.wires.map((w) => ({ index: w.wireIndex, mjd: w.utc.mjd + w.utc.secondsOfDay / SECONDS_PER_DAY }))
    : times.wires.map((w) => ({ index: w.wireIndex, mjd: nightDateMjd === null ? Number.NaN : nightDateMjd + w.clockS / SECONDS_PER_DAY }));
  if (times.kind === 'clock' && nightDateMjd === null) {
    return { column: 'nightDate', reason: 'clock times need the nightDate of the row (seconds count from 0 h of that date)' };
  }
  const highest = Math.max(...entries.map((e) => e.index));
  if (wireCount > 0 && highest >= wireCount) {
    return { column: `wire${highest + 1}`, reason: `wire ${highest + 1} is given but the instrument has ${wireCount} wire(s); check the wire numbers or the instrument's wireIntervalsS` };
  }
  const wires = Array.from({ length: Math.max(wireCount, highest + 1) }, () => Number.NaN);
  for (const e of entries) wires[e.index] = e.mjd;
  const meanMjd = entries.reduce((sum, e) => sum + e.mjd, 0) / entries.length;
  return { wires, meanMjd };
}

/** The zenith reading in the instrument's reading unit, or why the file's unit does not fit it. */
export function zenithReadingsFor(row: TransitLogRow, instrument: InstrumentRecord): number[] | RowProblem {
  const reading = row.zenithReading;
  if (reading === null) return [];
  const fits = { turns: 'micrometer-turn', px: 'pixel', deg: 'circle-arcsec' } as const;
  if (fits[reading.unit] !== instrument.readingUnit) {
    const column = { turns: 'micrometerTurns', px: 'offsetPx', deg: 'zenithDistanceDeg' }[reading.unit];
    return { column, reason: `${column} given but instrument '${instrument.id}' reads ${instrument.readingUnit}; use the column of that unit` };
  }
  // Degrees of zenith distance → the circle unit of the record, arcseconds.
  return [reading.unit === 'deg' ? reading.value * 3600 : reading.value];
}

/** Weather given with the transit; a value the row leaves empty is NaN (unknown, never zero). */
export function weatherOf(row: TransitLogRow): WeatherReading | null {
  if (row.temperatureC === null && row.pressureHpa === null && row.humidityPercent === null) return null;
  return {
    temperatureC: row.temperatureC ?? Number.NaN,
    pressureHpa: row.pressureHpa ?? Number.NaN,
    relativeHumidityPercent: row.humidityPercent ?? Number.NaN,
  };
}

/**
 * The archive record of one accepted row. The record has no field for flags other than
 * user-rejected, so the others (doubtful, cloud, …) are kept in the note in square brackets, where
 * the Archive view shows them and a later schema can read them back. The clamp position is kept.
 */
export function transitRecordFromRow(
  row: TransitLogRow,
  ids: { id: string; nightId: string; starId: string; instrumentId: string },
  times: { wires: number[]; meanMjd: number },
  zenithReadings: number[],
  nowUtc: string,
): TransitRecord {
  const otherFlags = row.flags.filter((f) => f !== 'user-rejected');
  const note = otherFlags.length === 0 ? row.note : `${row.note}${row.note === '' ? '' : ' '}[${otherFlags.join('; ')}]`;
  return {
    ...ids, culmination: row.culmination, ...(row.clamp === 'none' ? {} : { clamp: row.clamp }), clockMjd: times.meanMjd, wireClockMjd: times.wires, utcMjd: times.meanMjd,
    zenithReadings, weather: weatherOf(row), weight: row.weight, userRejected: row.flags.includes('user-rejected'),
    flaggedOutlier: false, note, visibility: 'visible', createdUtc: nowUtc, updatedUtc: nowUtc,
  };
}
