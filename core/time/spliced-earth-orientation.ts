/**
 * Earth orientation from several daily series at once — the bundled IERS C04 table and whatever
 * IERS files the user has imported (a finals2000A.daily covers only the last three months) — as
 * one source for TimeScale. Days are merged (a later list overrides an earlier one day by day),
 * then split into spans of consecutive days; each span is an EarthOrientationTable with its own
 * cubic interpolation (earth-orientation-table.ts). An instant in a gap between spans, or outside
 * them all, gets UT1 − UTC and the pole as 0 with a note naming the spans on either side: never a
 * silent extrapolation across missing days.
 */
import { ARCSEC } from '../units.ts';
import { EarthOrientationTable, type EarthOrientationSource, type EarthOrientationValues } from './earth-orientation-table.ts';

/** One tabulated day (0h UTC of MJD `mjd`, a whole number). */
export interface EarthOrientationDay {
  readonly mjd: number;
  /** UT1 − UTC, seconds. */
  readonly dut1Seconds: number;
  /** Pole coordinates, arcseconds (IERS sign convention). */
  readonly xArcsec: number;
  readonly yArcsec: number;
  /** Whether any of the day's values is an IERS prediction. */
  readonly predicted: boolean;
}

/** Every tabulated day of `table` (values at its nodes are the table's own). */
export function daysOfTable(table: EarthOrientationTable): EarthOrientationDay[] {
  const days: EarthOrientationDay[] = [];
  for (let mjd = table.firstMjd; mjd <= table.lastMjd; mjd++) {
    const v = table.at(mjd);
    days.push({ mjd, dut1Seconds: v.dut1Seconds, xArcsec: v.xpRad / ARCSEC, yArcsec: v.ypRad / ARCSEC, predicted: mjd > table.lastObservedMjd });
  }
  return days;
}

export class SplicedEarthOrientation implements EarthOrientationSource {
  readonly sourceName: string;
  /** The spans of consecutive days, in time order. */
  readonly spans: readonly EarthOrientationTable[];

  /**
   * `layers` from lowest to highest priority (e.g. the bundled days, then each imported file's);
   * a day present in several layers takes the highest one's values. Non-integral MJDs are refused.
   * Spans of a single day are dropped (no interpolation is possible on one node).
   */
  constructor(layers: readonly (readonly EarthOrientationDay[])[], sourceName: string) {
    const byDay = new Map<number, EarthOrientationDay>();
    for (const layer of layers) {
      for (const day of layer) {
        if (!Number.isInteger(day.mjd)) throw new RangeError(`${sourceName}: day MJD ${day.mjd} is not a whole day`);
        byDay.set(day.mjd, day);
      }
    }
    const ordered = [...byDay.values()].sort((a, b) => a.mjd - b.mjd);
    const spans: EarthOrientationTable[] = [];
    let start = 0;
    for (let i = 1; i <= ordered.length; i++) {
      if (i < ordered.length && ordered[i].mjd === ordered[i - 1].mjd + 1) continue;
      if (i - start >= 2) spans.push(tableOf(ordered.slice(start, i), sourceName));
      start = i;
    }
    this.sourceName = sourceName;
    this.spans = spans;
  }

  /** Values at the UTC instant `mjdUtc`, from the span that holds it; outside every span, zeros with a note. */
  at(mjdUtc: number): EarthOrientationValues {
    let low = 0;
    let high = this.spans.length - 1;
    while (low <= high) {
      const middle = (low + high) >> 1;
      const span = this.spans[middle];
      if (mjdUtc < span.firstMjd) high = middle - 1;
      else if (mjdUtc > span.lastMjd) low = middle + 1;
      else return span.at(mjdUtc);
    }
    const before = this.spans[high];
    const after = this.spans[low];
    const where = before === undefined && after === undefined ? 'no Earth orientation days are tabulated'
      : before === undefined ? `it is before the first tabulated day (MJD ${after.firstMjd})`
        : after === undefined ? `it is after the last tabulated day (MJD ${before.lastMjd})`
          : `it falls in a gap of the tables (MJD ${before.lastMjd} to ${after.firstMjd})`;
    return {
      dut1Seconds: 0, xpRad: 0, ypRad: 0, status: 'outside-table',
      note: `MJD ${mjdUtc.toFixed(3)}: ${where} in ${this.sourceName}; UT1 − UTC and polar motion taken as 0 — import an IERS finals2000A or C04 file that covers it`,
    };
  }
}

function tableOf(days: readonly EarthOrientationDay[], sourceName: string): EarthOrientationTable {
  return new EarthOrientationTable({
    mjd: Float64Array.from(days, (d) => d.mjd),
    dut1Seconds: Float64Array.from(days, (d) => d.dut1Seconds),
    xArcsec: Float64Array.from(days, (d) => d.xArcsec),
    yArcsec: Float64Array.from(days, (d) => d.yArcsec),
    predicted: Uint8Array.from(days, (d) => (d.predicted ? 1 : 0)),
  }, sourceName);
}
