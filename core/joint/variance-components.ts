import type { JointSolution } from '../solver/index.ts';
import type { JointLayout } from './build-joint-problem.ts';
import type { JointObservation } from './joint-observations.ts';

/** Estimated factors on the stated σ: per star for each coordinate, per night for both (relative, geometric mean 1). */
export interface VarianceFactors {
  readonly stars: readonly { readonly index: number; readonly raFactor: number; readonly zenithFactor: number; readonly raRedundancy: number; readonly zenithRedundancy: number }[];
  readonly nights: readonly { readonly index: number; readonly factor: number; readonly redundancy: number }[];
  readonly iterations: number;
  readonly converged: boolean;
  /** Groups whose redundancy is below MIN_REDUNDANCY (stars) or MIN_NIGHT_REDUNDANCY (nights), kept at factor 1 (their own estimate would be too noisy to weight by). */
  readonly keptAtOne: number;
}

/**
 * A star's σ² estimate from fewer than this many degrees of freedom scatters by more than
 * √(2/20) ≈ 32 %, and such a group can run away (its weight grows, its residuals shrink, its
 * estimate falls again: measured, a star at redundancy ~10 drifting by 2 % a pass without end): kept at 1.
 */
export const MIN_REDUNDANCY = 20;
/**
 * A night's own factor needs more: with ~10 transits a night keeps a redundancy of ~8, its σ²
 * estimate scatters by 50 %, and weighting nights by it fits the weights to the noise (measured on
 * 30 stars × 2 years of synthetic noise, unit/joint/variance-components.test.ts: the other stars'
 * parallax pull rms 1.20 with night factors at redundancy ≥ 5, 1.08 without). Below this a night keeps 1.
 */
export const MIN_NIGHT_REDUNDANCY = 20;
const MAX_ITERATIONS = 20;
/** Converged when no factor moves by more than 1 % between passes. */
const TOLERANCE = 0.01;

interface GroupSums { readonly weighted: Float64Array; readonly redundancy: Float64Array }

function sums(size: number): GroupSums {
  return { weighted: new Float64Array(size), redundancy: new Float64Array(size) };
}

/** Adds one row's w·v² (final weight × squared residual, the weighted residual square of Förstner's estimator) and its redundancy 1 − h. */
function addRow(group: GroupSums, at: number, solution: JointSolution, row: number, rescale: number): void {
  if (row < 0 || solution.finalWeight[row] <= 0) return;
  group.weighted[at] += solution.finalWeight[row] * rescale * solution.residual[row] ** 2;
  group.redundancy[at] += 1 - solution.leverage[row];
}

/**
 * Variance components per star (right ascension and zenith distance apart) and per night, by
 * Förstner's iterative estimator (W. Förstner, "Ein Verfahren zur Schätzung von Varianz- und
 * Kovarianzkomponenten", Allgemeine Vermessungs-Nachrichten 86, 1979; as in K.-R. Koch,
 * Parameter Estimation and Hypothesis Testing in Linear Models, 1999, §3.6, from memory):
 * σ̂²_g = Σ_g w·v² / Σ_g (1 − h), the weighted squared residuals of group g over its redundancy
 * (the trace of the redundancy matrix over its rows), and the group's weights divided by σ̂²_g,
 * repeated until no factor moves by more than 1 %. Star factors absorb the overall scale; night
 * factors are relative (geometric mean 1 over the nights estimated). `solve` runs the joint solve
 * with the given weight factors (1/factor² per row). Returns the weight factors of the last solve.
 */
export function estimateVarianceComponents(observations: readonly JointObservation[], starCount: number, nightCount: number,
  solve: (raWeight: Float64Array, zenithWeight: Float64Array) => { solution: JointSolution; layout: JointLayout }): { factors: VarianceFactors; raWeight: Float64Array; zenithWeight: Float64Array } {
  const starRa = new Float64Array(starCount).fill(1), starZenith = new Float64Array(starCount).fill(1), night = new Float64Array(nightCount).fill(1);
  const raWeight = new Float64Array(observations.length).fill(1), zenithWeight = new Float64Array(observations.length).fill(1);
  let iterations = 0, converged = false, keptAtOne = 0;
  let last = { ra: sums(starCount), zenith: sums(starCount), night: sums(nightCount) };
  while (iterations < MAX_ITERATIONS && !converged) {
    const { solution, layout } = solve(raWeight, zenithWeight);
    iterations++;
    const ra = sums(starCount), zenith = sums(starCount);
    observations.forEach((o, k) => { addRow(ra, o.star, solution, layout.raRow[k], 1); addRow(zenith, o.star, solution, layout.zenithRow[k], 1); });
    let change = 0;
    keptAtOne = 0;
    // Nights' change is counted after their normalisation (below): the overall scale moves between stars and nights otherwise.
    const update = (factors: Float64Array, group: GroupSums, i: number, minimum = MIN_REDUNDANCY): void => {
      if (group.redundancy[i] < minimum) { if (group.redundancy[i] > 0) keptAtOne++; return; }
      const ratio = group.weighted[i] / group.redundancy[i];
      if (factors !== night) change = Math.max(change, Math.abs(Math.sqrt(ratio) - 1));
      factors[i] *= Math.sqrt(ratio);
    };
    const before = { ra: Float64Array.from(starRa), zenith: Float64Array.from(starZenith) };
    for (let s = 0; s < starCount; s++) { update(starRa, ra, s); update(starZenith, zenith, s); }
    // Night sums with the star factors just found, so that a noisy star does not make its nights look noisy.
    const nights = sums(nightCount);
    observations.forEach((o, k) => {
      addRow(nights, o.night, solution, layout.raRow[k], (before.ra[o.star] / starRa[o.star]) ** 2);
      addRow(nights, o.night, solution, layout.zenithRow[k], (before.zenith[o.star] / starZenith[o.star]) ** 2);
    });
    const nightBefore = Float64Array.from(night);
    for (let n = 0; n < nightCount; n++) update(night, nights, n, MIN_NIGHT_REDUNDANCY);
    let logSum = 0, estimated = 0;
    for (let n = 0; n < nightCount; n++) if (nights.redundancy[n] >= MIN_NIGHT_REDUNDANCY) { logSum += Math.log(night[n]); estimated++; }
    const mean = estimated > 0 ? Math.exp(logSum / estimated) : 1;
    for (let n = 0; n < nightCount; n++) if (nights.redundancy[n] >= MIN_NIGHT_REDUNDANCY) night[n] /= mean;
    for (let n = 0; n < nightCount; n++) change = Math.max(change, Math.abs(night[n] / nightBefore[n] - 1));
    observations.forEach((o, k) => { raWeight[k] = 1 / (starRa[o.star] * night[o.night]) ** 2; zenithWeight[k] = 1 / (starZenith[o.star] * night[o.night]) ** 2; });
    last = { ra, zenith, night: nights };
    converged = change < TOLERANCE;
  }
  const factors: VarianceFactors = {
    stars: Array.from({ length: starCount }, (_, index) => ({ index, raFactor: starRa[index], zenithFactor: starZenith[index], raRedundancy: last.ra.redundancy[index], zenithRedundancy: last.zenith.redundancy[index] })),
    nights: Array.from({ length: nightCount }, (_, index) => ({ index, factor: night[index], redundancy: last.night.redundancy[index] })),
    iterations, converged, keptAtOne,
  };
  return { factors, raWeight, zenithWeight };
}
