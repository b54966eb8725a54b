import { meanObliquity06 } from '../earth/mean-obliquity-06.ts';
import type { Nutation } from '../earth/nutation-series.ts';
import { polarMotionMatrixTirsToItrs, tioLocatorSPrime } from '../earth/polar-motion.ts';
import { fukushimaWilliamsAngles06, fukushimaWilliamsMatrix } from '../earth/precession-06.ts';
import { gmst06, normalizeAngle } from '../earth/sidereal-time.ts';
import type { Mat3 } from '../math/mat3.ts';
import type { EarthOrientation } from './earth-orientation.ts';
import type { AstrometricInstant } from './instant.ts';

/**
 * Earth orientation (as iauEarthOrientation) at five samples of a night, the centre being
 * samples[2] and the samples `offsetsDays` apart from it, with the nutation of each sample given
 * (`nutations`) and one value of the equation of the equinoxes' complementary terms. Instead of
 * five Fukushima–Williams matrices, NPB at each sample is the centre's matrix moved to first
 * order: by the precession change (from one more matrix at the last sample, linear in time) and
 * by the nutation change (analytic derivatives ∂NPB/∂Δψ, ∂NPB/∂Δε). The terms left out are of
 * second order: precession (≈ 0.07″ per half day)² and nutation change (≲ 0.06″)², 4e-13 rad at
 * most per element over 1900–2100 (unit/astrometry/night-nutation.test.ts).
 * Polar motion: the matrices at the centre and ends, the quarter samples their means (the pole
 * moves linearly between the instants a time scale was asked for). GAST as iauEarthOrientation.
 */
export function nightOrientations(
  samples: readonly AstrometricInstant[],
  offsetsDays: readonly number[],
  nutations: readonly Nutation[],
  complementaryTermsRad: number,
): EarthOrientation[] {
  const centre = samples[2], last = samples[4];
  const n = nutations[2];
  const angles = fukushimaWilliamsAngles06(centre.tt);
  const epsilon = angles.meanObliquityRad + n.depsRad;
  const npbCentre = fukushimaWilliamsMatrix(angles.gammaBarRad, angles.phiBarRad, angles.psiBarRad + n.dpsiRad, epsilon);
  const later = fukushimaWilliamsAngles06(last.tt);
  const npbLast = fukushimaWilliamsMatrix(later.gammaBarRad, later.phiBarRad, later.psiBarRad + n.dpsiRad, later.meanObliquityRad + n.depsRad);
  const perPsi = derivativePerPsi(npbCentre, epsilon);
  const perEpsilon = derivativePerEpsilon(npbCentre);
  const poles = [pole(samples[0]), undefined, pole(centre), undefined, pole(last)];
  poles[1] = mean(poles[0] as Mat3, poles[2] as Mat3);
  poles[3] = mean(poles[2] as Mat3, poles[4] as Mat3);
  const orientations: EarthOrientation[] = [];
  for (let k = 0; k < samples.length; k++) {
    const time = offsetsDays[k] / offsetsDays[4];
    const dpsi = nutations[k].dpsiRad - n.dpsiRad, deps = nutations[k].depsRad - n.depsRad;
    const npb = new Array<number>(9);
    for (let e = 0; e < 9; e++) npb[e] = npbCentre[e] + (npbLast[e] - npbCentre[e]) * time + perPsi[e] * dpsi + perEpsilon[e] * deps;
    const instant = samples[k];
    // Equation of the equinoxes, IAU 2006 form (IERS 2010 eq. 5.35), as iauEarthOrientation.
    const equationOfEquinoxes = nutations[k].dpsiRad * Math.cos(meanObliquity06(instant.tt)) + complementaryTermsRad;
    orientations.push({
      npb: npb as unknown as Mat3,
      gastRad: normalizeAngle(gmst06(instant.ut1, instant.tt) + equationOfEquinoxes),
      polarMotion: poles[k] as Mat3,
    });
  }
  return orientations;
}

function pole(instant: AstrometricInstant): Mat3 {
  return polarMotionMatrixTirsToItrs(instant.xpRad, instant.ypRad, tioLocatorSPrime(instant.tt));
}

function mean(a: Mat3, b: Mat3): Mat3 {
  return a.map((value, e) => (value + b[e]) / 2) as unknown as Mat3;
}

/**
 * ∂NPB/∂Δψ for NPB = R1(−ε)·R3(−ψ)·Y: −R1(−ε)·G₃·R1(ε)·NPB, with G₃ the generator of R3
 * (dR3(a)/da = G₃·R3(a), G₃ = [[0, 1, 0], [−1, 0, 0], [0, 0, 0]]); ε the true obliquity.
 * R1(−ε)·G₃·R1(ε) = [[0, c, s], [−c, 0, 0], [−s, 0, 0]] with c = cos ε, s = sin ε.
 */
function derivativePerPsi(npb: Mat3, epsilonRad: number): number[] {
  const c = Math.cos(epsilonRad), s = Math.sin(epsilonRad);
  const out = new Array<number>(9);
  for (let col = 0; col < 3; col++) {
    const r0 = npb[col], r1 = npb[3 + col], r2 = npb[6 + col];
    out[col] = -(c * r1 + s * r2);
    out[3 + col] = c * r0;
    out[6 + col] = s * r0;
  }
  return out;
}

/** ∂NPB/∂Δε for NPB = R1(−ε)·X: −G₁·NPB, G₁ = [[0, 0, 0], [0, 0, 1], [0, −1, 0]] (dR1(a)/da = G₁·R1(a)). */
function derivativePerEpsilon(npb: Mat3): number[] {
  return [0, 0, 0, -npb[6], -npb[7], -npb[8], npb[3], npb[4], npb[5]];
}
