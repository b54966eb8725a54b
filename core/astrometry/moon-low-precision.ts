import type { Vec3 } from '../math/vec3.ts';
import { DEG, JD_J2000 } from '../units.ts';

/**
 * Geocentric position of the Moon (au; the ecliptic longitude of date brought to J2000 by the
 * general precession, then rotated by the J2000 obliquity to equatorial axes) from the low-precision formulae of the Astronomical Almanac
 * (section D, "low-precision formulae for the Moon"; coefficients from memory): about 0.3° in
 * direction and 0.2% in distance. Used only for the Moon's pull on Earth inside a night, where
 * 5° would do (see night-context.ts). `daysSinceJ2000` is TT.
 */
export function moonGeocentricAu(daysSinceJ2000: number): Vec3 {
  const t = daysSinceJ2000 / 36525;
  const s = (a: number, b: number) => Math.sin((a + b * t) * DEG);
  const c = (a: number, b: number) => Math.cos((a + b * t) * DEG);
  // Minus the general precession in longitude (5029″ per century) to refer it to J2000.
  const longitude = (218.32 - 1.397 * t + 481267.881 * t + 6.29 * s(135.0, 477198.87) - 1.27 * s(259.3, -413335.36)
    + 0.66 * s(235.7, 890534.22) + 0.21 * s(269.9, 954397.7) - 0.19 * s(357.5, 35999.05)
    - 0.11 * s(186.5, 966404.05)) * DEG;
  const latitude = (5.13 * s(93.3, 483202.03) + 0.28 * s(228.2, 960400.87) - 0.28 * s(318.3, 6003.18)
    - 0.17 * s(217.6, -407332.2)) * DEG;
  const parallax = (0.9508 + 0.0518 * c(135.0, 477198.87) + 0.0095 * c(259.3, -413335.38)
    + 0.0078 * c(235.7, 890534.23) + 0.0028 * c(269.9, 954397.7)) * DEG;
  const distanceAu = 6378.14 / Math.sin(parallax) / 149_597_870.7;
  const x = Math.cos(latitude) * Math.cos(longitude);
  const y = Math.cos(latitude) * Math.sin(longitude);
  const z = Math.sin(latitude);
  const obliquity = 23.4393 * DEG;
  return [
    distanceAu * x,
    distanceAu * (Math.cos(obliquity) * y - Math.sin(obliquity) * z),
    distanceAu * (Math.sin(obliquity) * y + Math.cos(obliquity) * z),
  ];
}

/** TT Julian date → days since J2000.0 (helper for callers holding a two-part date). */
export function ttDays(jd1: number, jd2: number): number {
  return jd1 - JD_J2000 + jd2;
}
