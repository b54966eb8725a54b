/**
 * Which passage of the meridian a transit is, and which way the axis lies in its bearings.
 *
 * Upper culmination: the star crosses the meridian above the pole (moving west).
 * Lower culmination: below the pole (moving east); every formula of this folder then uses the
 * supplementary declination δ' = 180° − δ, the classical device that makes one formula serve both
 * passages (Chauvenet, Manual of Spherical and Practical Astronomy, vol. II, transit instrument).
 */
export type Culmination = 'upper' | 'lower';

/**
 * Clamp (or circle) position of a reversible transit instrument. Reversing the axis in its
 * bearings changes the sign of the collimation error c and of every wire's equatorial interval.
 * Our convention (ours; observatories differ): the constants c and the wire intervals are stated
 * for clamp WEST; with clamp EAST they enter with the opposite sign. `none` is for instruments
 * that are not reversed (fixed cameras, a zenith tube in one position): sign +1.
 */
export type ClampPosition = 'east' | 'west' | 'none';

/** +1 for clamp west or none, −1 for clamp east: the factor applied to c and to wire intervals. */
export function clampSign(clamp: ClampPosition): 1 | -1 {
  return clamp === 'east' ? -1 : 1;
}

/**
 * The declination (rad) that enters Mayer's, Bessel's and Hansen's factors: δ for upper
 * culmination, 180° − δ for lower culmination. Throws when |δ| > 90°, which no star has.
 */
export function culminationDeclinationRad(declinationRad: number, culmination: Culmination): number {
  if (!(Math.abs(declinationRad) <= Math.PI / 2)) {
    throw new RangeError(
      `culminationDeclinationRad: declination ${declinationRad} rad is outside [−π/2, π/2]; pass the star's declination in radians`,
    );
  }
  return culmination === 'upper' ? declinationRad : Math.PI - declinationRad;
}
