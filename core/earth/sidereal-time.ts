/**
 * Earth rotation angle and Greenwich sidereal time (IAU 2000/2006).
 *
 *  - ERA (IAU 2000 Resolution B1.8; IERS Conventions 2010 eq. 5.15):
 *    θ = 2π (0.7790572732640 + 1.00273781191135448 D_U), D_U = JD(UT1) − 2451545.0.
 *  - GMST (IAU 2006; Capitaine, Wallace & Chapront 2005, A&A 432, 355, eq. 42; IERS Conventions
 *    2010 eq. 5.32): GMST = θ + 0.014506″ + 4612.156534″ t + 1.3915817″ t² − 0.00000044″ t³
 *    − 0.000029956″ t⁴ − 0.0000000368″ t⁵, t in Julian centuries TT.
 *  - GAST = GMST + equation of the equinoxes (equation-of-equinoxes-06.ts).
 * All results in radians in [0, 2π). Accuracy: ERA and GMST are definitions (exact to double
 * rounding, about 1 µas, with a two-part UT1); GAST matches IAU SOFA gst06a to 0.6 µas when
 * given nutation06a (measured in unit/earth/earth-orientation.test.ts).
 */
import { julianCenturiesSinceJ2000, type JulianDate } from '../time/julian-date.ts';
import { ARCSEC, JD_J2000, TAU } from '../units.ts';
import { equationOfEquinoxes06 } from './equation-of-equinoxes-06.ts';
import type { Nutation } from './nutation-series.ts';

/** Angle reduced to [0, 2π). */
export function normalizeAngle(angleRad: number): number {
  const reduced = angleRad % TAU;
  return reduced < 0 ? reduced + TAU : reduced;
}

/** Earth rotation angle θ in radians at UT1 `ut1` (IAU 2000). */
export function earthRotationAngle(ut1: JulianDate): number {
  // The whole turns of 1.0 × D_U are dropped before scaling, keeping full precision.
  const days = ut1.jd1 - JD_J2000 + ut1.jd2;
  const fractionOfDay = (ut1.jd1 % 1) + (ut1.jd2 % 1);
  return normalizeAngle(TAU * (fractionOfDay + 0.779057273264 + 0.00273781191135448 * days));
}

/** Greenwich mean sidereal time in radians, IAU 2006, at UT1 `ut1` and TT `tt` of one instant. */
export function gmst06(ut1: JulianDate, tt: JulianDate): number {
  const t = julianCenturiesSinceJ2000(tt);
  const polynomialArcsec =
    0.014506 + t * (4612.156534 + t * (1.3915817 + t * (-0.00000044 + t * (-0.000029956 + t * -0.0000000368))));
  return normalizeAngle(earthRotationAngle(ut1) + polynomialArcsec * ARCSEC);
}

/**
 * Greenwich apparent sidereal time in radians at UT1 `ut1` and TT `tt`, with the nutation of date
 * (nutation06a(tt) for IAU 2006/2000A; nutation00b(tt) for the 1 mas model).
 */
export function gast06(ut1: JulianDate, tt: JulianDate, nutation: Nutation): number {
  return normalizeAngle(gmst06(ut1, tt) + equationOfEquinoxes06(tt, nutation));
}
