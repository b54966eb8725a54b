import { fDistributionSurvival } from './f-distribution.ts';

/** The fit statistics a model comparison needs; a JointSolution provides all three. */
export interface FitSummary {
  /** Weighted sum of squared residuals (χ² with weights 1/σ²). */
  readonly chiSquare: number;
  /** Independent parameters estimated (JointSolution.rank). */
  readonly rank: number;
  /** Fitted observations (JointSolution.fittedRowCount; priors count as observations if both models share them). */
  readonly fittedRowCount: number;
}

export interface NestedFTest {
  readonly f: number;
  readonly numeratorDegrees: number;
  readonly denominatorDegrees: number;
  /** P(F > f) under the hypothesis that the extra terms are zero; small values favour the larger model. */
  readonly pValue: number;
}

/**
 * F-test of a model against a nested reduction of it (the extra terms set to zero), both fitted
 * to the same observations with the same weights:
 *   F = ((χ²_reduced − χ²_full)/(p_full − p_reduced)) / (χ²_full/(n − p_full))
 * distributed as F(p_full − p_reduced, n − p_full) under the null hypothesis (e.g. Bevington &
 * Robinson, Data Reduction and Error Analysis, 3rd ed., §11.4; Draper & Smith, Applied
 * Regression Analysis, 3rd ed., §6.1; sections from memory). Robust fits change the weights between models, so compare
 * non-robust fits or fits with the same final weights.
 */
export function nestedFTest(reduced: FitSummary, full: FitSummary): NestedFTest {
  const extra = full.rank - reduced.rank;
  const denominatorDegrees = full.fittedRowCount - full.rank;
  if (full.fittedRowCount !== reduced.fittedRowCount) {
    throw new RangeError(`nestedFTest: the models were fitted to ${reduced.fittedRowCount} and ${full.fittedRowCount} observations; fit both to the same rows`);
  }
  if (!(extra > 0)) throw new RangeError(`nestedFTest: the full model has rank ${full.rank}, not above the reduced model's ${reduced.rank}; pass (reduced, full) in that order`);
  if (!(denominatorDegrees > 0)) throw new RangeError(`nestedFTest: the full model leaves ${denominatorDegrees} degrees of freedom; it needs at least one`);
  const gain = Math.max(reduced.chiSquare - full.chiSquare, 0);
  const f = gain / extra / (full.chiSquare / denominatorDegrees);
  return { f, numeratorDegrees: extra, denominatorDegrees, pValue: fDistributionSurvival(f, extra, denominatorDegrees) };
}

/**
 * Akaike's information criterion for Gaussian errors of known σ (weights 1/σ²): −2 ln L = χ² + const,
 * so AIC = χ² + 2k (Akaike, IEEE Trans. Autom. Control 19, 716, 1974); the constant cancels
 * between models fitted to the same data. Lower is better.
 */
export function akaikeInformationCriterion(fit: FitSummary): number {
  return fit.chiSquare + 2 * fit.rank;
}

/** Small-sample corrected AIC: AIC + 2k(k+1)/(n − k − 1) (Hurvich & Tsai, Biometrika 76, 297, 1989). */
export function correctedAkaikeInformationCriterion(fit: FitSummary): number {
  const spare = fit.fittedRowCount - fit.rank - 1;
  if (!(spare > 0)) throw new RangeError(`correctedAkaikeInformationCriterion: ${fit.fittedRowCount} observations for ${fit.rank} parameters; AICc needs n > k + 1`);
  return akaikeInformationCriterion(fit) + (2 * fit.rank * (fit.rank + 1)) / spare;
}

/** Schwarz's Bayesian information criterion, χ² + k·ln n for known σ (Schwarz, Ann. Stat. 6, 461, 1978). */
export function bayesianInformationCriterion(fit: FitSummary): number {
  return fit.chiSquare + fit.rank * Math.log(fit.fittedRowCount);
}
