import { mjdFromCalendar } from '../formats/cells.ts';
import type { UtcInstant } from '../formats/utc-instant.ts';
import { mjdToCalendarDay } from '../time/julian-date.ts';

/** One problem found while reading an archive folder: file (relative path), data row, line, column, reason. */
export interface FolderRejection {
  readonly file: string;
  readonly row: number;
  readonly line: number;
  readonly column: string;
  readonly reason: string;
}

/** Decimal places of seconds written for clock and UTC times: 10 µs, ≫ the 0.6 µs an MJD double resolves. */
export const SECOND_DECIMALS = 5;

/** One RFC 4180 record: fields with a comma, quote or line break are quoted, quotes doubled. */
export function csvLine(fields: readonly string[]): string {
  return fields.map((f) => (/[",\r\n]/.test(f) ? `"${f.replace(/"/g, '""')}"` : f)).join(',');
}

/** A whole CSV file, LF line ends, a final line break. */
export function csvFile(header: readonly string[], rows: readonly (readonly string[])[]): string {
  return [csvLine(header), ...rows.map(csvLine)].join('\n') + '\n';
}

/**
 * A number as the shortest decimal that reads back to the same double (ECMAScript
 * Number.prototype.toString; −0 as "-0"), so a round trip through the file is exact. Throws on NaN or ±∞,
 * which no cell may hold.
 */
export function numberText(value: number, where: string): string {
  if (!Number.isFinite(value)) throw new RangeError(`${where}: ${value} cannot be written to a file; give a finite number`);
  return Object.is(value, -0) ? '-0' : String(value);
}

/** `YYYY-MM-DD` of a whole MJD. */
export function dateText(mjd: number): string {
  const { year, month, day } = mjdToCalendarDay(mjd);
  return `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** MJD (whole day) of `YYYY-MM-DD`, already validated. */
export function dateMjd(text: string): number {
  const [year, month, day] = text.split('-').map(Number);
  return mjdFromCalendar(year, month, day);
}

/**
 * ISO 8601 UTC text `YYYY-MM-DDThh:mm:ss.sssssZ` of a UTC MJD (quasi-MJD: a leap second cannot be
 * expressed by an MJD and is never produced), seconds to SECOND_DECIMALS places.
 */
export function utcText(utcMjd: number): string {
  let day = Math.floor(utcMjd);
  const scale = 10 ** SECOND_DECIMALS;
  let units = Math.round((utcMjd - day) * 86_400 * scale);
  if (units >= 86_400 * scale) {
    units -= 86_400 * scale;
    day += 1;
  }
  const whole = Math.floor(units / scale);
  const fraction = String(units - whole * scale).padStart(SECOND_DECIMALS, '0');
  const hh = Math.floor(whole / 3600), mm = Math.floor((whole % 3600) / 60), ss = whole % 60;
  const two = (n: number): string => String(n).padStart(2, '0');
  return `${dateText(day)}T${two(hh)}:${two(mm)}:${two(ss)}.${fraction}Z`;
}

/** UTC MJD of a parsed ISO UTC instant (a leap second 23:59:60.x folds onto the next day's 0h). */
export function utcInstantMjd(instant: UtcInstant): number {
  return instant.mjd + instant.secondsOfDay / 86_400;
}

/** Seconds since 0h of `dayMjd`, written to SECOND_DECIMALS places. */
export function secondsText(mjd: number, dayMjd: number): string {
  return ((mjd - dayMjd) * 86_400).toFixed(SECOND_DECIMALS);
}

/** `mjd` as it reads back from `secondsText(mjd, dayMjd)`: writers of records that must round-trip use it. */
export function quantizedClockMjd(mjd: number, dayMjd: number): number {
  return dayMjd + Number(secondsText(mjd, dayMjd)) / 86_400;
}

/** `utcMjd` as it reads back from `utcText(utcMjd)`. */
export function quantizedUtcMjd(utcMjd: number): number {
  const text = utcText(utcMjd);
  const day = dateMjd(text.slice(0, 10));
  const [hh, mm, ss] = text.slice(11, -1).split(':').map(Number);
  return utcInstantMjd({ mjd: day, secondsOfDay: hh * 3600 + mm * 60 + ss });
}

/**
 * The approximate UTC (MJD) the records keep with a transit for ordering: the clock reading minus
 * the mean of the night's clock comparisons (good to the clock's drift over the night, < 1 s);
 * the raw reading when the night has none.
 */
export function approximateUtcMjd(clockMjd: number, comparisons: readonly { readonly clockMinusUtcS: number }[]): number {
  if (comparisons.length === 0) return clockMjd;
  return clockMjd - comparisons.reduce((s, c) => s + c.clockMinusUtcS, 0) / comparisons.length / 86_400;
}
