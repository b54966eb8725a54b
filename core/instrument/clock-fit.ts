/**
 * One comparison of the observatory clock with a time signal: at the instant the clock read
 * `clockReadingS`, the signal said `signalUtcS` (both in seconds from the same zero the caller
 * chooses, e.g. 0 h UTC of the night's date). The clock correction is signal − clock.
 * `sigmaS` (optional) is the comparison's a priori standard error.
 */
export interface ClockComparison {
  readonly clockReadingS: number;
  readonly signalUtcS: number;
  readonly sigmaS?: number;
}

/**
 * Clock correction model for one night: correction(t) = offsetS + rateSPerS·(t − referenceClockS),
 * where t is a clock reading; UTC = clock reading + correction.
 */
export interface ClockFit {
  readonly referenceClockS: number;
  readonly offsetS: number;
  /** Rate in seconds per second (s/day = 86400·rate); 0 when not determinable (`rateDetermined`). */
  readonly rateSPerS: number;
  readonly rateDetermined: boolean;
  /** Formal standard errors; null when nothing sets the scale (no redundancy and no a priori sigmas). */
  readonly offsetSigmaS: number | null;
  readonly rateSigmaSPerS: number | null;
  /** √(Σ w r² / (n − p)) when n > p, else null. */
  readonly unitWeightError: number | null;
  readonly residualsS: readonly number[];
  /** Plain statements of what was assumed (e.g. one comparison: offset only). */
  readonly notes: readonly string[];
}

function validate(comparisons: readonly ClockComparison[]): void {
  if (comparisons.length === 0) throw new RangeError('fitClock: no clock comparisons for this night; record at least one comparison with a time signal');
  comparisons.forEach((c, i) => {
    if (!Number.isFinite(c.clockReadingS) || !Number.isFinite(c.signalUtcS)) {
      throw new RangeError(`fitClock: comparison ${i + 1} has a non-finite reading (${c.clockReadingS}, ${c.signalUtcS}); give seconds as finite numbers`);
    }
    if (c.sigmaS !== undefined && !(c.sigmaS > 0)) throw new RangeError(`fitClock: comparison ${i + 1} has sigmaS ${c.sigmaS}; a standard error must be > 0`);
  });
}

/**
 * Weighted least-squares clock offset and rate from a night's comparisons (normal equations of a
 * straight line about the weighted mean epoch, so offset and rate are uncorrelated; any textbook
 * of least squares). With a priori sigmas the formal errors come from them; without, from the
 * scatter (unit-weight error) when there is redundancy. One comparison, or all at the same
 * reading: offset only, rate 0 and `rateDetermined` false, said in `notes`.
 */
export function fitClock(comparisons: readonly ClockComparison[]): ClockFit {
  validate(comparisons);
  const apriori = comparisons.every((c) => c.sigmaS !== undefined);
  const weights = comparisons.map((c) => (apriori ? 1 / (c.sigmaS! * c.sigmaS!) : 1));
  const totalWeight = weights.reduce((s, w) => s + w, 0);
  const t0 = comparisons[0].clockReadingS;
  const referenceClockS = t0 + comparisons.reduce((s, c, i) => s + weights[i] * (c.clockReadingS - t0), 0) / totalWeight;
  const corrections = comparisons.map((c) => c.signalUtcS - c.clockReadingS);
  const dt = comparisons.map((c) => c.clockReadingS - referenceClockS);
  const offsetS = corrections.reduce((s, y, i) => s + weights[i] * y, 0) / totalWeight;
  const sxx = dt.reduce((s, x, i) => s + weights[i] * x * x, 0);
  const spanS = Math.max(...dt) - Math.min(...dt);
  const notes: string[] = [];
  const rateDetermined = comparisons.length >= 2 && spanS > 1e-6;
  const rateSPerS = rateDetermined ? dt.reduce((s, x, i) => s + weights[i] * x * (corrections[i] - offsetS), 0) / sxx : 0;
  if (!rateDetermined) {
    notes.push(comparisons.length === 1 ? 'one comparison: offset only, rate assumed zero' : 'all comparisons at one clock reading: offset only, rate assumed zero');
  }
  const parameterCount = rateDetermined ? 2 : 1;
  const residualsS = corrections.map((y, i) => y - offsetS - rateSPerS * dt[i]);
  const redundancy = comparisons.length - parameterCount;
  const unitWeightError = redundancy > 0 ? Math.sqrt(residualsS.reduce((s, r, i) => s + weights[i] * r * r, 0) / redundancy) : null;
  const scale = apriori ? 1 : unitWeightError;
  if (scale === null) notes.push('no redundancy and no a priori sigmas: formal errors unknown');
  return {
    referenceClockS,
    offsetS,
    rateSPerS,
    rateDetermined,
    offsetSigmaS: scale === null ? null : scale / Math.sqrt(totalWeight),
    rateSigmaSPerS: scale === null || !rateDetermined ? null : scale / Math.sqrt(sxx),
    unitWeightError,
    residualsS,
    notes,
  };
}

/** Clock correction (s) at clock reading `clockReadingS`: add it to the reading to get UTC. */
export function clockCorrectionS(fit: ClockFit, clockReadingS: number): number {
  return fit.offsetS + fit.rateSPerS * (clockReadingS - fit.referenceClockS);
}

/**
 * Removes an observer's personal equation: `personalEquationS` is positive when the observer
 * records transits LATE (common practice in the sign), so the corrected time is earlier.
 * Returns the time unchanged when the observer has no stated personal equation (undefined).
 */
export function removePersonalEquationS(timeS: number, personalEquationS: number | undefined): number {
  return personalEquationS === undefined ? timeS : timeS - personalEquationS;
}
