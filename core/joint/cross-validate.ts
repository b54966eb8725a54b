import type { TaskControl } from '../task/task-control.ts';
import { mjdToCalendarDay } from '../time/julian-date.ts';
import type { JointModel } from './joint-model.ts';
import type { JointNight, JointObservation } from './joint-observations.ts';
import { checkSolvable, JointSolveRefused, type PreparedArchive } from './prepare-archive.ts';
import { solveProblem, starResults, type StarResult } from './solve-archive.ts';

/** A shift beyond this many σ of the fold-minus-full difference flags the star (common practice: 3σ). */
export const CROSS_VALIDATION_FLAG_SIGMA = 3;

/** One star's parallax with one calendar year left out. */
export interface ParallaxFold {
  readonly year: number;
  /** Absolute parallax and its formal 1σ (mas) without that year; null when the star is not observed in the other years. */
  readonly parallaxMas: number | null;
  readonly parallaxSigmaMas: number | null;
  /** (fold − full) / σ_full: the shift in units of the full solve's σ. */
  readonly shiftFullSigma: number | null;
  /**
   * (fold − full) / σ_d with σ_d² = σ_fold² − σ_full², the variance of the difference of two nested
   * least-squares estimates (the full one efficient; Hausman 1978, Econometrica 46, 1251, from memory).
   * σ_d falls back to σ_full when σ_fold ≤ σ_full (robust weights can make that happen).
   */
  readonly shiftDifferenceSigma: number | null;
}

export interface StarCrossValidation {
  readonly id: string;
  readonly fullParallaxMas: number;
  readonly fullParallaxSigmaMas: number;
  readonly folds: readonly ParallaxFold[];
  /** Sample standard deviation of the fold parallaxes (mas); null with fewer than two folds. */
  readonly spreadMas: number | null;
  /** Jackknife σ, √((n−1)/n · Σ(ϖ_i − ϖ̄)²) (Efron & Tibshirani 1993 §11.2, from memory); compare with fullParallaxSigmaMas. */
  readonly jackknifeSigmaMas: number | null;
  /** The largest |shiftFullSigma| and |shiftDifferenceSigma| over the folds, and the year of the latter. */
  readonly maxShiftFullSigma: number | null;
  readonly maxShiftDifferenceSigma: number | null;
  readonly worstYear: number | null;
  /** maxShiftDifferenceSigma > CROSS_VALIDATION_FLAG_SIGMA: one year pulls this parallax (a season-locked instrument term or a bad year). */
  readonly flagged: boolean;
}

export interface CrossValidation {
  /** Calendar years left out in turn (the folds solved). */
  readonly years: readonly number[];
  /** Years not used as a fold, and folds that could not be solved, with the reason. */
  readonly notes: readonly string[];
  readonly stars: readonly StarCrossValidation[];
  readonly flagSigma: number;
}

export interface CrossValidationOptions {
  /** A year with fewer reduced nights than this is not left out on its own (default 10). */
  readonly minNightsPerYear?: number;
  /** Called after each fold with the year and the folds done/total. */
  readonly onFold?: (year: number, done: number, total: number) => void;
}

/** Calendar year (Gregorian, of the night's local date) of each night. */
export function nightYears(nights: readonly JointNight[]): number[] {
  return nights.map((n) => mjdToCalendarDay(n.nightDateMjd).year);
}

/** The prepared archive without the nights of `year` and their observations, nights re-indexed. */
export function withoutYear(prepared: PreparedArchive, year: number): PreparedArchive {
  const years = nightYears(prepared.nights);
  const newIndex = new Int32Array(prepared.nights.length).fill(-1);
  const nights: JointNight[] = [];
  prepared.nights.forEach((n, i) => { if (years[i] !== year) { newIndex[i] = nights.length; nights.push(n); } });
  const observations: JointObservation[] = [];
  for (const o of prepared.observations) if (newIndex[o.night] >= 0) observations.push({ ...o, night: newIndex[o.night] });
  return { stars: prepared.stars, nights, observations, skipped: prepared.skipped, events: prepared.events, site: prepared.site };
}

function foldOf(year: number, full: StarResult, fold: StarResult | undefined): ParallaxFold {
  const p = fold?.parallaxMas ?? null, s = fold?.parallaxSigmaMas ?? null;
  if (p === null || s === null || full.parallaxMas === null || !full.parallaxSigmaMas) return { year, parallaxMas: p, parallaxSigmaMas: s, shiftFullSigma: null, shiftDifferenceSigma: null };
  const shift = p - full.parallaxMas;
  const difference = s > full.parallaxSigmaMas ? Math.sqrt(s ** 2 - full.parallaxSigmaMas ** 2) : full.parallaxSigmaMas;
  return { year, parallaxMas: p, parallaxSigmaMas: s, shiftFullSigma: shift / full.parallaxSigmaMas, shiftDifferenceSigma: shift / difference };
}

function summarise(full: StarResult, folds: ParallaxFold[]): StarCrossValidation {
  const values = folds.flatMap((f) => (f.parallaxMas === null ? [] : [f.parallaxMas]));
  const n = values.length, mean = values.reduce((a, v) => a + v, 0) / Math.max(n, 1);
  const squares = values.reduce((a, v) => a + (v - mean) ** 2, 0);
  let maxFull: number | null = null, maxDiff: number | null = null, worstYear: number | null = null;
  for (const f of folds) {
    if (f.shiftFullSigma !== null) maxFull = Math.max(maxFull ?? 0, Math.abs(f.shiftFullSigma));
    if (f.shiftDifferenceSigma !== null && Math.abs(f.shiftDifferenceSigma) > (maxDiff ?? -1)) { maxDiff = Math.abs(f.shiftDifferenceSigma); worstYear = f.year; }
  }
  return {
    id: full.id, fullParallaxMas: full.parallaxMas ?? Number.NaN, fullParallaxSigmaMas: full.parallaxSigmaMas ?? Number.NaN, folds,
    spreadMas: n >= 2 ? Math.sqrt(squares / (n - 1)) : null, jackknifeSigmaMas: n >= 2 ? Math.sqrt(((n - 1) / n) * squares) : null,
    maxShiftFullSigma: maxFull, maxShiftDifferenceSigma: maxDiff, worstYear, flagged: maxDiff !== null && maxDiff > CROSS_VALIDATION_FLAG_SIGMA,
  };
}

/**
 * Leave-one-year-out cross-validation of the parallaxes: the prepared archive is solved under
 * `model` once whole and once per calendar year with that year's nights and observations left
 * out; per star the fold parallaxes, their spread, the largest shift and a flag when a shift
 * exceeds 3σ of its expected scatter. A real parallax survives dropping any one year; a
 * season-locked instrument term or one bad year imitating parallax does not. Needs a model with
 * the parallax free; throws JointSolveRefused otherwise or when fewer than two years qualify.
 */
export function crossValidateYears(prepared: PreparedArchive, model: JointModel, control: TaskControl, options: CrossValidationOptions = {}): CrossValidation {
  if (model.parallax !== 'free') throw new JointSolveRefused(`cross-validation compares parallaxes, but the model has "parallax": "${model.parallax}"; set it to "free"`);
  const minNights = options.minNightsPerYear ?? 10;
  const years = nightYears(prepared.nights);
  const counts = new Map<number, number>();
  for (const y of years) counts.set(y, (counts.get(y) ?? 0) + 1);
  const notes: string[] = [];
  const eligible = [...counts].sort((a, b) => a[0] - b[0]).filter(([y, c]) => {
    if (c < minNights) notes.push(`year ${y} not left out on its own: ${c} night(s), fewer than ${minNights} (its nights stay in every fold)`);
    return c >= minNights;
  }).map(([y]) => y);
  if (eligible.length < 2) throw new JointSolveRefused(`cross-validation needs at least two calendar years of ${minNights} or more nights; the archive has ${[...counts].map(([y, c]) => `${y}: ${c}`).join(', ')}`);
  // Only the star results are needed: the solver run without solvePrepared's outputs (correlation, signatures).
  const solveStars = (p: PreparedArchive): StarResult[] => { const { layout, solution } = solveProblem(p, model, control); return starResults(solution, layout, p.stars, p.observations); };
  const full = { stars: solveStars(prepared) };
  const foldsByStar = new Map(full.stars.map((s) => [s.id, [] as ParallaxFold[]]));
  const solved: number[] = [];
  eligible.forEach((year, i) => {
    const subset = withoutYear(prepared, year);
    try { checkSolvable(subset); } catch (error) {
      if (!(error instanceof JointSolveRefused)) throw error;
      notes.push(`fold without ${year} not solved: ${error.message}`);
      return;
    }
    const byId = new Map(solveStars(subset).map((s) => [s.id, s]));
    for (const star of full.stars) foldsByStar.get(star.id)!.push(foldOf(year, star, byId.get(star.id)));
    solved.push(year);
    options.onFold?.(year, i + 1, eligible.length);
  });
  return { years: solved, notes, stars: full.stars.map((s) => summarise(s, foldsByStar.get(s.id)!)), flagSigma: CROSS_VALIDATION_FLAG_SIGMA };
}
