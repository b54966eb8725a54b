import { clampSign, culminationDeclinationRad } from './culmination.ts';
import type { ClampPosition, Culmination } from './culmination.ts';

/**
 * Instrument constants of a transit instrument in Mayer's form, all in radians of angle.
 *
 * Sign conventions (the classical ones, e.g. W. M. Smart, Text-Book on Spherical Astronomy,
 * chapter on the meridian circle; re-derived in unit/instrument/mayer.test.ts against the exact
 * geometry):
 * - `azimuthRad` a: positive when the WEST end of the axis is displaced toward the SOUTH, i.e.
 *   when the instrument, looking south, points EAST of the meridian.
 * - `levelRad` b: positive when the WEST end of the axis is HIGH.
 * - `collimationRad` c: positive when the line of sight, clamp west, makes 90° + c with the west
 *   end of the axis, i.e. lies EAST of the plane perpendicular to the axis at upper culmination.
 *   With these signs every positive constant makes a star at upper culmination cross EARLY, so the
 *   corrections below are ADDED to the observed time.
 */
export interface MayerConstants {
  readonly azimuthRad: number;
  readonly levelRad: number;
  readonly collimationRad: number;
}

/** Mayer's factors A, B, C (dimensionless) for one star. */
export interface MayerFactors {
  readonly azimuthFactor: number;
  readonly levelFactor: number;
  readonly collimationFactor: number;
}

/**
 * Mayer's factors A = sin(φ − δ') sec δ', B = cos(φ − δ') sec δ', C = sec δ', with δ' = δ at upper
 * and 180° − δ at lower culmination (so C = −sec δ below the pole).
 *
 * `latitudeRad` φ: astronomical latitude, north positive. `declinationRad` δ: apparent declination
 * of date. First-order formula: neglected terms are of order (a² + b² + c²)·sec δ·tan δ, below
 * 0.1 mas for constants under 1 s of time and |δ| < 80°.
 * Source: Mayer's formula, e.g. Chauvenet, Manual of Spherical and Practical Astronomy, vol. II.
 */
export function mayerFactors(latitudeRad: number, declinationRad: number, culmination: Culmination): MayerFactors {
  const effective = culminationDeclinationRad(declinationRad, culmination);
  const secant = 1 / Math.cos(effective);
  if (!Number.isFinite(secant) || Math.abs(secant) > 1e8) {
    throw new RangeError(`mayerFactors: declination ${declinationRad} rad is at the pole, where sec δ is infinite; a star at the pole has no transit`);
  }
  return {
    azimuthFactor: Math.sin(latitudeRad - effective) * secant,
    levelFactor: Math.cos(latitudeRad - effective) * secant,
    collimationFactor: secant,
  };
}

/**
 * Mayer's correction τ (rad of hour angle) to ADD to the clock-corrected observed sidereal time
 * of the mean wire to obtain the star's apparent right ascension (+12 h at lower culmination):
 * α = θ_observed + a·A + b·B + (±c)·C, the sign of c from the clamp position (see culmination.ts).
 */
export function mayerCorrectionRad(constants: MayerConstants, factors: MayerFactors, clamp: ClampPosition): number {
  return (
    constants.azimuthRad * factors.azimuthFactor +
    constants.levelRad * factors.levelFactor +
    clampSign(clamp) * constants.collimationRad * factors.collimationFactor
  );
}
