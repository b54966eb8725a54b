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

/** Default Huber constant: 95 % asymptotic efficiency at the normal law (Huber 1981, §4.6). */
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
 * Throws SolveCancelled when `options.cancel.cancelled` becomes true (checked every 256 blocks).
 */
export function jointSolve(problem: SolverProblem, options: SolveOptions = {}): JointSolution {
  const robust = options.robust === false ? null : {
    tuning: options.robust?.tuning ?? DEFAULT_HUBER_TUNING,
    outlierThreshold: options.robust?.outlierThreshold ?? 3,
    maxIterations: options.robust?.maxIterations ?? 30,
    weightTolerance: options.robust?.weightTolerance ?? 1e-4,
  };
  if (robust && !(robust.tuning > 0 && robust.maxIterations >= 1)) {
    throw new RangeError(`jointSolve: robust.tuning ${robust.tuning} and robust.maxIterations ${robust.maxIterations} must be positive`);
  }
  const iterationLimit = robust ? robust.maxIterations : 1;
  let iteration = 1;
  const report = (phase: SolvePhase, fraction: number): void => {
    if (options.cancel?.cancelled) throw new SolveCancelled(`joint solve cancelled during ${phase} of pass ${iteration}`);
    options.onProgress?.({ phase, iteration, iterationLimit, fraction });
  };
  report('accumulate', 0);
  const prep = prepareProblem(problem);
  const rowCount = prep.rows.count;
  const baseWeight = prep.rows.weight;
  const factor = new Float64Array(rowCount).fill(1);
  const standardized = new Float64Array(rowCount);
  const flag = new Uint8Array(rowCount);
  let weight = baseWeight.slice();
  const { maxLocals, maxConstraints } = maxLocalsAndConstraints(prep);
  const ws = new BlockWorkspace(prep.globalCount, maxLocals, maxConstraints);
  report('accumulate', 1);
  let pass: Pass | null = null;
  let converged = !robust;
  let scale = 0;
  for (; iteration <= iterationLimit; iteration++) {
    const reduced = reduceBlocks(prep, weight, ws, true, (done, total) => report('reduce', done / total));
    report('solve', 0);
    const globals = solveGlobals(prep, reduced);
    report('solve', 1);
    // Exact leverages need the per-block covariances (l·t² per block); intermediate robust passes
    // studentise with the block-local part only, and the final pass is redone with exact ones.
    const exact = !robust;
    const back = backSubstitute(prep, weight, ws, globals, exact, (done, total) => report('back-substitute', done / total));
    pass = { reduced, globals, back, exact };
    if (!robust) break;
    if (!exact) addGlobalLeverageShare(prep, back.leverage);
    scale = robustScale(back.residual, baseWeight, back.leverage);
    const previous = factor.slice();
    const change = huberFactors(back.residual, baseWeight, back.leverage, scale, robust.tuning, robust.outlierThreshold, factor, standardized, flag);
    if (change <= robust.weightTolerance || iteration === iterationLimit) {
      converged = change <= robust.weightTolerance;
      factor.set(previous); // the factors of the pass just solved are the ones reported
      break;
    }
    weight = Float64Array.from(baseWeight, (w, k) => w * factor[k]);
  }
  if (!pass) throw new Error('jointSolve: no pass ran (internal error)');
  if (!pass.exact) {
    report('back-substitute', 0);
    const back = backSubstitute(prep, weight, ws, pass.globals, true, (done, total) => report('back-substitute', done / total));
    pass = { ...pass, back, exact: true };
    if (robust) {
      // Scale, standardised residuals and flags of the final pass with exact leverages; the
      // weights it was solved with stay as they were.
      scale = robustScale(back.residual, baseWeight, back.leverage);
      const used = factor.slice();
      huberFactors(back.residual, baseWeight, back.leverage, scale, robust.tuning, robust.outlierThreshold, factor, standardized, flag);
      factor.set(used);
    }
  }
  if (!robust) {
    for (let k = 0; k < rowCount; k++) flag[k] = baseWeight[k] === 0 ? ObservationFlag.rejected : ObservationFlag.fit;
  }
  let degeneracy = null;
  if (options.degeneracyReport !== false) {
    report('degeneracy', 0);
    degeneracy = degeneracyReport(
      prep, pass.reduced.normal, pass.globals.localConstraintRows, problem.globalNames, problem.priors ?? [],
      options.weakDirectionCount ?? 5, pass.reduced.singularBlocks, problem.localName ?? ((b, i) => `block ${b} local ${i}`),
    );
    report('degeneracy', 1);
  }
  return finishSolution({
    problem, prep, weight, factor, standardized, flag, scale, degeneracy,
    globals: pass.globals, back: pass.back, reduced: pass.reduced,
    iterations: Math.min(iteration, iterationLimit), converged, covarianceScale: options.covarianceScale ?? 'a-posteriori',
    huberTuning: robust ? robust.tuning : null,
  });
}
