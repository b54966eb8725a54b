/**
 * Daily Earth orientation parameters: UT1 − UTC and the pole coordinates x_p, y_p.
 *
 * Values are tabulated at 0h UTC of consecutive days. `at()` interpolates with a 4-point Lagrange
 * polynomial (cubic), the method the IERS recommends for its daily series (IERS Gazette no. 13,
 * 1997), falling back to linear in the first and last interval. UT1 − UTC jumps by the leap
 * second; the jump is taken out before interpolating (any day-to-day change over 0.5 s is treated
 * as a leap), so the result is continuous in UT1 − TAI. Tidal and libration corrections of
 * sub-daily amplitude (≤ 0.1 ms in UT1, ≤ 0.1 mas in the pole; IERS Conventions 2010, ch. 5.5.1 and
 * 8) are not applied: below the accuracy of a visual or camera transit.
 * Interpolation error of the daily series: about 10 µs in UT1 and 0.03 mas in the pole (common
 * practice for daily IERS values).
 *
 * Sign conventions (IERS): x_p toward the 0° (Greenwich) meridian, y_p toward 90° W, in radians;
 * DUT1 = UT1 − UTC in seconds.
 */
import { calendarDayToMjd as civilDayToMjd } from './julian-date.ts';
import { ARCSEC } from '../units.ts';

export type EarthOrientationStatus = 'observed' | 'predicted' | 'outside-table';

/** What `EarthOrientationTable.at` returns. */
export interface EarthOrientationValues {
  /** UT1 − UTC in seconds (0 outside the table). */
  readonly dut1Seconds: number;
  /** Pole coordinate x_p in radians (0 outside the table). */
  readonly xpRad: number;
  /** Pole coordinate y_p in radians (0 outside the table). */
  readonly ypRad: number;
  readonly status: EarthOrientationStatus;
  /** Why the status is what it is, for the user (set unless observed). */
  readonly note?: string;
}

/** The daily columns of a table; all arrays of the same length, MJDs consecutive whole days. */
export interface EarthOrientationColumns {
  readonly mjd: Float64Array;
  readonly dut1Seconds: Float64Array;
  readonly xArcsec: Float64Array;
  readonly yArcsec: Float64Array;
  /** 1 where any of the day's values is a prediction, 0 where all are observed. */
  readonly predicted: Uint8Array;
}

/** Anything TimeScale can take UT1 − UTC and the pole from: one table, or several spliced. */
export interface EarthOrientationSource {
  /** A human name of the source, shown in warnings. */
  readonly sourceName: string;
  /** Values at the UTC instant `mjdUtc` (MJD with fraction); status and note say what was assumed. */
  at(mjdUtc: number): EarthOrientationValues;
}

export class EarthOrientationTable implements EarthOrientationSource {
  readonly sourceName: string;
  readonly firstMjd: number;
  readonly lastMjd: number;
  /** Last day whose values are all observed (not predicted); firstMjd − 1 if none is. */
  readonly lastObservedMjd: number;
  private readonly columns: EarthOrientationColumns;

  constructor(columns: EarthOrientationColumns, sourceName: string) {
    const count = columns.mjd.length;
    if (count < 2) throw new RangeError(`${sourceName}: an Earth orientation table needs at least two days, got ${count}`);
    for (let i = 1; i < count; i++) {
      if (columns.mjd[i] !== columns.mjd[i - 1] + 1) {
        throw new RangeError(`${sourceName}: days must be consecutive; MJD ${columns.mjd[i]} follows ${columns.mjd[i - 1]}`);
      }
    }
    this.columns = columns;
    this.sourceName = sourceName;
    this.firstMjd = columns.mjd[0];
    this.lastMjd = columns.mjd[count - 1];
    let lastObserved = this.firstMjd - 1;
    for (let i = 0; i < count && columns.predicted[i] === 0; i++) lastObserved = columns.mjd[i];
    this.lastObservedMjd = lastObserved;
  }

  /** Values at the UTC instant `mjdUtc` (MJD with fraction); see the file header. */
  at(mjdUtc: number): EarthOrientationValues {
    if (!(mjdUtc >= this.firstMjd && mjdUtc <= this.lastMjd)) {
      return {
        dut1Seconds: 0,
        xpRad: 0,
        ypRad: 0,
        status: 'outside-table',
        note:
          `MJD ${mjdUtc.toFixed(3)} is outside ${this.sourceName} (MJD ${this.firstMjd}–${this.lastMjd}); ` +
          'UT1 − UTC and polar motion taken as 0 — load a newer IERS finals2000A or C04 file',
      };
    }
    const { mjd, dut1Seconds, xArcsec, yArcsec, predicted } = this.columns;
    const last = mjd.length - 1;
    const base = Math.min(Math.floor(mjdUtc - this.firstMjd), last - 1);
    const start = base >= 1 && base + 2 <= last ? base - 1 : base;
    const points = start === base ? 2 : 4;
    const x = mjdUtc - mjd[start];
    let dut1 = 0;
    let xp = 0;
    let yp = 0;
    let anyPredicted = false;
    for (let k = 0; k < points; k++) {
      const weight = lagrangeWeight(x, k, points);
      const i = start + k;
      dut1 += weight * (dut1Seconds[i] - leapJumpBetween(dut1Seconds, base, i));
      xp += weight * xArcsec[i];
      yp += weight * yArcsec[i];
      anyPredicted ||= predicted[i] === 1;
    }
    if (anyPredicted) {
      return {
        dut1Seconds: dut1,
        xpRad: xp * ARCSEC,
        ypRad: yp * ARCSEC,
        status: 'predicted',
        note: `values at MJD ${mjdUtc.toFixed(3)} are IERS predictions in ${this.sourceName} (observed up to MJD ${this.lastObservedMjd}); re-reduce when final values are published`,
      };
    }
    return { dut1Seconds: dut1, xpRad: xp * ARCSEC, ypRad: yp * ARCSEC, status: 'observed' };
  }
}

/** Lagrange basis weight of node k (nodes at 0, 1, …, n − 1) at abscissa x. */
function lagrangeWeight(x: number, k: number, n: number): number {
  let weight = 1;
  for (let j = 0; j < n; j++) if (j !== k) weight *= (x - j) / (k - j);
  return weight;
}

/** Sum of whole-second leaps in UT1 − UTC from day `from` to day `to` (negative when to < from). */
function leapJumpBetween(dut1Seconds: Float64Array, from: number, to: number): number {
  let jump = 0;
  for (let i = from; i < to; i++) jump += Math.round(dut1Seconds[i + 1] - dut1Seconds[i]);
  for (let i = to; i < from; i++) jump -= Math.round(dut1Seconds[i + 1] - dut1Seconds[i]);
  return jump;
}

/**
 * Parse an IERS finals2000A file (finals2000A.all, .data or .daily; IERS Rapid Service/Prediction
 * Center, "readme.finals2000A"): fixed-width daily lines, MJD in columns 8–15, pole flag column 17,
 * x_p 19–27 and y_p 38–46 (arcsec), UT1 flag column 58, UT1 − UTC 59–68 (s), all Bulletin A values
 * (flag I = IERS observed, P = predicted). Lines after the last one with UT1 values (the blank tail
 * of finals2000A.all) end the table; a line with a bad field is rejected with its line number.
 */
export function parseIersFinals(text: string, sourceName: string): EarthOrientationTable {
  const rows: Row[] = [];
  const lines = text.split(/\r?\n/);
  for (let index = 0; index < lines.length; index++) {
    const line = lines[index];
    if (line.trim() === '') continue;
    const where = `${sourceName}, line ${index + 1}`;
    const pole = line.slice(18, 27).trim();
    const ut1 = line.slice(58, 68).trim();
    if (pole === '' && ut1 === '') break; // the future days of finals2000A.all carry no values
    const poleFlag = line[16];
    const ut1Flag = line[57];
    if ((poleFlag !== 'I' && poleFlag !== 'P') || (ut1Flag !== 'I' && ut1Flag !== 'P')) {
      throw new SyntaxError(`${where}: columns 17 and 58 must hold the flag I or P; is this a finals2000A file?`);
    }
    rows.push({
      mjd: field(line, 7, 15, 'MJD (columns 8–15)', where),
      x: field(line, 18, 27, 'x_p (columns 19–27)', where),
      y: field(line, 37, 46, 'y_p (columns 38–46)', where),
      dut1: field(line, 58, 68, 'UT1−UTC (columns 59–68)', where),
      predicted: poleFlag === 'P' || ut1Flag === 'P',
      where,
    });
  }
  return tableFromRows(rows, sourceName);
}

/**
 * Parse an IERS C04 series (Paris Observatory EOP Product Center): the "EOP 14 C04" layout
 * (eopc04_IAU2000.62-now: year, month, day, MJD, x, y, UT1−UTC, LOD, dX, dY and six errors: 16
 * fields) and the "EOP 20 C04" layout (year, month, day, hour, MJD, x, y, UT1−UTC, dX, dY, x-rate,
 * y-rate, LOD and eight errors: 21 fields, the order of the IERS file header; no real 20 C04 file
 * was at hand, so it is tested on real values rearranged in that order). Fields are white-space separated; header lines (not starting with a
 * year) are skipped; a data line with another field count, or whose MJD disagrees with its
 * calendar date, is rejected with its line number. All values are final (observed).
 */
export function parseIersC04(text: string, sourceName: string): EarthOrientationTable {
  const rows: Row[] = [];
  const lines = text.split(/\r?\n/);
  for (let index = 0; index < lines.length; index++) {
    const line = lines[index];
    if (!/^\s*\d{4}\s+\d{1,2}\s+\d{1,2}\s/.test(line)) continue;
    const where = `${sourceName}, line ${index + 1}`;
    const tokens = line.trim().split(/\s+/);
    const layout = tokens.length === 16 ? { mjd: 3, x: 4 } : tokens.length === 21 ? { mjd: 4, x: 5 } : undefined;
    if (layout === undefined) {
      throw new SyntaxError(`${where}: a C04 line has 16 (EOP 14 C04) or 21 (EOP 20 C04) fields, this one has ${tokens.length}`);
    }
    const numbers = tokens.map((token, k) => {
      const value = Number(token);
      if (!Number.isFinite(value)) throw new SyntaxError(`${where}: field ${k + 1} "${token}" is not a number`);
      return value;
    });
    const mjd = numbers[layout.mjd];
    const expectedMjd = civilDayToMjd(numbers[0], numbers[1], numbers[2]) + (layout.mjd === 4 ? numbers[3] / 24 : 0);
    if (Math.abs(mjd - expectedMjd) > 1e-6) {
      throw new SyntaxError(`${where}: MJD ${mjd} does not match the date ${tokens.slice(0, 3).join('-')} (MJD ${expectedMjd})`);
    }
    rows.push({ mjd, x: numbers[layout.x], y: numbers[layout.x + 1], dut1: numbers[layout.x + 2], predicted: false, where });
  }
  return tableFromRows(rows, sourceName);
}

interface Row {
  readonly mjd: number;
  readonly x: number;
  readonly y: number;
  readonly dut1: number;
  readonly predicted: boolean;
  readonly where: string;
}

function tableFromRows(rows: readonly Row[], sourceName: string): EarthOrientationTable {
  if (rows.length < 2) throw new SyntaxError(`${sourceName}: fewer than two daily lines with values were found`);
  for (let i = 1; i < rows.length; i++) {
    if (rows[i].mjd !== rows[i - 1].mjd + 1) {
      throw new SyntaxError(`${rows[i].where}: MJD ${rows[i].mjd} does not follow MJD ${rows[i - 1].mjd} by one day`);
    }
  }
  return new EarthOrientationTable(
    {
      mjd: Float64Array.from(rows, (row) => row.mjd),
      dut1Seconds: Float64Array.from(rows, (row) => row.dut1),
      xArcsec: Float64Array.from(rows, (row) => row.x),
      yArcsec: Float64Array.from(rows, (row) => row.y),
      predicted: Uint8Array.from(rows, (row) => (row.predicted ? 1 : 0)),
    },
    sourceName,
  );
}

function field(line: string, from: number, to: number, name: string, where: string): number {
  const text = line.slice(from, to).trim();
  const value = Number(text);
  if (text === '' || !Number.isFinite(value)) throw new SyntaxError(`${where}: ${name} "${text}" is not a number`);
  return value;
}
