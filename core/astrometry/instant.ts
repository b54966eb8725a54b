import type { JulianDate } from '../time/julian-date.ts';

/**
 * What the astrometric model needs to know about one instant. Julian dates are two-part
 * (`jd1 + jd2` days); the structure matches `JulianDate` of core/time so an `Instant` from
 * `TimeScale` can be passed straight in.
 */
export type TwoPartJulianDate = JulianDate;

/**
 * An instant in the time scales the reduction uses. `tt`: Terrestrial Time (also used as TDB for the
 * ephemeris and for star epochs: |TDB − TT| < 2 ms moves a 10″/yr star by 1e-9″ and Earth by 60 m).
 * `ut1`: UT1, for Earth rotation. `xpRad`, `ypRad`: polar motion (IERS convention, radians).
 */
export interface AstrometricInstant {
  readonly tt: TwoPartJulianDate;
  readonly ut1: TwoPartJulianDate;
  readonly xpRad: number;
  readonly ypRad: number;
}
