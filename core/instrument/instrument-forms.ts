import { culminationDeclinationRad } from './culmination.ts';
import type { Culmination } from './culmination.ts';
import type { MayerConstants } from './mayer.ts';

/**
 * Bessel's form of the transit constants (rad): τ = m + n·tan δ' + c·sec δ'.
 * m and n are the components of the axis's deviation referred to the pole: m = a sin φ + b cos φ,
 * n = b sin φ − a cos φ (Chauvenet, Manual of Spherical and Practical Astronomy, vol. II;
 * Smart, Text-Book on Spherical Astronomy). δ' as in culmination.ts.
 */
export interface BesselConstants {
  readonly mRad: number;
  readonly nRad: number;
  readonly collimationRad: number;
}

/**
 * Hansen's form (rad): τ = u·cos(φ − δ') sec δ' + v·tan δ' + c·sec δ', i.e. Mayer's level factor
 * kept and the azimuth folded into Bessel's declination factor: u = b + a tan φ, v = −a sec φ.
 * The identity is exact algebra (checked to 1e-12 in unit/instrument/instrument-forms.test.ts); the
 * attribution of this arrangement to Hansen is from memory (Chauvenet, vol. II) — check the
 * notebook's own definitions before converting its numbers.
 */
export interface HansenConstants {
  readonly levelLikeRad: number;
  readonly declinationLikeRad: number;
  readonly collimationRad: number;
}

function requireLatitude(latitudeRad: number, where: string): void {
  if (!(Math.abs(latitudeRad) < Math.PI / 2 - 1e-9)) {
    throw new RangeError(`${where}: latitude ${latitudeRad} rad must lie strictly between the poles (sec φ is infinite there)`);
  }
}

/** Mayer (a, b, c) → Bessel (m, n, c) at latitude φ (rad). Exact. */
export function mayerToBessel(mayer: MayerConstants, latitudeRad: number): BesselConstants {
  const s = Math.sin(latitudeRad);
  const k = Math.cos(latitudeRad);
  return {
    mRad: mayer.azimuthRad * s + mayer.levelRad * k,
    nRad: mayer.levelRad * s - mayer.azimuthRad * k,
    collimationRad: mayer.collimationRad,
  };
}

/** Bessel (m, n, c) → Mayer (a, b, c): a = m sin φ − n cos φ, b = m cos φ + n sin φ. Exact. */
export function besselToMayer(bessel: BesselConstants, latitudeRad: number): MayerConstants {
  const s = Math.sin(latitudeRad);
  const k = Math.cos(latitudeRad);
  return {
    azimuthRad: bessel.mRad * s - bessel.nRad * k,
    levelRad: bessel.mRad * k + bessel.nRad * s,
    collimationRad: bessel.collimationRad,
  };
}

/** Mayer → Hansen: u = b + a tan φ, v = −a sec φ. Throws at the poles. */
export function mayerToHansen(mayer: MayerConstants, latitudeRad: number): HansenConstants {
  requireLatitude(latitudeRad, 'mayerToHansen');
  return {
    levelLikeRad: mayer.levelRad + mayer.azimuthRad * Math.tan(latitudeRad),
    declinationLikeRad: -mayer.azimuthRad / Math.cos(latitudeRad),
    collimationRad: mayer.collimationRad,
  };
}

/** Hansen → Mayer: a = −v cos φ, b = u + v sin φ. */
export function hansenToMayer(hansen: HansenConstants, latitudeRad: number): MayerConstants {
  requireLatitude(latitudeRad, 'hansenToMayer');
  const azimuthRad = -hansen.declinationLikeRad * Math.cos(latitudeRad);
  return {
    azimuthRad,
    levelRad: hansen.levelLikeRad + hansen.declinationLikeRad * Math.sin(latitudeRad),
    collimationRad: hansen.collimationRad,
  };
}

/** Bessel's correction τ (rad) before the clamp sign of c: m + n tan δ' + c sec δ'. */
export function besselCorrectionRad(bessel: BesselConstants, declinationRad: number, culmination: Culmination, collimationSign: 1 | -1): number {
  const d = culminationDeclinationRad(declinationRad, culmination);
  return bessel.mRad + bessel.nRad * Math.tan(d) + collimationSign * bessel.collimationRad / Math.cos(d);
}

/** Hansen's correction τ (rad): u cos(φ − δ') sec δ' + v tan δ' + (±c) sec δ'. */
export function hansenCorrectionRad(
  hansen: HansenConstants,
  latitudeRad: number,
  declinationRad: number,
  culmination: Culmination,
  collimationSign: 1 | -1,
): number {
  const d = culminationDeclinationRad(declinationRad, culmination);
  const secant = 1 / Math.cos(d);
  return hansen.levelLikeRad * Math.cos(latitudeRad - d) * secant + hansen.declinationLikeRad * Math.tan(d) + collimationSign * hansen.collimationRad * secant;
}
