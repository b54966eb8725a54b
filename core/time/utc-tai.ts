/**
 * UTC ↔ TAI with leap seconds and the pre-1972 rubber seconds.
 *
 * UTC is the SOFA/ERFA quasi Julian date (see leap-seconds.ts): the day fraction runs over the
 * whole UTC day, 86 400 + leap SI seconds long (less the rubber-second drift before 1972). The map
 * is continuous and increasing, so the inverse is a contraction solved by fixed-point iteration.
 * Accuracy: exact to the double rounding of the two-part JD (about 10 ps); UTC → TAI → UTC
 * returns the input to better than 1 ns, inside a leap second too. Method as in IAU SOFA utctai
 * and taiutc (SOFA Time Scale and Calendar Tools, 2021, section 4); the code is ours.
 */
import { splitMjdDay, type JulianDate } from './julian-date.ts';
import type { LeapSecondTable } from './leap-seconds.ts';
import { SECONDS_PER_DAY } from '../units.ts';

/** TAI − UTC of the quasi-JD `utc`, in days, including the stretch of a leap-second day. */
function taiMinusUtcDays(utc: JulianDate, table: LeapSecondTable): number {
  const { mjdDay, dayFraction } = splitMjdDay(utc);
  const atMidnightSeconds = table.valueOnDay(mjdDay, 0);
  const { leapSeconds, driftSeconds } = table.dayLength(mjdDay);
  // SI seconds since 0h UTC = f × (86400 + leap) × (86400 + drift) / 86400, expanded so that the
  // small corrections are added to jd2 separately from the fraction itself.
  const stretchSeconds = dayFraction * (leapSeconds + driftSeconds + (leapSeconds * driftSeconds) / SECONDS_PER_DAY);
  return (atMidnightSeconds + stretchSeconds) / SECONDS_PER_DAY;
}

/** TAI of a UTC instant (two-part JD, jd1 kept). Throws before 1960, when UTC did not exist. */
export function utcToTai(utc: JulianDate, table: LeapSecondTable): JulianDate {
  return { jd1: utc.jd1, jd2: utc.jd2 + taiMinusUtcDays(utc, table) };
}

/** UTC (quasi JD, see above) of a TAI instant; jd1 kept. Throws before 1960. */
export function taiToUtc(tai: JulianDate, table: LeapSecondTable): JulianDate {
  let jd2 = tai.jd2 - taiMinusUtcDays(tai, table);
  for (let iteration = 0; iteration < 8; iteration++) {
    const next = tai.jd2 - taiMinusUtcDays({ jd1: tai.jd1, jd2 }, table);
    if (next === jd2) break;
    jd2 = next;
  }
  return { jd1: tai.jd1, jd2 };
}
