/**
 * The joint solver's public surface: build ObservationRows, describe the problem (names, block
 * sizes, fixes, priors, constraints), call jointSolve, read the JointSolution and its
 * DegeneracyReport; diagnostics and model comparison helpers alongside.
 */
export { ObservationRowsBuilder } from './observation-rows.ts';
export type { ObservationRows } from './observation-rows.ts';
export { SolveCancelled } from './problem.ts';
export type {
  FixedParameter, LinearConstraint, ParameterPrior, ParameterRef, RobustOptions,
  SolveOptions, SolvePhase, SolveProgress, SolverProblem,
} from './problem.ts';
export { DEFAULT_HUBER_TUNING, jointSolve } from './joint-solve.ts';
export type { JointSolution } from './solution.ts';
export type { DegeneracyReport, WeakDirection } from './degeneracy-report.ts';
export { ObservationFlag } from './huber-weights.ts';
export { fDistributionCdf, fDistributionSurvival } from './f-distribution.ts';
export { regularizedIncompleteBeta } from './incomplete-beta.ts';
export {
  akaikeInformationCriterion, bayesianInformationCriterion, correctedAkaikeInformationCriterion, nestedFTest,
} from './model-comparison.ts';
export type { FitSummary, NestedFTest } from './model-comparison.ts';
export { falseAlarmProbability, lombScarglePeriodogram } from './lomb-scargle.ts';
