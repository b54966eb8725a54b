import { describe, expect, it } from 'vitest';
import {
  addSeconds,
  calendarDayToMjd,
  calendarToJulianDate,
  julianCenturiesSinceJ2000,
  julianDate,
  julianDateToMjd,
  mjdToJulianDate,
  splitMjdDay,
} from '../../core/time/julian-date.ts';

describe('two-part Julian dates', () => {
  it('mjdToJulianDate(mjd) has jd1 = 2400000.5 and round-trips through julianDateToMjd', () => {
    expect(mjdToJulianDate(51544.5)).toEqual({ jd1: 2400000.5, jd2: 51544.5 });
    expect(julianDateToMjd(mjdToJulianDate(60123.25))).toBe(60123.25);
  });

  it('julianCenturiesSinceJ2000: 0 at JD 2451545.0 (J2000.0, IAU 1976) and 1 at JD 2488070.0', () => {
    expect(julianCenturiesSinceJ2000(julianDate(2451545.0))).toBe(0);
    expect(julianCenturiesSinceJ2000(julianDate(2400000.5, 88069.5))).toBe(1);
  });

  it('MJD 0 is 1858-11-17 and MJD 51544 is 2000-01-01 (definition of the MJD, IAU 1973)', () => {
    expect(calendarDayToMjd(1858, 11, 17)).toBe(0);
    expect(calendarDayToMjd(2000, 1, 1)).toBe(51544);
  });

  it('keeps microsecond precision in the second part where one double would not', () => {
    const jd = addSeconds(calendarToJulianDate(2024, 3, 1, 12), 1e-6);
    expect((jd.jd2 - 0.5) * 86400).toBeCloseTo(1e-6, 12);
    const single = jd.jd1 + jd.jd2; // the sum loses the microsecond to rounding (~40 µs resolution)
    expect(Math.abs((single - (jd.jd1 + 0.5)) * 86400 - 1e-6)).toBeGreaterThan(1e-7);
  });

  it('splitMjdDay gives 0 ≤ fraction < 1 for awkward splits', () => {
    expect(splitMjdDay({ jd1: 2451545.0, jd2: -0.5 })).toEqual({ mjdDay: 51544, dayFraction: 0 });
    const { mjdDay, dayFraction } = splitMjdDay({ jd1: 2400000.5, jd2: 60000 - 1e-17 });
    expect(dayFraction).toBeGreaterThanOrEqual(0);
    expect(dayFraction).toBeLessThan(1);
    expect(mjdDay + dayFraction).toBeCloseTo(60000, 9);
  });

  it('refuses impossible dates and times with the field and the allowed range', () => {
    expect(() => calendarToJulianDate(2023, 13, 1)).toThrow(/month must be an integer 1–12, got 13/);
    expect(() => calendarToJulianDate(1900, 2, 29)).toThrow(/day must be an integer 1–28 for 1900-2/);
    expect(() => calendarToJulianDate(2000, 2, 29, 24)).toThrow(/hour must be an integer 0–23/);
    expect(() => calendarToJulianDate(2000, 1, 1, 0, 0, 60)).toThrow(/second must be in \[0, 60\)/);
    expect(() => julianDate(Number.NaN)).toThrow(/must be finite/);
  });
});
