import { equinoxComplementaryTerms } from '../earth/equation-of-equinoxes-06.ts';
import { meanObliquity06 } from '../earth/mean-obliquity-06.ts';
import { nutation06a, type Nutation } from '../earth/nutation-series.ts';
import { polarMotionMatrixTirsToItrs, tioLocatorSPrime } from '../earth/polar-motion.ts';
import { biasPrecessionNutationMatrix06 } from '../earth/precession-06.ts';
import { gmst06, normalizeAngle } from '../earth/sidereal-time.ts';
import type { EarthOrientation } from './earth-orientation.ts';
import type { AstrometricInstant } from './instant.ts';

/**
 * Earth orientation of the IAU 2006/2000A models (the models of IAU SOFA pnm06a, gst06a, pom00):
 * NPB from the IAU 2006 Fukushima–Williams angles with IAU 2000A nutation (IAU 2006 adjusted),
 * GAST = GMST06 + equation of the equinoxes, polar motion with s′. Accuracy: that of the IAU models,
 * a few 0.1 mas against VLBI; against ERFA to µas (core/earth tests). Costs one full 1365-term
 * nutation (tens of µs): per night, not per star. `nutation` and the equation of the equinoxes'
 * complementary terms (≤ 3 mas, periods ≥ 9 days: one value serves a night within 1 µas) may be
 * passed when already computed.
 */
export function iauEarthOrientation(
  instant: AstrometricInstant,
  nutation: Nutation = nutation06a(instant.tt),
  complementaryTermsRad: number = equinoxComplementaryTerms(instant.tt),
): EarthOrientation {
  // Equation of the equinoxes, IAU 2006 form: Δψ cos ε̄ + complementary terms (IERS 2010 eq. 5.35).
  const equationOfEquinoxes = nutation.dpsiRad * Math.cos(meanObliquity06(instant.tt)) + complementaryTermsRad;
  return {
    npb: biasPrecessionNutationMatrix06(instant.tt, nutation),
    gastRad: normalizeAngle(gmst06(instant.ut1, instant.tt) + equationOfEquinoxes),
    polarMotion: polarMotionMatrixTirsToItrs(instant.xpRad, instant.ypRad, tioLocatorSPrime(instant.tt)),
  };
}
