/**
 * Angle and time units. Internally every angle is in radians and every instant a two-part
 * Julian date; these constants convert at the edges and name tolerances in tests (`3 * MAS`).
 */
export const TAU = 2 * Math.PI;
/** One degree in radians. */
export const DEG = Math.PI / 180;
/** One arcminute in radians. */
export const ARCMIN = DEG / 60;
/** One arcsecond in radians. */
export const ARCSEC = DEG / 3600;
/** One milliarcsecond in radians. */
export const MAS = ARCSEC / 1000;
/** One microarcsecond in radians. */
export const UAS = MAS / 1000;
/** One hour of angle (15 degrees) in radians. */
export const HOUR_ANGLE = 15 * DEG;
/** One second of time expressed as an angle of rotation (15 arcsec) in radians. */
export const SECOND_OF_TIME_ANGLE = 15 * ARCSEC;
/** Seconds in a day. */
export const SECONDS_PER_DAY = 86_400;
/** Days in a Julian year. */
export const DAYS_PER_JULIAN_YEAR = 365.25;
/** Days in a Julian century. */
export const DAYS_PER_JULIAN_CENTURY = 36_525;
/** Julian date of the J2000.0 epoch (2000 January 1 12h TT). */
export const JD_J2000 = 2_451_545.0;
/** Offset between Julian date and modified Julian date. */
export const MJD_ZERO = 2_400_000.5;
