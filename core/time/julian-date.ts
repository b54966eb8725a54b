/**
 * Two-part Julian dates and the proleptic Gregorian calendar.
 *
 * A `JulianDate` is the pair (jd1, jd2) whose sum is the Julian date in whatever time scale the
 * holder says (UTC, TAI, TT, TDB, UT1). Keeping the parts apart preserves precision: with jd1 a
 * whole or half day and |jd2| ≤ 1, a double resolves about 10 ps; a single double JD resolves only
 * about 40 µs. This is the SOFA/ERFA convention (IAU SOFA Board, "SOFA Time Scale and Calendar
 * Tools", 2021).
 *
 * Calendar conversion: Fliegel & Van Flandern (1968), Comm. ACM 11, 657, valid for every date from
 * −4799 March 1 on; the inverse is the days-from-civil algorithm of H. Hinnant ("chrono-compatible
 * low-level date algorithms", 2013). Both are exact in integer arithmetic.
 */
import { DAYS_PER_JULIAN_CENTURY, JD_J2000, MJD_ZERO, SECONDS_PER_DAY } from '../units.ts';

/** A two-part Julian date; the time scale is the holder's. `jd1 + jd2` is the Julian date in days. */
export interface JulianDate {
  readonly jd1: number;
  readonly jd2: number;
}

/** Make a two-part Julian date; both parts in days, `jd2` defaults to 0. Throws on non-finite parts. */
export function julianDate(jd1: number, jd2 = 0): JulianDate {
  if (!Number.isFinite(jd1) || !Number.isFinite(jd2)) {
    throw new RangeError(`julianDate: parts must be finite numbers of days, got jd1=${jd1}, jd2=${jd2}`);
  }
  return { jd1, jd2 };
}

/** Modified Julian date (days) to a two-part JD with jd1 = 2 400 000.5 and jd2 = mjd. */
export function mjdToJulianDate(mjd: number): JulianDate {
  return julianDate(MJD_ZERO, mjd);
}

/** Two-part JD to a modified Julian date in days (one double: about 1 ns resolution near today). */
export function julianDateToMjd(jd: JulianDate): number {
  return jd.jd1 - MJD_ZERO + jd.jd2;
}

/** Julian centuries of 36 525 days since J2000.0 (JD 2 451 545.0), in the JD's own time scale. */
export function julianCenturiesSinceJ2000(jd: JulianDate): number {
  return (jd.jd1 - JD_J2000 + jd.jd2) / DAYS_PER_JULIAN_CENTURY;
}

/** Days since J2000.0 (JD 2 451 545.0), in the JD's own time scale. */
export function daysSinceJ2000(jd: JulianDate): number {
  return jd.jd1 - JD_J2000 + jd.jd2;
}

/** `jd` moved by `seconds` (86 400 s per day, i.e. a uniform time scale); jd1 is kept. */
export function addSeconds(jd: JulianDate, seconds: number): JulianDate {
  return { jd1: jd.jd1, jd2: jd.jd2 + seconds / SECONDS_PER_DAY };
}

/** `later − earlier` in days, computed part by part to keep precision. */
export function daysBetween(later: JulianDate, earlier: JulianDate): number {
  return later.jd1 - earlier.jd1 + (later.jd2 - earlier.jd2);
}

/** The MJD (whole days) of 0h on a proleptic Gregorian calendar date; throws on an invalid date. */
export function calendarDayToMjd(year: number, month: number, day: number): number {
  if (!Number.isInteger(year) || year < -4799) {
    throw new RangeError(`calendar date: year must be an integer ≥ −4799, got ${year}`);
  }
  if (!Number.isInteger(month) || month < 1 || month > 12) {
    throw new RangeError(`calendar date: month must be an integer 1–12, got ${month}`);
  }
  const length = daysInMonth(year, month);
  if (!Number.isInteger(day) || day < 1 || day > length) {
    throw new RangeError(`calendar date: day must be an integer 1–${length} for ${year}-${month}, got ${day}`);
  }
  // Fliegel & Van Flandern (1968), with C-style truncating division.
  const my = Math.trunc((month - 14) / 12);
  const iypmy = year + my;
  return (
    Math.trunc((1461 * (iypmy + 4800)) / 4) +
    Math.trunc((367 * (month - 2 - 12 * my)) / 12) -
    Math.trunc((3 * Math.trunc((iypmy + 4900) / 100)) / 4) +
    day -
    2432076
  );
}

/** Days in a month of the proleptic Gregorian calendar. */
export function daysInMonth(year: number, month: number): number {
  if (month === 2) return isGregorianLeapYear(year) ? 29 : 28;
  return [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1];
}

export function isGregorianLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

/**
 * A proleptic Gregorian date and time of day to a two-part JD: jd1 = 2 400 000.5 + MJD of the day,
 * jd2 = fraction of an 86 400-second day. `second` may reach 60.999… only in the UTC helpers that
 * know about leap seconds (see iso.ts); here it must be below 60, hour 0–23 and minute 0–59.
 */
export function calendarToJulianDate(
  year: number,
  month: number,
  day: number,
  hour = 0,
  minute = 0,
  second = 0,
): JulianDate {
  const mjd = calendarDayToMjd(year, month, day);
  checkTimeOfDay(hour, minute, second, 60);
  return { jd1: MJD_ZERO + mjd, jd2: (hour * 3600 + minute * 60 + second) / SECONDS_PER_DAY };
}

/** Throws unless hour is an integer 0–23, minute an integer 0–59 and 0 ≤ second < secondLimit. */
export function checkTimeOfDay(hour: number, minute: number, second: number, secondLimit: number): void {
  if (!Number.isInteger(hour) || hour < 0 || hour > 23) {
    throw new RangeError(`time of day: hour must be an integer 0–23, got ${hour}`);
  }
  if (!Number.isInteger(minute) || minute < 0 || minute > 59) {
    throw new RangeError(`time of day: minute must be an integer 0–59, got ${minute}`);
  }
  if (!(second >= 0 && second < secondLimit)) {
    throw new RangeError(`time of day: second must be in [0, ${secondLimit}), got ${second}`);
  }
}

/** The proleptic Gregorian date of a whole MJD (Hinnant's civil-from-days). */
export function mjdToCalendarDay(mjd: number): { year: number; month: number; day: number } {
  if (!Number.isInteger(mjd)) throw new RangeError(`mjdToCalendarDay: MJD must be a whole day, got ${mjd}`);
  const z = mjd + 678881; // days since 0000-03-01 (MJD 0 is 1858-11-17)
  const era = Math.floor(z / 146097);
  const doe = z - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  return { year: yoe + era * 400 + (month <= 2 ? 1 : 0), month, day };
}

/**
 * Split a two-part JD into the whole MJD of its day and the fraction of that day (0 ≤ f < 1),
 * without losing the precision the two parts carry.
 */
export function splitMjdDay(jd: JulianDate): { mjdDay: number; dayFraction: number } {
  const a = jd.jd1 - MJD_ZERO;
  const whole = Math.floor(a + jd.jd2);
  let fraction = a - whole + jd.jd2;
  let mjdDay = whole;
  // Rounding in `a + jd2` can put the floor one day off; repair so that 0 ≤ fraction < 1.
  if (fraction < 0) {
    fraction += 1;
    mjdDay -= 1;
  } else if (fraction >= 1) {
    fraction -= 1;
    mjdDay += 1;
  }
  return { mjdDay, dayFraction: fraction };
}
