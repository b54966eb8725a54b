/**
 * ISO 8601 / RFC 3339 date-times in UTC, with leap seconds.
 *
 * Accepted: `YYYY-MM-DDThh:mm:ss[.f…]` followed by `Z` or a numeric offset `±hh:mm` (or `±hhmm`);
 * a space may replace `T`; up to 9 fractional digits. A time without a zone is refused (we do not
 * guess local time). Second 60 is accepted only in the last UTC minute of a day that the leap-second
 * table ends with a positive leap second; on a day with a negative leap second 23:59:59 is refused.
 * With an offset, the leap second sits at the offset's local equivalent of 23:59:60 UTC
 * (e.g. 2016-12-31T18:59:60-05:00), as RFC 3339 section 5.7 describes.
 *
 * The UTC result is the SOFA/ERFA quasi JD (leap-seconds.ts): fraction = seconds of the UTC day over
 * the length of that day (86 400 + leap). Formatting inverts this exactly, so 23:59:60.5 survives a
 * round trip.
 */
import {
  calendarDayToMjd,
  checkTimeOfDay,
  mjdToCalendarDay,
  splitMjdDay,
  type JulianDate,
} from './julian-date.ts';
import type { LeapSecondTable } from './leap-seconds.ts';
import { MJD_ZERO } from '../units.ts';

/** A parsed ISO time: the UTC quasi JD and the UTC calendar fields it stands for. */
export interface ParsedIsoUtc {
  readonly utcJd: JulianDate;
  readonly year: number;
  readonly month: number;
  readonly day: number;
  readonly hour: number;
  readonly minute: number;
  /** Seconds of the UTC minute, 60 ≤ second < 61 inside a positive leap second. */
  readonly second: number;
  /** The offset written in the text, in minutes east of UTC (0 for `Z`). */
  readonly offsetMinutes: number;
}

const ISO_PATTERN = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2}):(\d{2})(?:\.(\d{1,9}))?(Z|[+-]\d{2}:?\d{2})$/i;

/** Parse an ISO 8601 UTC time (see the file header); leap seconds are checked against `table`. */
export function parseIsoUtc(text: string, table: LeapSecondTable): ParsedIsoUtc {
  const match = ISO_PATTERN.exec(text.trim());
  if (match === null) {
    throw new SyntaxError(
      `ISO time "${text}": expected YYYY-MM-DDThh:mm:ss[.ffffff] followed by Z or an offset like +02:00 ` +
        '(a time without a zone is not accepted: add Z for UTC)',
    );
  }
  const [, y, mo, d, h, mi, s, fraction, zone] = match;
  const offsetMinutes = parseOffset(zone);
  const localSecond = Number(s) + (fraction === undefined ? 0 : Number(`0.${fraction}`));
  // Move the local wall time to UTC by whole minutes; the seconds field is unchanged by offsets.
  const localMjd = checkedDay(Number(y), Number(mo), Number(d), text);
  checkTimeOfDay(Number(h), Number(mi), Math.min(localSecond, 59), 60);
  let minuteOfDay = Number(h) * 60 + Number(mi) - offsetMinutes;
  const mjdDay = localMjd + Math.floor(minuteOfDay / 1440);
  minuteOfDay -= 1440 * Math.floor(minuteOfDay / 1440);
  const hour = Math.floor(minuteOfDay / 60);
  const minute = minuteOfDay % 60;
  const utcJd = utcFieldsToJulianDate(mjdDay, hour, minute, localSecond, table, text);
  const { year, month, day } = mjdToCalendarDay(mjdDay);
  return { utcJd, year, month, day, hour, minute, second: localSecond, offsetMinutes };
}

/**
 * UTC day (MJD) and clock fields to the UTC quasi JD. The second must be below 60 + (leap at the
 * end of that day) in the day's last minute, and below 60 otherwise.
 */
export function utcFieldsToJulianDate(
  mjdDay: number,
  hour: number,
  minute: number,
  second: number,
  table: LeapSecondTable,
  what = 'UTC time',
): JulianDate {
  const lastMinute = hour === 23 && minute === 59;
  const leapSeconds = table.covers(mjdDay) ? table.leapAtEndOfDaySeconds(mjdDay) : 0;
  const limit = lastMinute ? 60 + leapSeconds : 60;
  if (!(second >= 0 && second < limit)) {
    const { year, month, day } = mjdToCalendarDay(mjdDay);
    const date = `${year}-${pad(month, 2)}-${pad(day, 2)}`;
    const reason = !lastMinute
      ? 'seconds must be below 60 outside the last minute of a UTC day'
      : leapSeconds > 0
        ? `the leap second of ${date} ends at 23:59:61`
        : leapSeconds < 0
          ? `${date} ends with a negative leap second: its last minute stops at 23:59:${(60 + leapSeconds).toFixed(3)}`
          : `${table.sourceName} has no leap second at the end of ${date}`;
    throw new RangeError(`${what}: second ${second} of ${pad(hour, 2)}:${pad(minute, 2)} UTC on ${date} does not exist (${reason})`);
  }
  const dayLengthSeconds = 86400 + leapSeconds;
  return { jd1: MJD_ZERO + mjdDay, jd2: (hour * 3600 + minute * 60 + second) / dayLengthSeconds };
}

/** UTC clock fields of a UTC quasi JD: day, hour, minute and second (60.x inside a leap second). */
export function julianDateToUtcFields(
  utc: JulianDate,
  table: LeapSecondTable,
  fractionDigits = 6,
): { mjdDay: number; hour: number; minute: number; second: number; secondText: string } {
  if (!Number.isInteger(fractionDigits) || fractionDigits < 0 || fractionDigits > 9) {
    throw new RangeError(`formatIsoUtc: fractionDigits must be an integer 0–9, got ${fractionDigits}`);
  }
  const split = splitMjdDay(utc);
  const dayFraction = split.dayFraction;
  let mjdDay = split.mjdDay;
  const leap = table.covers(mjdDay) ? table.leapAtEndOfDaySeconds(mjdDay) : 0;
  const unitsPerSecond = 10 ** fractionDigits;
  // Round once, in integer units of the last printed digit, so that carries are exact.
  let units = Math.round(dayFraction * (86400 + leap) * unitsPerSecond);
  if (units >= (86400 + leap) * unitsPerSecond) {
    units -= Math.round((86400 + leap) * unitsPerSecond);
    mjdDay += 1;
  }
  const wholeSeconds = Math.floor(units / unitsPerSecond);
  const fractionUnits = units - wholeSeconds * unitsPerSecond;
  const hour = Math.min(23, Math.floor(wholeSeconds / 3600));
  const minute = Math.min(59, Math.floor((wholeSeconds - hour * 3600) / 60));
  const secondOfMinute = wholeSeconds - hour * 3600 - minute * 60;
  const secondText = pad(secondOfMinute, 2) + (fractionDigits > 0 ? '.' + pad(fractionUnits, fractionDigits) : '');
  return { mjdDay, hour, minute, second: secondOfMinute + fractionUnits / unitsPerSecond, secondText };
}

/** Format a UTC quasi JD as `YYYY-MM-DDThh:mm:ss.ffffffZ` (default 6 digits: microseconds). */
export function formatIsoUtc(utc: JulianDate, table: LeapSecondTable, fractionDigits = 6): string {
  const fields = julianDateToUtcFields(utc, table, fractionDigits);
  const { year, month, day } = mjdToCalendarDay(fields.mjdDay);
  const yearText = year >= 0 && year <= 9999 ? pad(year, 4) : String(year);
  return `${yearText}-${pad(month, 2)}-${pad(day, 2)}T${pad(fields.hour, 2)}:${pad(fields.minute, 2)}:${fields.secondText}Z`;
}

function parseOffset(zone: string): number {
  if (zone.toUpperCase() === 'Z') return 0;
  const digits = zone.slice(1).replace(':', '');
  const hours = Number(digits.slice(0, 2));
  const minutes = Number(digits.slice(2));
  if (hours > 23 || minutes > 59) throw new RangeError(`ISO time: offset ${zone} is out of range (at most ±23:59)`);
  return (zone[0] === '-' ? -1 : 1) * (hours * 60 + minutes);
}

function checkedDay(year: number, month: number, day: number, text: string): number {
  try {
    return calendarDayToMjd(year, month, day);
  } catch (error) {
    throw new RangeError(`ISO time "${text}": ${(error as Error).message}`);
  }
}

function pad(value: number, width: number): string {
  return String(value).padStart(width, '0');
}
