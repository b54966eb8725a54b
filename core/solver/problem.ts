import { TaskCancelledError, type CancellationToken } from '../task/task-control.ts';
import type { ObservationRows } from './observation-rows.ts';

/**
 * A parameter of the joint solve: a global one (star terms, Δκ, refraction scale…) by its index,
 * or a local one by its block and its index within that block (clock, rate, zero point…).
 */
export type ParameterRef =
  | { readonly kind: 'global'; readonly index: number }
  | { readonly kind: 'local'; readonly block: number; readonly index: number };

/** Holds a parameter's correction at `value` (parameter unit; usually 0: "keep the catalogue value"). */
export interface FixedParameter {
  readonly parameter: ParameterRef;
  readonly value: number;
}

/**
 * A prior on a parameter's correction: value ± sigma (parameter unit), e.g. a catalogue parallax.
 * It enters as one pseudo-observation of weight 1/sigma², counted in χ² and degrees of freedom.
 */
export interface ParameterPrior {
  readonly parameter: ParameterRef;
  readonly value: number;
  readonly sigma: number;
}

/**
 * An exact linear constraint Σ coefficient·correction = value, e.g. "the night zero points sum
 * to zero" (coefficients 1 on every night's zero point) or "the mean offset of the programme
 * stars is zero". Applied with Lagrange multipliers, so it holds to rounding, and named by
 * `label` in the degeneracy report when it is what fixes an unobservable direction.
 */
export interface LinearConstraint {
  readonly label: string;
  readonly terms: readonly { readonly parameter: ParameterRef; readonly coefficient: number }[];
  readonly value: number;
}

/** Everything the engine needs; the model layer builds it from apparent places. */
export interface SolverProblem {
  /** Names of the global parameters, one per index ("star 12 Δδ₀", "Δκ"…); their count is the number of globals. */
  readonly globalNames: readonly string[];
  /** Number of local parameters of each block; the block count is its length. */
  readonly blockLocalCount: Int32Array;
  /** Name of local `index` of `block`, for reports; defaults to "block B local I". */
  readonly localName?: (block: number, index: number) => string;
  readonly rows: ObservationRows;
  readonly fixed?: readonly FixedParameter[];
  readonly priors?: readonly ParameterPrior[];
  readonly constraints?: readonly LinearConstraint[];
}

/** Phases reported to the progress callback. */
export type SolvePhase = 'accumulate' | 'reduce' | 'solve' | 'back-substitute' | 'degeneracy';

export interface SolveProgress {
  readonly phase: SolvePhase;
  /** Robust iteration, 1-based; 1 is the plain weighted least-squares pass. */
  readonly iteration: number;
  /** The iteration cap (the solve may converge earlier). */
  readonly iterationLimit: number;
  /** Fraction of the current phase done, 0…1. */
  readonly fraction: number;
}

/**
 * Thrown when the solve's cancellation token (`SolveOptions.cancellation`, the same token every
 * long core task reads: core/task/task-control.ts) is set. The token is read every 256 blocks and
 * at each phase. The solve is synchronous and never yields to its thread's event loop, so in a Web
 * Worker a message handler cannot flip a plain flag mid-solve: back the token with shared memory,
 * e.g. `const flag = new Int32Array(new SharedArrayBuffer(4)); token = { get isCancelled() { return Atomics.load(flag, 0) === 1; } }`
 * and have the UI thread `Atomics.store(flag, 0, 1)` (needs a cross-origin-isolated page).
 * A TaskCancelledError, so hosts report it as cancelled, not failed.
 */
export class SolveCancelled extends TaskCancelledError {
  constructor(phase: string, iteration: number) {
    super(`the joint solve (${phase} of pass ${iteration})`, 0);
    this.message = `joint solve cancelled during ${phase} of pass ${iteration}; nothing it computed was kept.`;
  }
}

/** Huber IRLS settings; see huber-weights.ts for the estimator. */
export interface RobustOptions {
  /** Huber constant in units of the robust scale; 1.345 gives 95 % efficiency at the normal law (Huber 1981; see DEFAULT_HUBER_TUNING). */
  readonly tuning?: number;
  /** Standardised residual above which an observation is flagged as an outlier (default 3). */
  readonly outlierThreshold?: number;
  /** Iteration cap including the first, unweighted pass (default 30). */
  readonly maxIterations?: number;
  /** Converged when no robust weight factor changes by more than this between passes (default 1e-4). */
  readonly weightTolerance?: number;
}

export interface SolveOptions {
  /** false: one weighted least-squares pass. Default: Huber IRLS with the defaults above. */
  readonly robust?: RobustOptions | false;
  /**
   * 'a-posteriori' (default): covariances scaled by the squared unit-weight error;
   * 'a-priori': the inverse normal matrix as it stands (weights taken as 1/σ²).
   */
  readonly covarianceScale?: 'a-posteriori' | 'a-priori';
  /** Skip the eigen-analysis of the global system (it costs ~n³ multiply-adds for n globals: 0.2–0.5 s at n = 600). */
  readonly degeneracyReport?: boolean;
  /** How many weakest directions to list (default 5). */
  readonly weakDirectionCount?: number;
  readonly onProgress?: (progress: SolveProgress) => void;
  /** Set by the host to stop the solve (core/task/task-control.ts). */
  readonly cancellation?: CancellationToken;
}
