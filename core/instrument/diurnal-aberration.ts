import { culminationDeclinationRad } from './culmination.ts';
import type { Culmination } from './culmination.ts';

/** Earth's nominal angular velocity (rad/s), GRS80 / IERS Conventions 2010 table 1.1. */
const EARTH_ANGULAR_VELOCITY_RAD_S = 7.292115e-5;
/** GRS80 / WGS84 equatorial radius (m). */
const EQUATORIAL_RADIUS_M = 6_378_137;
/** Speed of light (m/s), exact by the SI definition. */
const SPEED_OF_LIGHT_M_S = 299_792_458;

/**
 * Constant of diurnal aberration at the equator (rad): ω·a/c = 1.5514e-6 rad = 0.3200″ = 0.02133 s
 * of time (the classical 0.32″ cos φ, or 0.021 s cos φ sec δ at transit: Smart, Text-Book on
 * Spherical Astronomy, diurnal aberration).
 */
export const DIURNAL_ABERRATION_CONSTANT_RAD = (EARTH_ANGULAR_VELOCITY_RAD_S * EQUATORIAL_RADIUS_M) / SPEED_OF_LIGHT_M_S;

/**
 * Where diurnal aberration is applied. The reduction must apply it exactly once:
 * - `apparent-place`: the apparent (topocentric) place from core/astrometry already contains it
 *   (an observer's velocity included in the aberration step), so the instrument model adds nothing;
 * - `instrument-model`: the apparent place is geocentric, and diurnalAberrationCorrectionRad() is
 *   added to the observed time here.
 */
export type DiurnalAberrationSource = 'apparent-place' | 'instrument-model';

/**
 * Correction (rad of hour angle) to ADD to the observed sidereal time of transit for diurnal
 * aberration: −k cos φ sec δ' (δ' as in culmination.ts), i.e. −0.0213 s cos φ sec δ at upper
 * culmination (the star appears displaced toward the east point and transits late) and
 * +0.0213 s cos φ sec δ at lower culmination. It acts like a collimation of −k cos φ that does not
 * change sign on reversal. Accuracy: 0.001″ — the geocentric radius ρ cos φ′ is replaced by
 * a cos φ (difference ≤ 0.34 %), and height above the ellipsoid is neglected (1.6e-4 per km).
 */
export function diurnalAberrationCorrectionRad(latitudeRad: number, declinationRad: number, culmination: Culmination): number {
  const effective = culminationDeclinationRad(declinationRad, culmination);
  return (-DIURNAL_ABERRATION_CONSTANT_RAD * Math.cos(latitudeRad)) / Math.cos(effective);
}
