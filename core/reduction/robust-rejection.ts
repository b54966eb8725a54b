/** Outcome of an iterated robust rejection. */
export interface RobustOutcome<F> {
  readonly fit: F;
  /** Indices (into the caller's list) used by the final fit. */
  readonly included: readonly number[];
  /** Indices rejected as outliers, in the order they were rejected. */
  readonly outliers: readonly number[];
  /** The robust scale (1.4826·MAD, corrected as in rejectOutliers) of the normalised residuals of the final fit (at least the floor). */
  readonly robustSigma: number;
  /** True when the cap on the fraction of rejections stopped the iteration with outliers left. */
  readonly capReached: boolean;
}

/**
 * Gross blunders are screened out before any fit: an observation whose residual at the a-priori
 * constants lies more than `limit` from the night's median residual cannot be a measurement of the
 * star it names (a wrong star, a clock a minute off, a wire or turn miscounted), whatever the
 * statistics of the night say. Without this step a blunder in a night of three or four stars is
 * absorbed by the free constants and every transit of that night looks bad, while the 25 % cap
 * forbids rejecting it (DESIGN.md §4: robust weights must not throw whole nights away).
 * Returns the observations kept and those screened out; the latter are never subject to the cap.
 */
export function screenGrossBlunders(usable: readonly number[], residualOf: (k: number) => number, limit: number): { kept: number[]; gross: number[] } {
  if (usable.length < 3) return { kept: [...usable], gross: [] };
  const centre = median(usable.map(residualOf));
  const kept: number[] = [];
  const gross: number[] = [];
  for (const k of usable) (Math.abs(residualOf(k) - centre) > limit ? gross : kept).push(k);
  return { kept, gross };
}

/** At most this fraction of a night's usable observations is ever rejected as outliers. */
export const MAX_OUTLIER_FRACTION = 0.25;
/** Rejection threshold in robust sigmas. */
export const OUTLIER_SIGMAS = 3.5;

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const m = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[m] : (sorted[m - 1] + sorted[m]) / 2;
}

/**
 * The night's outlier rule: fit, take the normalised residuals r·√w of the observations in the
 * fit, their robust scale s = 1.4826·MAD (the MAD's consistency factor for a normal distribution,
 * Rousseeuw & Croux 1993) corrected for the fit's degrees of freedom and the sample size (below),
 * never below `floorSigma` (noise-free data would otherwise reject
 * rounding); if the worst |r·√w| exceeds 3.5·s (3·s rejects good transits of a 14-star night often enough to shrink the formal errors by 10 %: measured in unit/reduction), drop that one observation and refit; stop when none
 * exceeds, when 25 % of `usable` are already rejected, or when only `minimumCount` would remain.
 * One at a time, because a gross blunder inflates every residual of the fit that contains it.
 * `fit(included)` returns the fit and the residuals of every observation (also the excluded ones).
 */
export function rejectOutliers<F>(
  usable: readonly number[],
  weights: readonly number[],
  minimumCount: number,
  floorSigma: number,
  fit: (included: readonly number[]) => { fit: F; residuals: readonly number[] },
): RobustOutcome<F> {
  let included = [...usable];
  const outliers: number[] = [];
  const cap = Math.floor(MAX_OUTLIER_FRACTION * usable.length);
  for (;;) {
    const current = fit(included);
    const normalised = included.map((k) => current.residuals[k] * Math.sqrt(weights[k]));
    const centre = included.length > 0 ? median(normalised) : 0;
    const mad = included.length > 0 ? median(normalised.map((r) => Math.abs(r - centre))) : 0;
    // Residuals of a fit with p = minimumCount − 1 parameters scatter less than the errors by
    // √((n − p)/n) on average; the MAD of few values is biased low by n/(n − 0.8) (Croux &
    // Rousseeuw 1992, small-sample factor for n > 9). Both corrected, or good transits are rejected.
    const n = included.length;
    const parameters = minimumCount - 1;
    const smallSample = n > 9 ? n / (n - 0.8) : 1.2;
    const robustSigma = Math.max(1.4826 * mad * smallSample * Math.sqrt(n / Math.max(1, n - parameters)), floorSigma);
    let worst = -1;
    let worstValue = OUTLIER_SIGMAS * robustSigma;
    normalised.forEach((r, i) => {
      if (Math.abs(r) > worstValue) {
        worstValue = Math.abs(r);
        worst = included[i];
      }
    });
    const capReached = worst >= 0 && (outliers.length >= cap || included.length - 1 < minimumCount);
    if (worst < 0 || capReached) return { fit: current.fit, included, outliers, robustSigma, capReached };
    outliers.push(worst);
    included = included.filter((k) => k !== worst);
  }
}
