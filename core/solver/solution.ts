import type { DegeneracyReport } from './degeneracy-report.ts';

/**
 * The result of a joint solve. All corrections are in the parameter's own unit (the unit in which
 * the caller's partials are per-unit); errors are 1σ. Flat arrays, no per-row objects.
 */
export interface JointSolution {
  readonly globalNames: readonly string[];
  /** Global corrections, fixed ones at their fixed value. */
  readonly globalEstimate: Float64Array;
  /** 1σ formal errors: √diag of globalCovariance (0 for fixed parameters). */
  readonly globalError: Float64Array;
  /** n×n row-major covariance: the inverse constrained normal matrix times covarianceFactor. */
  readonly globalCovariance: Float64Array;
  /** n×n correlation matrix; rows of fixed parameters are 0 off the diagonal and 1 on it. */
  readonly globalCorrelation: Float64Array;
  /**
   * 1 for globals that take part (|coefficient| ≥ 0.01) in a direction no data, prior or
   * constraint determines: it was solved as minimum norm, and their errors are valid only with
   * that direction held at zero. All 0 in a well-posed solve.
   */
  readonly globalUndetermined: Uint8Array;
  /** The same per local (flat like localEstimate): locals of singular blocks, set to zero. */
  readonly localUndetermined: Uint8Array;
  /** Block b's locals at localEstimate[localOffset[b] … localOffset[b+1]). */
  readonly localOffset: Int32Array;
  readonly localEstimate: Float64Array;
  readonly localError: Float64Array;
  /**
   * Block b's full l×l covariance (including the share from the globals' uncertainty) at
   * localCovariance[localCovarianceOffset[b] …], row-major, scaled like globalCovariance.
   */
  readonly localCovariance: Float64Array;
  readonly localCovarianceOffset: Int32Array;
  /** Post-fit residual per row: (O−C) − partials·corrections, in the residual's unit. */
  readonly residual: Float64Array;
  /** Weight used in the final pass: input weight × robust factor. */
  readonly finalWeight: Float64Array;
  /** Huber factor per row (1 = full weight). */
  readonly robustFactor: Float64Array;
  /** u_k = v_k·√w_k / robust scale (dimensionless). */
  readonly standardizedResidual: Float64Array;
  /** Diagonal of the hat matrix (0…1); 1 − leverage is the row's redundancy. */
  readonly leverage: Float64Array;
  /** ObservationFlag per row. */
  readonly flag: Uint8Array;
  /** Σ w·v² over rows (final weights) + Σ ((estimate − value)/σ)² over priors. */
  readonly chiSquare: number;
  /** Rows with input weight > 0, plus priors, minus the rank of the constrained system. */
  readonly degreesOfFreedom: number;
  /** √(χ²/dof); 1 if dof ≤ 0 (then the errors are a-priori and a warning says so). */
  readonly unitWeightError: number;
  /** Leverage-corrected MAD scale of the last pass (unit-weight units); 0 for a non-robust solve. */
  readonly robustScale: number;
  readonly fittedRowCount: number;
  /**
   * The factor applied to the inverse normal matrix: 1 ('a-priori'), unitWeightError² (plain
   * a-posteriori), or Huber's asymptotic variance factor for robust solves (finish-solution.ts).
   */
  readonly covarianceFactor: number;
  /** Independent parameters actually estimated (free parameters − constraints − singular directions). */
  readonly rank: number;
  readonly iterations: number;
  readonly converged: boolean;
  readonly degeneracy: DegeneracyReport | null;
  readonly warnings: readonly string[];
}
