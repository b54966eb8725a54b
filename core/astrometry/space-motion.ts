import type { Vec3 } from '../math/vec3.ts';
import { DAYS_PER_JULIAN_YEAR, JD_J2000, MAS } from '../units.ts';
import { KM_S_IN_AU_PER_DAY, SPEED_OF_LIGHT_AU_PER_DAY } from './constants.ts';
import type { CatalogueStar } from './star.ts';

/**
 * A star's catalogue data turned into barycentric vectors once, so propagation to many dates is
 * cheap. For a star with positive parallax: `positionAu` is the position at the catalogue epoch
 * (au, ICRS), `velocityAuPerDay` the inertial space velocity (au/day), `distanceAu` = |position|.
 * For zero or negative parallax the star is at infinite distance: `distanceAu` is Infinity,
 * `positionAu` is the unit direction and `velocityAuPerDay` the proper-motion vector on the sphere
 * in radians per day (radial velocity has no visible effect there and is ignored).
 */
export interface StarMotion {
  readonly positionAu: Vec3;
  readonly velocityAuPerDay: Vec3;
  readonly distanceAu: number;
  /** Catalogue epoch as TDB Julian date minus J2000.0 (days). */
  readonly epochDaysSinceJ2000: number;
}

/**
 * Barycentric vectors of a catalogue star. The catalogue's proper motion and radial velocity are
 * the apparent rates of a barycentric observer; the inertial velocity u follows from v_apparent =
 * u / (1 + u_r/c), i.e. u = v_apparent / (1 − v_r/c) (light-time effect on the rates, as in ERFA's
 * starpv; the special-relativistic terms of order v²/c² ≈ 1e-7 are left out: < 1 µas/yr).
 */
export function starMotion(star: CatalogueStar): StarMotion {
  const cosRa = Math.cos(star.raRad), sinRa = Math.sin(star.raRad);
  const cosDec = Math.cos(star.decRad), sinDec = Math.sin(star.decRad);
  const direction: Vec3 = [cosDec * cosRa, cosDec * sinRa, sinDec];
  const east: Vec3 = [-sinRa, cosRa, 0];
  const north: Vec3 = [-sinDec * cosRa, -sinDec * sinRa, cosDec];
  const pmEastRadPerDay = (star.pmRaCosDecMasYr * MAS) / DAYS_PER_JULIAN_YEAR;
  const pmNorthRadPerDay = (star.pmDecMasYr * MAS) / DAYS_PER_JULIAN_YEAR;
  const epochDaysSinceJ2000 = (star.epochJulianYear - 2000) * DAYS_PER_JULIAN_YEAR;
  const tangent = (k: number): number => pmEastRadPerDay * east[k] + pmNorthRadPerDay * north[k];
  if (!(star.parallaxMas > 0)) {
    return {
      positionAu: direction,
      velocityAuPerDay: [tangent(0), tangent(1), tangent(2)],
      distanceAu: Infinity,
      epochDaysSinceJ2000,
    };
  }
  const distanceAu = 1 / (star.parallaxMas * MAS);
  const radialAuPerDay = star.radialVelocityKmS * KM_S_IN_AU_PER_DAY;
  const lightTimeFactor = 1 / (1 - radialAuPerDay / SPEED_OF_LIGHT_AU_PER_DAY);
  const velocity = (k: number): number => (distanceAu * tangent(k) + radialAuPerDay * direction[k]) * lightTimeFactor;
  return {
    positionAu: [distanceAu * direction[0], distanceAu * direction[1], distanceAu * direction[2]],
    velocityAuPerDay: [velocity(0), velocity(1), velocity(2)],
    distanceAu,
    epochDaysSinceJ2000,
  };
}

/**
 * Barycentric position (au) of the star whose light reaches the barycentre at TDB `days` since
 * J2000.0, by straight-line space motion with the light-time between the two epochs solved
 * exactly (the method of ERFA's starpm): the light seen at the catalogue epoch left the star
 * d₁/c earlier; the emission time s after that satisfies c·(Δτ + d₁/c − s) = |r₁ + u·s|. For a
 * star at infinite distance, the unit direction moved linearly by the proper motion, renormalised.
 */
export function starPositionAt(motion: StarMotion, daysSinceJ2000: number): Vec3 {
  const elapsedDays = daysSinceJ2000 - motion.epochDaysSinceJ2000;
  const r = motion.positionAu;
  const u = motion.velocityAuPerDay;
  if (motion.distanceAu === Infinity) {
    const x = r[0] + u[0] * elapsedDays, y = r[1] + u[1] * elapsedDays, z = r[2] + u[2] * elapsedDays;
    const length = Math.hypot(x, y, z);
    return [x / length, y / length, z / length];
  }
  const emissionDays = emissionInterval(motion, elapsedDays);
  return [r[0] + u[0] * emissionDays, r[1] + u[1] * emissionDays, r[2] + u[2] * emissionDays];
}

/** Emission-time interval s (days) for a reception interval `elapsedDays`; stable quadratic root. */
export function emissionInterval(motion: StarMotion, elapsedDays: number): number {
  const c = SPEED_OF_LIGHT_AU_PER_DAY;
  const r = motion.positionAu, u = motion.velocityAuPerDay, d1 = motion.distanceAu;
  const rDotU = r[0] * u[0] + r[1] * u[1] + r[2] * u[2];
  const uSquared = u[0] * u[0] + u[1] * u[1] + u[2] * u[2];
  const lightDistance = c * elapsedDays;
  const k = lightDistance + d1;
  // (c² − u²) s² − 2 (k c + r·u) s + (k² − d₁²) = 0, smaller root, written without cancellation.
  const half = k * c + rDotU;
  const constant = lightDistance * (lightDistance + 2 * d1);
  return constant / (half + Math.sqrt(half * half - (c * c - uSquared) * constant));
}

/** Julian date (TDB) → days since J2000.0, kept as one number (adequate for star motion: 1e-11 day). */
export function daysSinceJ2000(jd: { readonly jd1: number; readonly jd2: number }): number {
  return jd.jd1 - JD_J2000 + jd.jd2;
}
