import { DEG, HOUR_ANGLE, MJD_ZERO, JD_J2000 } from '../units.ts';

/**
 * Low-precision helpers for planning the simulated nights (not for the measurements themselves,
 * which come from core/astrometry): the Sun's altitude and the approximate sidereal time.
 */

/** Greenwich mean sidereal time (rad) at UT `mjd`: 18.697374558 h + 24.06570982441908 h·D
 * (the U.S. Naval Observatory's approximate formula, 0.1 s per century). */
export function approximateGmstRad(mjd: number): number {
  const daysSinceJ2000 = mjd + MJD_ZERO - JD_J2000;
  const hours = 18.697374558 + 24.06570982441908 * daysSinceJ2000;
  return ((((hours % 24) + 24) % 24) * HOUR_ANGLE);
}

/**
 * The Sun's apparent right ascension and declination (rad) at `mjd`, from the Astronomical
 * Almanac's low-precision formulae (section C, "Sun"): 0.01° from 1950 to 2050.
 */
export function approximateSunRaDec(mjd: number): { raRad: number; decRad: number } {
  const n = mjd + MJD_ZERO - JD_J2000;
  const meanLongitudeDeg = 280.46 + 0.9856474 * n;
  const meanAnomalyRad = (357.528 + 0.9856003 * n) * DEG;
  const eclipticLongitudeRad = (meanLongitudeDeg + 1.915 * Math.sin(meanAnomalyRad) + 0.02 * Math.sin(2 * meanAnomalyRad)) * DEG;
  const obliquityRad = (23.439 - 4e-7 * n) * DEG;
  return {
    raRad: Math.atan2(Math.cos(obliquityRad) * Math.sin(eclipticLongitudeRad), Math.cos(eclipticLongitudeRad)),
    decRad: Math.asin(Math.sin(obliquityRad) * Math.sin(eclipticLongitudeRad)),
  };
}

/** The Sun's geometric altitude (rad) at `mjd` (UTC ≈ UT) from a site (rad, east longitude positive). */
export function approximateSunAltitudeRad(mjd: number, latitudeRad: number, longitudeRad: number): number {
  const sun = approximateSunRaDec(mjd);
  const hourAngle = approximateGmstRad(mjd) + longitudeRad - sun.raRad;
  return Math.asin(Math.sin(latitudeRad) * Math.sin(sun.decRad) + Math.cos(latitudeRad) * Math.cos(sun.decRad) * Math.cos(hourAngle));
}

/** The dark part of one night: UTC MJDs when the Sun goes below and comes back above the limit. */
export interface DarkWindow {
  readonly startMjd: number;
  readonly endMjd: number;
}

/**
 * The interval, between local noon of the night's date and the next local noon, during which the
 * Sun is below `sunLimitDeg` (e.g. −12°, nautical darkness); null when it never gets that dark.
 * Found on a 10-minute grid and refined by bisection to a few seconds.
 */
export function darkWindow(localNoonUtcMjd: number, latitudeRad: number, longitudeRad: number, sunLimitDeg: number): DarkWindow | null {
  const limit = sunLimitDeg * DEG;
  const below = (mjd: number): boolean => approximateSunAltitudeRad(mjd, latitudeRad, longitudeRad) < limit;
  const step = 10 / 1440;
  let start: number | null = null;
  let end: number | null = null;
  let previous = below(localNoonUtcMjd);
  for (let t = localNoonUtcMjd + step; t <= localNoonUtcMjd + 1 + 1e-9; t += step) {
    const now = below(t);
    if (now && !previous && start === null) start = bisect(below, t - step, t, true);
    if (!now && previous && start !== null) { end = bisect(below, t - step, t, false); break; }
    previous = now;
  }
  if (start === null || end === null) return null;
  return { startMjd: start, endMjd: end };
}

function bisect(below: (mjd: number) => boolean, low: number, high: number, goingDark: boolean): number {
  for (let i = 0; i < 12; i++) {
    const middle = (low + high) / 2;
    if (below(middle) === goingDark) high = middle;
    else low = middle;
  }
  return (low + high) / 2;
}
