import { clampSign } from '../instrument/culmination.ts';
import { solveLeastSquares } from '../instrument/small-least-squares.ts';
import { STELLAR_REVOLUTIONS_PER_UT1_DAY } from '../instrument/wire-reduction.ts';
import { SECONDS_PER_DAY } from '../units.ts';
import { clockCorrectionAtS } from './night-clock.ts';
import type { NightClockModel } from './night-clock.ts';
import type { PreparedTransit } from './prepare-transits.ts';

/** The right-ascension constants: which are free, and the values of those that are not. */
export interface TimeTerms {
  readonly clock: NightClockModel;
  readonly freeClockOffset: boolean;
  readonly freeClockRate: boolean;
  readonly azimuthArcsec: number | null;
  readonly levelArcsec: number | null;
  readonly collimationArcsec: number | null;
}

/** Fitted right-ascension constants, each with its formal error (null when held). */
export interface TimeSolution {
  readonly clock: NightClockModel;
  readonly azimuthArcsec: number;
  readonly levelArcsec: number;
  readonly collimationArcsec: number;
  readonly sigmas: { readonly clockOffsetS: number | null; readonly clockRateSPerDay: number | null; readonly azimuthArcsec: number | null; readonly levelArcsec: number | null; readonly collimationArcsec: number | null };
  readonly freeNames: readonly string[];
  readonly unitWeightErrorS: number | null;
  readonly correlation: readonly (readonly number[])[];
}

const K = STELLAR_REVOLUTIONS_PER_UT1_DAY;

/**
 * Mayer's correction τ in seconds of time for constants in arcsec: τ = (a·A + b·B ± c·C)/15
 * (mayer.ts; 1 s of time = 15″).
 */
export function mayerCorrectionS(t: PreparedTransit, azimuthArcsec: number, levelArcsec: number, collimationArcsec: number): number {
  const f = t.factors;
  return (azimuthArcsec * f.azimuthFactor + levelArcsec * f.levelFactor + clampSign(t.row.clamp) * collimationArcsec * f.collimationFactor) / 15;
}

/**
 * O − C in right ascension (s of time): α_observed − α_predicted = k·(T_obs − T_pred) + τ, with
 * T_obs the clock-corrected UTC of the mean wire, T_pred the predicted UTC of the passage and
 * k = 1.002 737 811 9 sidereal seconds per UT1 second (IERS Conventions 2010 eq. 5.15): the star
 * crosses the line of sight at hour angle −τ (mayer.ts, exact-crossing.ts). Positive: late.
 */
export function timeResidualS(t: PreparedTransit, clock: NightClockModel, azimuthArcsec: number, levelArcsec: number, collimationArcsec: number): number {
  const observedUtcS = t.nominalS + clockCorrectionAtS(clock, t.nominalS);
  return K * (observedUtcS - t.prediction.utcS) + mayerCorrectionS(t, azimuthArcsec, levelArcsec, collimationArcsec);
}

/**
 * Weighted least squares of the free right-ascension constants over `included` (solveLeastSquares:
 * Cholesky of compensated normal equations). Equation per transit, in seconds of time:
 * −O−C₀ = k·(Δoffset + Δrate·(u − u_ref)/86400) + (a·A + b·B ± c·C)/15 for the free terms, O−C₀
 * computed with the held values. Throws (from solveLeastSquares) with the name of a parameter the
 * night cannot separate, e.g. b together with the clock offset and a (1 = sin φ·A + cos φ·B).
 */
export function fitTimeTerms(transits: readonly PreparedTransit[], included: readonly number[], terms: TimeTerms): { fit: TimeSolution; residuals: number[] } {
  const names: string[] = [];
  if (terms.freeClockOffset) names.push('clock offset');
  if (terms.freeClockRate) names.push('clock rate');
  if (terms.azimuthArcsec === null) names.push('azimuth a');
  if (terms.levelArcsec === null) names.push('level b');
  if (terms.collimationArcsec === null) names.push('collimation c');
  const held = (v: number | null): number => v ?? 0;
  const row = (t: PreparedTransit): number[] => {
    const d: number[] = [];
    if (terms.freeClockOffset) d.push(K);
    if (terms.freeClockRate) d.push((K * (t.nominalS - terms.clock.referenceS)) / SECONDS_PER_DAY);
    if (terms.azimuthArcsec === null) d.push(t.factors.azimuthFactor / 15);
    if (terms.levelArcsec === null) d.push(t.factors.levelFactor / 15);
    if (terms.collimationArcsec === null) d.push((clampSign(t.row.clamp) * t.factors.collimationFactor) / 15);
    return d;
  };
  const y0 = (t: PreparedTransit): number => -timeResidualS(t, terms.clock, held(terms.azimuthArcsec), held(terms.levelArcsec), held(terms.collimationArcsec));
  let x: readonly number[] = [];
  let covariance: readonly (readonly number[])[] = [];
  let unitWeightErrorS: number | null = null;
  if (names.length > 0) {
    const s = solveLeastSquares(included.map((k) => row(transits[k])), included.map((k) => y0(transits[k])), included.map((k) => transits[k].weight), names);
    x = s.parameters;
    covariance = s.covariance;
    unitWeightErrorS = s.unitWeightError;
  }
  const take = (name: string): { value: number; sigma: number | null } => {
    const i = names.indexOf(name);
    return i < 0 ? { value: 0, sigma: null } : { value: x[i], sigma: unitWeightErrorS === null ? null : Math.sqrt(covariance[i][i]) };
  };
  const offset = take('clock offset'), rate = take('clock rate'), a = take('azimuth a'), b = take('level b'), c = take('collimation c');
  const clock = { referenceS: terms.clock.referenceS, offsetS: terms.clock.offsetS + offset.value, rateSPerDay: terms.clock.rateSPerDay + rate.value };
  const azimuthArcsec = terms.azimuthArcsec ?? a.value, levelArcsec = terms.levelArcsec ?? b.value, collimationArcsec = terms.collimationArcsec ?? c.value;
  const residuals = transits.map((t) => timeResidualS(t, clock, azimuthArcsec, levelArcsec, collimationArcsec));
  if (names.length === 0 && included.length > 0) {
    unitWeightErrorS = Math.sqrt(included.reduce((s, k) => s + transits[k].weight * residuals[k] ** 2, 0) / included.length);
  }
  const correlation = covariance.map((r, i) => r.map((v, j) => v / Math.sqrt(covariance[i][i] * covariance[j][j])));
  return {
    fit: {
      clock, azimuthArcsec, levelArcsec, collimationArcsec, freeNames: names, unitWeightErrorS, correlation,
      sigmas: { clockOffsetS: offset.sigma, clockRateSPerDay: rate.sigma, azimuthArcsec: a.sigma, levelArcsec: b.sigma, collimationArcsec: c.sigma },
    },
    residuals,
  };
}
