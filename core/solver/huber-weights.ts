import { medianInPlace } from './median.ts';

/** Per-observation state after a robust pass. */
export const ObservationFlag = {
  /** Full weight: |u| ≤ tuning constant. */
  fit: 0,
  /** Huber weight < 1 but |u| ≤ outlier threshold. */
  downweighted: 1,
  /** |u| above the outlier threshold (weight k/|u|, never zero). */
  outlier: 2,
  /** No redundancy (leverage ≈ 1): the row alone fixes a parameter, its residual cannot be tested. */
  untestable: 3,
  /** Weight 0 on input (user-rejected); residual computed, not fitted. */
  rejected: 4,
} as const;
export type ObservationFlag = (typeof ObservationFlag)[keyof typeof ObservationFlag];

/** Rows whose redundancy 1 − h_k is below this are untestable (common practice). */
const MINIMUM_REDUNDANCY = 1e-8;

/** Consistency factor of the MAD for the normal law: 1/Φ⁻¹(3/4) = 1.482602… (Hampel 1974). */
export const MAD_TO_SIGMA = 1.482602218505602;

/**
 * Robust scale of the weighted residuals (unit-weight scale): 1.4826·median|z_k| with the
 * studentised residuals z_k = v_k·√w_k / √(1 − h_k) over fitted, testable rows — the median
 * absolute deviation about zero (least-squares residuals centre on zero), leverage-corrected so
 * that blocks with few rows (large h_k) do not bias it low (Hampel, J. Amer. Stat. Assoc. 69, 383,
 * 1974; studentisation as in Belsley, Kuh & Welsch, Regression Diagnostics, 1980, §2.1; sections from memory).
 * Returns 0 when every testable residual is zero or no row is testable.
 */
export function robustScale(residual: Float64Array, baseWeight: Float64Array, leverage: Float64Array): number {
  const scratch = new Float64Array(residual.length);
  let count = 0;
  for (let k = 0; k < residual.length; k++) {
    const redundancy = 1 - leverage[k];
    if (baseWeight[k] === 0 || redundancy < MINIMUM_REDUNDANCY) continue;
    scratch[count++] = Math.abs(residual[k]) * Math.sqrt(baseWeight[k] / redundancy);
  }
  return count === 0 ? 0 : MAD_TO_SIGMA * medianInPlace(scratch, count);
}

/**
 * Huber weight factors ψ(u)/u = min(1, k/|u|) with u_k = v_k·√w_k / scale (Huber, Ann. Math.
 * Stat. 35, 73, 1964; Robust Statistics, 1981, §7.8, section from memory: iteratively reweighted least squares). The
 * final weight is w_k·factor_k. Writes factor, u and flag per row; returns the largest factor change.
 * A zero scale (exact fit) leaves every factor at 1.
 */
export function huberFactors(
  residual: Float64Array, baseWeight: Float64Array, leverage: Float64Array, scale: number,
  tuning: number, outlierThreshold: number,
  factor: Float64Array, standardized: Float64Array, flag: Uint8Array,
): number {
  let largestChange = 0;
  for (let k = 0; k < residual.length; k++) {
    const previous = factor[k];
    let next = 1;
    const u = scale > 0 ? (residual[k] * Math.sqrt(baseWeight[k])) / scale : 0;
    standardized[k] = u;
    const magnitude = Math.abs(u);
    if (baseWeight[k] === 0) {
      flag[k] = ObservationFlag.rejected;
    } else if (1 - leverage[k] < MINIMUM_REDUNDANCY) {
      flag[k] = ObservationFlag.untestable;
    } else if (magnitude <= tuning) {
      flag[k] = ObservationFlag.fit;
    } else {
      next = tuning / magnitude;
      flag[k] = magnitude > outlierThreshold ? ObservationFlag.outlier : ObservationFlag.downweighted;
    }
    factor[k] = next;
    largestChange = Math.max(largestChange, Math.abs(next - previous));
  }
  return largestChange;
}
