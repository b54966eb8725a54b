/**
 * Equation of the equinoxes, IAU 2006/2000: EE = Δψ cos ε_A + Σ complementary terms
 * (IERS Conventions 2010 eq. 5.30 with table 5.2e; Capitaine, Wallace & McCarthy 2003), radians.
 * Δψ is the caller's nutation (nutation06a for IAU 2006/2000A consistency); ε_A the IAU 2006 mean
 * obliquity. The complementary terms amount to 2.6 mas at most; our total matches the
 * CIO-based IAU SOFA ee06a (gst06a − gmst06) to 0.6 µas over 1900–2100 (measured in
 * unit/earth/earth-orientation.test.ts).
 */
import { julianCenturiesSinceJ2000, type JulianDate } from '../time/julian-date.ts';
import { ARCSEC } from '../units.ts';
import {
  COMPLEMENTARY_AMPLITUDES_ARCSEC,
  COMPLEMENTARY_MULTIPLIERS,
  COMPLEMENTARY_T0_COUNT,
  COMPLEMENTARY_T1_COUNT,
} from './equinox-complementary-terms.ts';
import * as arg from './fundamental-arguments.ts';
import { HarmonicArguments } from './harmonic-arguments.ts';
import { meanObliquity06 } from './mean-obliquity-06.ts';
import type { Nutation } from './nutation-series.ts';

const fundamental = new Float64Array(8);
const harmonics = new HarmonicArguments(COMPLEMENTARY_MULTIPLIERS, 8);

/** The complementary terms of the equation of the equinoxes at TT `tt`, radians. */
export function equinoxComplementaryTerms(tt: JulianDate): number {
  const t = julianCenturiesSinceJ2000(tt);
  fundamental[0] = arg.meanAnomalyMoon(t);
  fundamental[1] = arg.meanAnomalySun(t);
  fundamental[2] = arg.meanArgumentOfLatitudeMoon(t);
  fundamental[3] = arg.meanElongationMoon(t);
  fundamental[4] = arg.meanLongitudeMoonNode(t);
  fundamental[5] = arg.meanLongitudeVenus(t);
  fundamental[6] = arg.meanLongitudeEarth(t);
  fundamental[7] = arg.generalPrecessionInLongitude(t);
  const termCount = COMPLEMENTARY_T0_COUNT + COMPLEMENTARY_T1_COUNT;
  harmonics.evaluate(fundamental, termCount);
  let sumT0 = 0;
  let sumT1 = 0;
  for (let i = termCount - 1; i >= 0; i--) {
    const term = COMPLEMENTARY_AMPLITUDES_ARCSEC[2 * i] * harmonics.sines[i] + COMPLEMENTARY_AMPLITUDES_ARCSEC[2 * i + 1] * harmonics.cosines[i];
    if (i >= COMPLEMENTARY_T0_COUNT) sumT1 += term;
    else sumT0 += term;
  }
  return (sumT0 + sumT1 * t) * ARCSEC;
}

/** Equation of the equinoxes (radians) at TT `tt` for the given nutation of date. */
export function equationOfEquinoxes06(tt: JulianDate, nutation: Nutation): number {
  return nutation.dpsiRad * Math.cos(meanObliquity06(tt)) + equinoxComplementaryTerms(tt);
}
