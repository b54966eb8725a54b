import { clampSign } from './culmination.ts';
import type { ClampPosition, Culmination } from './culmination.ts';
import type { MayerConstants } from './mayer.ts';

/**
 * The exact correction τ (rad of hour angle) for a transit instrument with constants a, b, c:
 * the star crosses the line of sight at hour angle h, and α = θ_observed + τ with τ = −h (upper
 * culmination) or τ = π − h (lower culmination, α + 12 h on the left).
 *
 * Geometry (ours, from the definitions in mayer.ts): the west end of the axis points to azimuth
 * a south of west at altitude b; the line of sight makes 90° + c·(clamp sign) with it. Writing the
 * star at hour angle h, the crossing condition is P sin h + Q cos h = R with
 * P = cos δ cos a cos b, Q = cos δ (sin a cos b sin φ + sin b cos φ),
 * R = −sin c − sin δ (sin b sin φ − sin a cos b cos φ); solved in closed form.
 * To first order τ reduces to Mayer's a·A + b·B + c·C (checked in the tests); use this function for
 * simulation and for large constants. Throws when the star never meets the line of sight.
 */
export function exactTransitCorrectionRad(
  constants: MayerConstants,
  latitudeRad: number,
  declinationRad: number,
  culmination: Culmination,
  clamp: ClampPosition,
): number {
  const { azimuthRad: a, levelRad: b } = constants;
  const c = clampSign(clamp) * constants.collimationRad;
  const cosDec = Math.cos(declinationRad);
  const p = cosDec * Math.cos(a) * Math.cos(b);
  const q = cosDec * (Math.sin(a) * Math.cos(b) * Math.sin(latitudeRad) + Math.sin(b) * Math.cos(latitudeRad));
  const r = -Math.sin(c) - Math.sin(declinationRad) * (Math.sin(b) * Math.sin(latitudeRad) - Math.sin(a) * Math.cos(b) * Math.cos(latitudeRad));
  const amplitude = Math.hypot(p, q);
  const ratio = r / amplitude;
  if (!(Math.abs(ratio) <= 1)) {
    throw new RangeError(
      `exactTransitCorrectionRad: declination ${declinationRad} rad never meets the line of sight with these constants (|R/√(P²+Q²)| = ${Math.abs(ratio)} > 1); the star is too close to the pole of the axis`,
    );
  }
  const psi = Math.atan2(q, p);
  const arc = Math.asin(ratio);
  return culmination === 'upper' ? psi - arc : psi + arc;
}
