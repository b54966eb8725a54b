/**
 * Fundamental arguments of the nutation theory, in radians, as functions of t = Julian centuries
 * TT since J2000.0.
 *
 * Delaunay arguments and planetary longitudes: IERS Conventions 2010, chapter 5, eqs. 5.43 and
 * 5.44 (Simon et al. 1994; Souchay et al. 1999), the "IERS 2003" expressions. The MHB2000 variants
 * (Mathews, Herring & Buffett 2002) are used where IAU 2000A itself uses them (see
 * nutation-series.ts), so that our series reproduces the published model to 0.1 µas rather than
 * a near neighbour of it.
 */
import { ARCSEC, TAU } from '../units.ts';

/** Arcseconds in a full turn. */
const TURN_ARCSEC = 1_296_000;

/** Reduce a polynomial in arcseconds to radians in [0, 2π) (sign kept for negatives, like fmod). */
function arcsecondsToRadians(valueArcsec: number): number {
  return (valueArcsec % TURN_ARCSEC) * ARCSEC;
}

/** l, mean anomaly of the Moon (IERS 2003), rad. */
export function meanAnomalyMoon(t: number): number {
  return arcsecondsToRadians(485868.249036 + t * (1717915923.2178 + t * (31.8792 + t * (0.051635 + t * -0.0002447))));
}

/** l′, mean anomaly of the Sun (IERS 2003), rad. */
export function meanAnomalySun(t: number): number {
  return arcsecondsToRadians(1287104.793048 + t * (129596581.0481 + t * (-0.5532 + t * (0.000136 + t * -0.00001149))));
}

/** l′ in the MHB2000 form (constant 1287104.79305″), used by the IAU 2000A luni-solar series. */
export function meanAnomalySunMhb2000(t: number): number {
  return arcsecondsToRadians(1287104.79305 + t * (129596581.0481 + t * (-0.5532 + t * (0.000136 + t * -0.00001149))));
}

/** F = L − Ω, mean argument of latitude of the Moon (IERS 2003), rad. */
export function meanArgumentOfLatitudeMoon(t: number): number {
  return arcsecondsToRadians(335779.526232 + t * (1739527262.8478 + t * (-12.7512 + t * (-0.001037 + t * 0.00000417))));
}

/** D, mean elongation of the Moon from the Sun (IERS 2003), rad. */
export function meanElongationMoon(t: number): number {
  return arcsecondsToRadians(1072260.703692 + t * (1602961601.209 + t * (-6.3706 + t * (0.006593 + t * -0.00003169))));
}

/** D in the MHB2000 form (constant 1072260.70369″), used by the IAU 2000A luni-solar series. */
export function meanElongationMoonMhb2000(t: number): number {
  return arcsecondsToRadians(1072260.70369 + t * (1602961601.209 + t * (-6.3706 + t * (0.006593 + t * -0.00003169))));
}

/** Ω, mean longitude of the Moon's ascending node (IERS 2003), rad. */
export function meanLongitudeMoonNode(t: number): number {
  return arcsecondsToRadians(450160.398036 + t * (-6962890.5431 + t * (7.4722 + t * (0.007702 + t * -0.00005939))));
}

/** Mean longitudes of the planets (IERS 2003, linear in t), rad. */
export function meanLongitudeMercury(t: number): number {
  return (4.402608842 + 2608.7903141574 * t) % TAU;
}
export function meanLongitudeVenus(t: number): number {
  return (3.176146697 + 1021.3285546211 * t) % TAU;
}
export function meanLongitudeEarth(t: number): number {
  return (1.753470314 + 628.3075849991 * t) % TAU;
}
export function meanLongitudeMars(t: number): number {
  return (6.203480913 + 334.06124267 * t) % TAU;
}
export function meanLongitudeJupiter(t: number): number {
  return (0.599546497 + 52.9690962641 * t) % TAU;
}
export function meanLongitudeSaturn(t: number): number {
  return (0.874016757 + 21.329910496 * t) % TAU;
}
export function meanLongitudeUranus(t: number): number {
  return (5.481293872 + 7.4781598567 * t) % TAU;
}
export function meanLongitudeNeptune(t: number): number {
  return (5.311886287 + 3.8133035638 * t) % TAU;
}

/** p_A, general accumulated precession in longitude (IERS 2003), rad. */
export function generalPrecessionInLongitude(t: number): number {
  return (0.02438175 + 0.00000538691 * t) * t;
}
