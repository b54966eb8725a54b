import { backSubstitute } from './back-substitute.ts';
import type { BackSubstitution } from './back-substitute.ts';
import { BlockWorkspace } from './block-workspace.ts';
import { degeneracyReport } from './degeneracy-report.ts';
import { huberFactors, ObservationFlag, robustScale } from './huber-weights.ts';
import { prepareProblem } from './prepare-problem.ts';
import type { PreparedProblem } from './prepared-problem.ts';
import { SolveCancelled } from './problem.ts';
import type { SolveOptions, SolvePhase, SolverProblem } from './problem.ts';
import { reduceBlocks } from './reduce-blocks.ts';
import type { ReducedSystem } from './reduce-blocks.ts';
import { solveGlobals } from './solve-globals.ts';
import type { GlobalSolution } from './solve-globals.ts';
import type { JointSolution } from './solution.ts';
import { finishSolution } from './finish-solution.ts';

/** Default Huber constant: 95 % asymptotic efficiency at the normal law (Huber, Robust Statistics, 1981, §4.6, section from memory; checked numerically: E ψ²/(E ψ′)² = 1.053). */
export const DEFAULT_HUBER_TUNING = 1.345;

interface Pass {
  readonly reduced: ReducedSystem;
  readonly globals: GlobalSolution;
  readonly back: BackSubstitution;
  readonly exact: boolean;
}

function maxLocalsAndConstraints(prep: PreparedProblem): { maxLocals: number; maxConstraints: number } {
  let maxLocals = 0;
  let maxConstraints = 0;
  for (let b = 0; b < prep.blockCount; b++) {
    maxLocals = Math.max(maxLocals, prep.localOffset[b + 1] - prep.localOffset[b]);
    maxConstraints = Math.max(maxConstraints, prep.blockConstraintStart[b + 1] - prep.blockConstraintStart[b]);
  }
  return { maxLocals, maxConstraints };
}

/**
 * Spreads the globals' share of the leverage evenly over the fitted rows: the leverages sum to
 * the rank, and the block-local parts already account for the locals, so the rest is about
 * (free globals − constraints)/rows per row. An approximation for intermediate robust passes only.
 */
function addGlobalLeverageShare(prep: PreparedProblem, leverage: Float64Array): void {
  let freeGlobals = 0;
  for (let g = 0; g < prep.globalCount; g++) if (!prep.globalFixed[g]) freeGlobals++;
  let fitted = 0;
  for (let k = 0; k < prep.rows.count; k++) if (prep.rows.weight[k] > 0) fitted++;
  const share = Math.max(0, freeGlobals - prep.globalConstraints.length - prep.localConstraints.length) / Math.max(fitted, 1);
  for (let k = 0; k < prep.rows.count; k++) if (prep.rows.weight[k] > 0) leverage[k] = Math.min(1, leverage[k] + share);
}

interface ResolvedRobust {
  readonly tuning: number;
  readonly outlierThreshold: number;
  readonly maxIterations: number;
  readonly weightTolerance: number;
}

function resolveRobust(options: SolveOptions): ResolvedRobust | null {
  if (options.robust === false) return null;
  const robust = {
    tuning: options.robust?.tuning ?? DEFAULT_HUBER_TUNING,
    outlierThreshold: options.robust?.outlierThreshold ?? 3,
    maxIterations: options.robust?.maxIterations ?? 30,
    weightTolerance: options.robust?.weightTolerance ?? 1e-4,
  };
  if (!(robust.tuning > 0 && robust.maxIterations >= 1)) {
    throw new RangeError(`jointSolve: robust.tuning ${robust.tuning} and robust.maxIterations ${robust.maxIterations} must be positive`);
  }
  return robust;
}

/** Per-row robust state shared by the passes. */
interface RowState {
  readonly baseWeight: Float64Array;
  weight: Float64Array;
  readonly factor: Float64Array;
  readonly standardized: Float64Array;
  readonly flag: Uint8Array;
  scale: number;
}

type Reporter = (phase: SolvePhase, fraction: number, iteration: number) => void;

/** Reduce, solve and back-substitute with the current weights. */
function runPass(prep: PreparedProblem, rows: RowState, ws: BlockWorkspace, exact: boolean, iteration: number, report: Reporter): Pass {
  const reduced = reduceBlocks(prep, rows.weight, ws, true, (done, total) => report('reduce', done / total, iteration));
  report('solve', 0, iteration);
  const globals = solveGlobals(prep, reduced, exact);
  report('solve', 1, iteration);
  const back = backSubstitute(prep, rows.weight, ws, globals, exact, (done, total) => report('back-substitute', done / total, iteration));
  return { reduced, globals, back, exact };
}

/** New Huber factors from a pass's residuals; returns the largest change. `keep` leaves the factors as they were. */
function reweigh(rows: RowState, back: BackSubstitution, robust: ResolvedRobust, keep: boolean): number {
  rows.scale = robustScale(back.residual, rows.baseWeight, back.leverage);
  const previous = rows.factor.slice();
  const change = huberFactors(back.residual, rows.baseWeight, back.leverage, rows.scale, robust.tuning, robust.outlierThreshold,
    rows.factor, rows.standardized, rows.flag);
  if (keep) rows.factor.set(previous);
  return change;
}

/**
 * Iterates passes until the Huber factors settle (or once when not robust). Exact leverages need
 * the per-block covariances (l·t² per block), so intermediate robust passes studentise with the
 * block-local part plus an even share of the globals', and the last pass is then back-substituted
 * again with exact covariances, its scale and flags recomputed (its weights unchanged).
 */
function iterate(prep: PreparedProblem, rows: RowState, ws: BlockWorkspace, robust: ResolvedRobust | null, report: Reporter):
  { pass: Pass; iterations: number; converged: boolean } {
  const limit = robust ? robust.maxIterations : 1;
  for (let iteration = 1; ; iteration++) {
    let pass = runPass(prep, rows, ws, !robust, iteration, report);
    if (!robust) return { pass, iterations: 1, converged: true };
    addGlobalLeverageShare(prep, pass.back.leverage);
    const change = reweigh(rows, pass.back, robust, false);
    const converged = change <= robust.weightTolerance;
    if (converged || iteration === limit) {
      for (let k = 0; k < rows.weight.length; k++) rows.factor[k] = rows.baseWeight[k] > 0 ? rows.weight[k] / rows.baseWeight[k] : 1;
      // The pass solved the globals without covariance; the same reduced system now gives Q.
      report('solve', 0, iteration);
      const globals = solveGlobals(prep, pass.reduced, true);
      report('back-substitute', 0, iteration);
      const back = backSubstitute(prep, rows.weight, ws, globals, true, (done, total) => report('back-substitute', done / total, iteration));
      pass = { ...pass, globals, back, exact: true };
      reweigh(rows, back, robust, true);
      return { pass, iterations: iteration, converged };
    }
    const next = new Float64Array(rows.baseWeight.length);
    for (let k = 0; k < next.length; k++) next[k] = rows.baseWeight[k] * rows.factor[k];
    rows.weight = next;
  }
}

/**
 * Joint weighted least-squares solve of observation rows with block-local and global parameters
 * (DESIGN.md §4): per pass, every block's normal equations are formed and its locals eliminated
 * by Schur complement into the global system, which is solved densely (Cholesky; eigen-based
 * generalised inverse when singular), and the locals are recovered by back-substitution.
 * Cost per pass: O(rows·terms²) + Σ_blocks l·t² + O(n³) for n globals; memory O(rows + n²).
 *
 * Robust mode (default) iterates Huber reweighting (see huber-weights.ts) until no weight factor
 * changes by more than `weightTolerance`, or `maxIterations` passes. Because Huber's ψ is
 * monotone, the iteration converges to the unique M-estimate: a blunder in a block of three rows
 * first drags that block's local terms, but the two good rows come back to full weight within a
 * few passes as the blunder's weight falls (tested in unit/solver/huber.test.ts).
 *
 * Priors and constraints are not reweighted; rows with input weight 0 get residuals but no say.
 * Throws SolveCancelled when `options.cancellation.isCancelled` becomes true (checked every 256 blocks).
 */
export function jointSolve(problem: SolverProblem, options: SolveOptions = {}): JointSolution {
  const robust = resolveRobust(options);
  const iterationLimit = robust ? robust.maxIterations : 1;
  const report: Reporter = (phase, fraction, iteration) => {
    if (options.cancellation?.isCancelled) throw new SolveCancelled(phase, iteration);
    options.onProgress?.({ phase, iteration, iterationLimit, fraction });
  };
  report('accumulate', 0, 1);
  const prep = prepareProblem(problem);
  const n = prep.rows.count;
  const rows: RowState = {
    baseWeight: prep.rows.weight, weight: prep.rows.weight.slice(), factor: new Float64Array(n).fill(1),
    standardized: new Float64Array(n), flag: new Uint8Array(n), scale: 0,
  };
  const { maxLocals, maxConstraints } = maxLocalsAndConstraints(prep);
  const ws = new BlockWorkspace(prep.globalCount, maxLocals, maxConstraints);
  report('accumulate', 1, 1);
  const { pass, iterations, converged } = iterate(prep, rows, ws, robust, report);
  if (!robust) {
    for (let k = 0; k < n; k++) rows.flag[k] = rows.baseWeight[k] === 0 ? ObservationFlag.rejected : ObservationFlag.fit;
  }
  let degeneracy = null;
  if (options.degeneracyReport !== false) {
    report('degeneracy', 0, iterations);
    degeneracy = degeneracyReport(
      prep, pass.reduced.normal, pass.globals.localConstraintRows, problem.globalNames, problem.priors ?? [],
      options.weakDirectionCount ?? 5, pass.reduced.singularBlocks, problem.localName ?? ((b, i) => `block ${b} local ${i}`),
    );
    report('degeneracy', 1, iterations);
  }
  return finishSolution({
    problem, prep, weight: rows.weight, factor: rows.factor, standardized: rows.standardized, flag: rows.flag, scale: rows.scale,
    degeneracy, globals: pass.globals, back: pass.back, reduced: pass.reduced, iterations, converged,
    covarianceScale: options.covarianceScale ?? 'a-posteriori', huberTuning: robust ? robust.tuning : null,
  });
}
