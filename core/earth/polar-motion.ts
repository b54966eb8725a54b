/**
 * Polar motion: the TIO locator s′ and the polar-motion matrix W.
 *
 *  - s′ ≈ −47 µas · t (t in Julian centuries TT): Lambert & Bizouard (2002); IERS Conventions 2010
 *    eq. 5.13. Good to a few µas for present-day polar motion.
 *  - W = R3(−s′)·R2(x_p)·R1(y_p) (IERS Conventions 2010 eq. 5.3), mapping ITRS → TIRS:
 *    v_TIRS = W · v_ITRS. Its transpose maps TIRS → ITRS and equals IAU SOFA pom00.
 * x_p, y_p are the IERS pole coordinates in radians (x toward Greenwich, y toward 90° W).
 */
import { julianCenturiesSinceJ2000, type JulianDate } from '../time/julian-date.ts';
import { UAS } from '../units.ts';
import { multiply, rotationX, rotationY, rotationZ, transpose, type Mat3 } from '../math/mat3.ts';

/** The TIO locator s′ in radians at TT `tt`. */
export function tioLocatorSPrime(tt: JulianDate): number {
  return -47 * UAS * julianCenturiesSinceJ2000(tt);
}

/** W = R3(−s′)·R2(x_p)·R1(y_p): ITRS → TIRS (IERS Conventions 2010 eq. 5.3). */
export function polarMotionMatrix(xpRad: number, ypRad: number, sPrimeRad: number): Mat3 {
  return multiply(rotationZ(-sPrimeRad), multiply(rotationY(xpRad), rotationX(ypRad)));
}

/** Wᵀ: TIRS → ITRS, the orientation of IAU SOFA pom00 (the last rotation toward a terrestrial frame). */
export function polarMotionMatrixTirsToItrs(xpRad: number, ypRad: number, sPrimeRad: number): Mat3 {
  return transpose(polarMotionMatrix(xpRad, ypRad, sPrimeRad));
}
