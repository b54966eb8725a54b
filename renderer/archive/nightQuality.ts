import type { NightReductionResult } from '../../core/reduction/night-result.ts';

/**
 * The quality of one night as the nightly reduction (core/reduction, as `meridian-ledger night
 * --archive` runs it) found it: the unit-weight error relative to the stated a priori precision,
 * the transits used and rejected, or why the night could not be reduced.
 */
export interface NightQuality {
  readonly nightId: string;
  /** The change key the result was computed for (nightQualityKey.ts); a different key means stale. */
  readonly key: string;
  readonly reduced: boolean;
  /** Combined unit-weight error (dimensionless, 1 = as precise as stated): the worse of the two below; null when neither has redundancy. */
  readonly unitWeightError: number | null;
  /** Right ascension: nightly unit-weight error (s of time, weight 1) over the a priori σ of a mean wire. */
  readonly unitWeightErrorTime: number | null;
  /** Zenith distance: nightly unit-weight error (arcsec) over the a priori σ of a reading. */
  readonly unitWeightErrorZenith: number | null;
  /** Transits the fit used in right ascension (not rejected by the user nor by the outlier rule). */
  readonly transitsUsed: number;
  /** Transits the reduction rejected (outlier or gross blunder, in either coordinate). */
  readonly transitsRejected: number;
  readonly transitsUserRejected: number;
  /** Why the night could not be reduced, in words; null when reduced. */
  readonly failure: string | null;
}

/**
 * A priori precision the unit-weight error is measured against: one wire time (s) and one
 * zenith-distance reading (arcsec). The same defaults as the joint solve's model
 * (core/joint/joint-model.ts DEFAULT_JOINT_MODEL: 0.03 s, 0.3″).
 */
export interface AprioriPrecision {
  readonly wireSigmaS: number;
  readonly readingSigmaArcsec: number;
}

/**
 * Summarises one reduced night. The a priori σ of a transit's time is wireSigmaS/√n for n wires
 * (independent wire errors; n = the mean wire count of the used transits).
 */
export function qualityOfReduction(nightId: string, key: string, result: NightReductionResult, apriori: AprioriPrecision): NightQuality {
  const used = result.transits.filter((t) => !t.userRejected && !t.outlierTime);
  const meanWires = used.length === 0 ? 1 : used.reduce((s, t) => s + Math.max(t.wireCount, 1), 0) / used.length;
  const timeSigmaS = apriori.wireSigmaS / Math.sqrt(meanWires);
  const uweTime = result.unitWeightErrorTimeS === null ? null : result.unitWeightErrorTimeS / timeSigmaS;
  const uweZenith = result.unitWeightErrorZenithArcsec === null ? null : result.unitWeightErrorZenithArcsec / apriori.readingSigmaArcsec;
  const both = [uweTime, uweZenith].filter((v): v is number => v !== null && Number.isFinite(v));
  return {
    nightId, key, reduced: true,
    unitWeightError: both.length === 0 ? null : Math.max(...both),
    unitWeightErrorTime: uweTime, unitWeightErrorZenith: uweZenith,
    transitsUsed: used.length,
    transitsRejected: result.transits.filter((t) => !t.userRejected && (t.outlierTime || t.outlierZenith)).length,
    transitsUserRejected: result.transits.filter((t) => t.userRejected).length,
    failure: null,
  };
}

/** A night the reduction refused; `reason` says why (the reduction's own words). */
export function failedQuality(nightId: string, key: string, transitCount: number, reason: string): NightQuality {
  return {
    nightId, key, reduced: false, unitWeightError: null, unitWeightErrorTime: null, unitWeightErrorZenith: null,
    transitsUsed: 0, transitsRejected: 0, transitsUserRejected: 0, failure: reason || `the nightly reduction refused the night's ${transitCount} transits without a reason`,
  };
}
