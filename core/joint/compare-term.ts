import { bayesianInformationCriterion, nestedFTest, type FitSummary, type NestedFTest } from '../solver/index.ts';
import type { TaskControl } from '../task/task-control.ts';
import type { JointModel, TermSetting } from './joint-model.ts';
import type { PreparedArchive } from './prepare-archive.ts';
import { solvePrepared } from './solve-archive.ts';

/** Model terms that can be compared in and out (the model file's term keys). */
export const COMPARABLE_TERMS = ['parallax', 'properMotion', 'deltaKappa', 'refractionScale', 'flexure', 'temperature', 'seasonal',
  'latitudeVariation', 'clockRate', 'azimuth', 'level', 'collimation'] as const;
export type ComparableTerm = (typeof COMPARABLE_TERMS)[number];

export interface TermComparison {
  readonly term: ComparableTerm;
  /** The nested F-test of the model with the term free against it absent (core/solver nestedFTest). */
  readonly fTest: NestedFTest;
  /** χ², rank and Schwarz's BIC (χ² + k ln n) of each model; lower BIC is better. */
  readonly without: { readonly chiSquare: number; readonly rank: number; readonly bic: number };
  readonly with: { readonly chiSquare: number; readonly rank: number; readonly bic: number };
  /** Observations (rows + priors, the same in both models). */
  readonly observations: number;
}

/**
 * Solves the prepared archive with `term` free and with it absent, both as plain weighted least
 * squares (robust reweighting changes the weights between models, which the F-test forbids), and
 * compares them: F = (Δχ²/Δk)/(χ²_full/(n − k_full)) and BIC. Priors count as observations in both.
 * Variance components are switched off for the same reason (they re-weight each model differently).
 */
export function compareTerm(prepared: PreparedArchive, model: JointModel, term: ComparableTerm, control: TaskControl): TermComparison {
  const solveWith = (setting: TermSetting) => solvePrepared(prepared, { ...model, [term]: setting, robustIterations: 1, varianceComponents: false }, control).solution;
  const full = solveWith('free'), reduced = solveWith('absent');
  const summary = (s: typeof full): FitSummary => ({ chiSquare: s.chiSquare, rank: s.rank, fittedRowCount: s.degreesOfFreedom + s.rank });
  const fTest = nestedFTest(summary(reduced), summary(full));
  const entry = (s: typeof full) => ({ chiSquare: s.chiSquare, rank: s.rank, bic: bayesianInformationCriterion(summary(s)) });
  return { term, fTest, without: entry(reduced), with: entry(full), observations: summary(full).fittedRowCount };
}
